/**
 * Antenna mechanics: the tracking time a mount loses on a pass, and the slew
 * time between two pointings.
 *
 * Model (an engineering model stated here in full; geometry of the mounts
 * from common practice, e.g. the El/Az zenith keyhole and the X/Y horizon
 * keyholes as described in most ground-station texts; from memory):
 *  - Each axis is a causal follower with a rate limit r: while the pointing
 *    error e = command - position is zero and the command moves at most r,
 *    the axis tracks; otherwise it moves at r toward the command. The axis is
 *    off track while |e| > trackingToleranceDeg. The command is the sampled
 *    look angle, linear between samples; within a segment e is piecewise
 *    linear, so the off-track times are found exactly (no stepping).
 *  - El/Az: axis 1 is the azimuth (unwrapped, placed in the cable-wrap range
 *    at the turn k * 360 that keeps it in range longest), axis 2 the
 *    elevation. Time outside the cable wrap or outside [elevationMinDeg,
 *    elevationMaxDeg] is lost. The zenith keyhole is the azimuth rate near
 *    the zenith (cot(elevation) grows without bound).
 *  - X/Y: X = atan2(cos el sin az, sin el), Y = asin(cos el cos az) (X about
 *    the north-south axis, Y about the tilted east-west axis); time with
 *    |X| or |Y| above xyLimitDeg is lost, and the rate limits act on X and Y
 *    (their keyholes lie at the east and west horizon).
 *  - Slew: each axis moves the angle d with a trapezoidal speed profile
 *    (rate r, acceleration a): t = 2 sqrt(d / a) when d <= r^2 / a, else
 *    d / r + r / a; the slew takes the slower axis's time. El/Az azimuth
 *    moves the shorter way round (at most 180 deg). Tracking uses the rate
 *    limits only; acceleration enters the slews.
 *
 * Pure functions, degrees and milliseconds.
 */
import type { AntennaMechanics, Pointing } from './types.js';

const D2R = Math.PI / 180;
const R2D = 180 / Math.PI;

/** Intervals [startMs, endMs] flattened in pairs, sorted and disjoint. */
export type Intervals = number[];

/** Continuous version of an angle series (no jumps of more than 180 deg). */
export function unwrapDeg(values: ArrayLike<number>): Float64Array {
  const out = new Float64Array(values.length);
  let off = 0;
  for (let i = 0; i < values.length; i++) {
    if (i > 0) {
      const d = values[i]! + off - out[i - 1]!;
      if (d > 180) off -= 360 * Math.round(d / 360);
      else if (d < -180) off += 360 * Math.round(-d / 360);
    }
    out[i] = values[i]! + off;
  }
  return out;
}

/** X/Y mount angles of a look direction, deg. */
export function toXY(azimuthDeg: number, elevationDeg: number): { xDeg: number; yDeg: number } {
  const az = azimuthDeg * D2R;
  const el = elevationDeg * D2R;
  return {
    xDeg: Math.atan2(Math.cos(el) * Math.sin(az), Math.sin(el)) * R2D,
    yDeg: Math.asin(Math.max(-1, Math.min(1, Math.cos(el) * Math.cos(az)))) * R2D,
  };
}

/**
 * Off-track intervals of a rate-limited causal follower of the piecewise
 * linear command (tMs[i], cmdDeg[i]); the axis starts on the command.
 */
export function followerLost(tMs: ArrayLike<number>, cmdDeg: ArrayLike<number>, rateDegS: number, toleranceDeg: number): Intervals {
  const out: Intervals = [];
  const n = tMs.length;
  if (n < 2 || !(rateDegS > 0)) return out;
  let e = 0;
  let lostFrom: number | null = null; // ms where the current off-track interval began
  const mark = (t: number, off: boolean) => {
    if (off && lostFrom === null) lostFrom = t;
    else if (!off && lostFrom !== null) {
      if (t > lostFrom) out.push(lostFrom, t);
      lostFrom = null;
    }
  };
  for (let i = 0; i + 1 < n; i++) {
    const t0 = tMs[i]!;
    const dtS = (tMs[i + 1]! - t0) / 1000;
    if (!(dtS > 0)) continue;
    const v = (cmdDeg[i + 1]! - cmdDeg[i]!) / dtS;
    let tau = 0;
    while (tau < dtS) {
      const rem = dtS - tau;
      if (e === 0 && Math.abs(v) <= rateDegS) break; // tracking to the segment end
      const s = e !== 0 ? Math.sign(e) : Math.sign(v);
      const de = v - rateDegS * s; // de/dt of e
      let piece = rem;
      let eEnd = e + de * rem;
      let hitsZero = false;
      if (de !== 0 && Math.sign(de) !== s && Math.abs(e) / Math.abs(de) < rem) {
        piece = Math.abs(e) / Math.abs(de);
        eEnd = 0;
        hitsZero = true;
      }
      // |e| is linear over the piece: find where it crosses the tolerance
      const a = Math.abs(e);
      const b = Math.abs(eEnd);
      const tA = t0 + tau * 1000;
      if ((a > toleranceDeg) !== (b > toleranceDeg)) {
        const f = (toleranceDeg - a) / (b - a);
        mark(tA, a > toleranceDeg);
        mark(tA + f * piece * 1000, b > toleranceDeg);
      } else mark(tA, a > toleranceDeg);
      e = hitsZero ? 0 : eEnd;
      tau += piece;
    }
  }
  mark(tMs[n - 1]!, Math.abs(e) > toleranceDeg);
  if (lostFrom !== null && tMs[n - 1]! > lostFrom) out.push(lostFrom, tMs[n - 1]!);
  return out;
}

/** Intervals where the linear interpolant of v is outside [lo, hi]. */
export function outsideRange(tMs: ArrayLike<number>, v: ArrayLike<number>, lo: number, hi: number): Intervals {
  const out: Intervals = [];
  const n = tMs.length;
  const outside = (x: number) => x < lo || x > hi;
  let from: number | null = n > 0 && outside(v[0]!) ? tMs[0]! : null;
  for (let i = 0; i + 1 < n; i++) {
    const a = v[i]!;
    const b = v[i + 1]!;
    const ta = tMs[i]!;
    const tb = tMs[i + 1]!;
    // crossings of lo and hi inside the segment, in time order
    const cross: { t: number; out: boolean }[] = [];
    for (const edge of [lo, hi]) {
      if ((a - edge) * (b - edge) < 0) {
        const t = ta + ((edge - a) / (b - a)) * (tb - ta);
        const after = edge === lo ? b < lo : b > hi;
        cross.push({ t, out: after });
      }
    }
    cross.sort((x, y) => x.t - y.t);
    for (const c of cross) {
      if (c.out && from === null) from = c.t;
      else if (!c.out && from !== null) {
        if (c.t > from) out.push(from, c.t);
        from = null;
      }
    }
  }
  if (from !== null && n > 0 && tMs[n - 1]! > from) out.push(from, tMs[n - 1]!);
  return out;
}

/** Union of interval lists. */
export function unionIntervals(...lists: Intervals[]): Intervals {
  const all: [number, number][] = [];
  for (const l of lists) for (let i = 0; i + 1 < l.length; i += 2) all.push([l[i]!, l[i + 1]!]);
  all.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const out: Intervals = [];
  for (const [s, e] of all) {
    const n = out.length;
    if (n > 0 && s <= out[n - 1]!) out[n - 1] = Math.max(out[n - 1]!, e);
    else out.push(s, e);
  }
  return out;
}

/** Length of the intersection of intervals with [a, b], ms. */
export function overlapMs(iv: Intervals, a: number, b: number): number {
  let s = 0;
  for (let i = 0; i + 1 < iv.length; i += 2) s += Math.max(0, Math.min(b, iv[i + 1]!) - Math.max(a, iv[i]!));
  return s;
}

/** The cable-wrap turn k (azimuth + k * 360) that keeps the unwrapped track in range longest (ties: smallest |k|). */
function bestWrap(tMs: ArrayLike<number>, azU: Float64Array, wrap: [number, number]): { shifted: Float64Array; outside: Intervals } {
  let best: { shifted: Float64Array; outside: Intervals; lostMs: number; k: number } | undefined;
  for (const k of [0, -1, 1, -2, 2]) {
    const shifted = azU.map((a) => a + 360 * k);
    const outside = outsideRange(tMs, shifted, wrap[0], wrap[1]);
    const lostMs = overlapMs(outside, -Infinity, Infinity);
    if (!best || lostMs < best.lostMs) best = { shifted, outside, lostMs, k };
  }
  return best!;
}

/**
 * Tracking time the mount loses over a sampled pass (look angles at tMs):
 * the union of the off-track intervals of both axes and the times outside
 * the elevation, cable-wrap or X/Y limits.
 */
export function lostTracking(tMs: ArrayLike<number>, azDeg: ArrayLike<number>, elDeg: ArrayLike<number>, m: AntennaMechanics): Intervals {
  const tol = m.trackingToleranceDeg;
  const elOut = outsideRange(tMs, elDeg, m.elevationMinDeg, m.elevationMaxDeg);
  if (m.mount === 'el-az') {
    const { shifted, outside } = bestWrap(tMs, unwrapDeg(azDeg), m.cableWrapDeg);
    return unionIntervals(followerLost(tMs, shifted, m.axis1RateDegS, tol), followerLost(tMs, elDeg, m.axis2RateDegS, tol), elOut, outside);
  }
  const n = tMs.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = toXY(azDeg[i]!, elDeg[i]!);
    x[i] = p.xDeg;
    y[i] = p.yDeg;
  }
  const L = m.xyLimitDeg;
  return unionIntervals(
    followerLost(tMs, x, m.axis1RateDegS, tol),
    followerLost(tMs, y, m.axis2RateDegS, tol),
    outsideRange(tMs, x, -L, L),
    outsideRange(tMs, y, -L, L),
    elOut,
  );
}

/** Time to move one axis by dDeg from rest to rest (trapezoidal speed profile), s. */
export function axisMoveS(dDeg: number, rateDegS: number, accelDegS2: number): number {
  const d = Math.abs(dDeg);
  if (d === 0) return 0;
  if (!(accelDegS2 > 0) || !Number.isFinite(accelDegS2)) return d / rateDegS;
  if (d <= (rateDegS * rateDegS) / accelDegS2) return 2 * Math.sqrt(d / accelDegS2);
  return d / rateDegS + rateDegS / accelDegS2;
}

/** Slew time between two pointings, s (the slower axis; see the head comment). */
export function slewTimeS(from: Pointing, to: Pointing, m: AntennaMechanics): number {
  let d1: number;
  let d2: number;
  if (m.mount === 'el-az') {
    const da = Math.abs((((to.azimuthDeg - from.azimuthDeg) % 360) + 540) % 360 - 180);
    d1 = da;
    d2 = to.elevationDeg - from.elevationDeg;
  } else {
    const a = toXY(from.azimuthDeg, from.elevationDeg);
    const b = toXY(to.azimuthDeg, to.elevationDeg);
    d1 = b.xDeg - a.xDeg;
    d2 = b.yDeg - a.yDeg;
  }
  return Math.max(axisMoveS(d1, m.axis1RateDegS, m.axis1AccelDegS2), axisMoveS(d2, m.axis2RateDegS, m.axis2AccelDegS2));
}
