// Antenna mechanics (src/plan/booking/mechanics.ts, pointing.ts) on a pass
// over a flat Earth: a straight track at 500 km height and 7 km/s, passing
// d km east of the station (look angles in closed form: az = atan2(d, x),
// el = atan2(h, sqrt(x^2 + d^2)), x = v t). Authority: brute-force simulation
// of each rate-limited axis at 0.1 s (position += clamp(command - position,
// +-rate x 0.1 s); off track while |error| > tolerance), on commands computed
// in closed form at every 0.1 s step. The production path samples the pass
// (pointing.ts: 30 s, 1 s where the axes move fast) and solves the follower
// exactly between samples; the two must agree to 1 s.
import { describe, expect, it } from 'vitest';
import { axisMoveS, lostTracking, overlapMs, toXY } from '../../../src/plan/booking/mechanics.js';
import { samplePointing } from '../../../src/plan/booking/pointing.js';
import type { AntennaMechanics } from '../../../src/plan/booking/types.js';
import type { Site, Target } from '../../../src/geometry/types.js';

const H = 500;
const V = 7;
const R2D = 180 / Math.PI;

function look(tS: number, d: number): { az: number; el: number } {
  const x = V * tS;
  const az = (Math.atan2(d, x) * R2D + 360) % 360;
  return { az, el: Math.atan2(H, Math.hypot(x, d)) * R2D };
}

// a site at the origin with east = x, north = y, up = z, and a target on the straight track
const site = { stationId: 'S', ecefKm: [0, 0, 0], east: [1, 0, 0], north: [0, 1, 0], up: [0, 0, 1] } as unknown as Site;
const target = (d: number): Target => ({
  spacecraftId: 'T',
  scanStepS: 10,
  evaluations: 0,
  failedAtMs: undefined,
  failureReason: undefined,
  stateEcefAt(tMs: number, out: Float64Array) {
    out[0] = d;
    out[1] = V * (tMs / 1000);
    out[2] = H;
    out[3] = 0;
    out[4] = V;
    out[5] = 0;
    return true;
  },
});

/** Lost seconds of rate-limited axes following commands at 0.1 s. */
function bruteLostS(d: number, axes: (tS: number) => number[], rates: number[], tol: number, t0: number, t1: number): number {
  const dt = 0.1;
  const unwrap = (prev: number, v: number) => v + 360 * Math.round((prev - v) / 360);
  let cmd = axes(t0);
  const pos = [...cmd];
  let lost = 0;
  for (let k = 1; t0 + k * dt <= t1 + 1e-9; k++) {
    const next = axes(t0 + k * dt).map((v, i) => unwrap(cmd[i]!, v));
    let off = false;
    next.forEach((c, i) => {
      const step = rates[i]! * dt;
      pos[i]! += Math.max(-step, Math.min(step, c - pos[i]!));
      if (Math.abs(c - pos[i]!) > tol) off = true;
    });
    if (off) lost += dt;
    cmd = next;
  }
  return lost;
}

const elAz: AntennaMechanics = { mount: 'el-az', axis1RateDegS: 3, axis2RateDegS: 3, axis1AccelDegS2: 1, axis2AccelDegS2: 1, elevationMinDeg: 0, elevationMaxDeg: 90, cableWrapDeg: [-270, 270], xyLimitDeg: 90, trackingToleranceDeg: 0.1 };
const xy: AntennaMechanics = { ...elAz, mount: 'x-y', xyLimitDeg: 89 };

function producedLostS(d: number, m: AntennaMechanics, t0: number, t1: number): number {
  const s = samplePointing(target(d), site, t0 * 1000, t1 * 1000, m);
  return overlapMs(lostTracking(s.tMs, s.azimuthDeg, s.elevationDeg, m), -Infinity, Infinity) / 1000;
}

describe('El/Az zenith keyhole', () => {
  it('a pass 2 km from the zenith loses what a 3 deg/s azimuth axis loses in a 0.1 s simulation', () => {
    const brute = bruteLostS(2, (t) => [look(t, 2).az, look(t, 2).el], [3, 3], 0.1, -300, 300);
    const got = producedLostS(2, elAz, -300, 300);
    expect(brute).toBeGreaterThan(50); // ~180 deg of azimuth at 3 deg/s: about a minute
    expect(Math.abs(got - brute), `brute ${brute} got ${got}`).toBeLessThanOrEqual(1);
  });
  it('a pass below the rate limit (max elevation 40 deg) loses nothing', () => {
    expect(bruteLostS(600, (t) => [look(t, 600).az, look(t, 600).el], [3, 3], 0.1, -300, 300)).toBe(0);
    expect(producedLostS(600, elAz, -300, 300)).toBe(0);
  });
  it('an X/Y mount has no zenith keyhole: the same zenith pass loses nothing', () => {
    const axes = (t: number) => {
      const p = look(t, 2);
      const q = toXY(p.az, p.el);
      return [q.xDeg, q.yDeg];
    };
    // stay above 5 deg elevation (|Y| < 85): the X/Y keyholes are at the horizon
    const tEdge = Math.sqrt((H / Math.tan((5 * Math.PI) / 180)) ** 2 - 4) / V;
    expect(bruteLostS(2, axes, [3, 3], 0.1, -tEdge, tEdge)).toBe(0);
    expect(producedLostS(2, xy, -tEdge, tEdge)).toBe(0);
  });
});

describe('slew time', () => {
  // trapezoidal profile from rest to rest: accelerate at a to r, cruise, brake (common practice)
  it('matches a 1 ms simulation of the bang-coast-bang profile', () => {
    for (const [dDeg, r, a] of [[180, 3, 1], [5, 3, 1], [90, 2, 0.5]] as const) {
      const dt = 0.001;
      let x = 0;
      let v = 0;
      let t = 0;
      while (x < dDeg - 1e-9) {
        const brake = (v * v) / (2 * a) >= dDeg - x;
        v = brake ? Math.max(0, v - a * dt) : Math.min(r, v + a * dt);
        if (v === 0 && brake) break;
        x += v * dt;
        t += dt;
      }
      expect(Math.abs(t - axisMoveS(dDeg, r, a))).toBeLessThan(0.05);
    }
  });
});
