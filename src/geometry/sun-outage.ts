/**
 * Sun outages: the parts of a contact during which the Sun is near the station's
 * boresight (the antenna tracking the spacecraft), so its noise floods the receiver.
 *
 * Criterion: the Sun's limb within SUN_OUTAGE_BEAMWIDTHS half-power beamwidths of
 * boresight, i.e. the offset of the Sun's centre below (solar radius + k theta3). At
 * k = 1, for a beam narrower than the Sun, the limb is where the disc noise of
 * link/body-noise.ts has fallen to about 1 % of the Sun's brightness
 * (0.5 erfc(sqrt(4 ln 2)) for a straight edge in a Gaussian beam): 60-90 K of the
 * ~11,000 K quiet Sun at X/K band, still about 1-2 dB on a cooled receiver. k is the
 * stated multiple.
 * Search (our own): a contact of up to 3 h whose Sun stays below the horizon, or above
 * the contact's highest elevation, by more than the limit is passed over at once;
 * otherwise f(t) = offset - limit is sampled every SUN_OUTAGE_SCAN_S inside the
 * contact; an interval whose Sun is further from the great-circle arc between its two
 * boresights than the limit plus a slack (15 % of the arc for the track's curvature,
 * plus the Sun's own 0.0042 deg/s in Earth-fixed axes) holds no outage; any other
 * interval is searched for its minimum (golden section to SUN_OUTAGE_TOLERANCE_S) and, when it dips below zero, its
 * edges are bisected to the same tolerance.
 * Units: ms, s, degrees.
 */
import type { SkyBodies, BodyAngles } from './sky-bodies.js';
import { newBodyAngles } from './sky-bodies.js';
import { lineDeviationKm, pieceFromSite } from './reach.js';
import { sgp4SmoothOver } from './targets/sgp4.js';
import type { Site, Target } from './types.js';

export const SUN_OUTAGE_BEAMWIDTHS = 1;
export const SUN_OUTAGE_SCAN_S = 30;
export const SUN_OUTAGE_TOLERANCE_S = 0.5;
/** Contacts up to this long are first checked against the Sun's elevation (see clearOf), s. */
export const SUN_OUTAGE_PREFILTER_MAX_S = 3 * 3600;
/** The Sun's apparent motion in Earth-fixed axes, deg/s (Earth rotation, 360 deg per day). */
const SUN_RATE_DEG_S = 360 / 86_400;
const GOLDEN = (Math.sqrt(5) - 1) / 2;
/** Half-length of the pieces of surelyClear, s. */
export const SUN_OUTAGE_SCREEN_HALF_S = 60;
/** Bound on the Sun's angular rate seen from a station in Earth-fixed axes, deg/s (sidereal rotation 0.004178 plus the annual motion). */
const SUN_RATE_BOUND_DEG_S = 0.0042;
/** Bound on the Sun's angular radius, deg (0.272 at perihelion). */
const SUN_RADIUS_BOUND_DEG = 0.3;
const RAD_TO_DEG = 180 / Math.PI;

export interface SunOutageWindow {
  startMs: number;
  endMs: number;
  /** Closest approach of the Sun's centre to boresight, deg, and when. */
  minOffsetDeg: number;
  minAtMs: number;
}

export class SunOutageSearch {
  private readonly state = new Float64Array(6);
  private readonly angles: BodyAngles = newBodyAngles();
  private readonly dir = new Float64Array(3);
  private readonly ends: number[] = [0, 0, 0, 0, 0, 0];
  /** The screen's tangent-line piece from a site (reach.ts pieceFromSite). */
  private readonly piece = new Float64Array(8);
  private readonly sunDir: number[] = [0, 0, 0];

  constructor(
    private readonly target: Target,
    private readonly sky: SkyBodies,
  ) {}

  /** offset - limit at tMs for site (deg; NaN without a state); the boresight direction kept in dir. */
  private f(site: Site, tMs: number, hpbwDeg: number): number {
    if (!this.target.stateEcefAt(tMs, this.state)) return Number.NaN;
    this.sky.at(tMs);
    const a = this.sky.angles(site, this.state, this.angles);
    const s = site.ecefKm;
    const dx = this.state[0]! - s[0];
    const dy = this.state[1]! - s[1];
    const dz = this.state[2]! - s[2];
    const n = Math.hypot(dx, dy, dz);
    this.dir[0] = dx / n;
    this.dir[1] = dy / n;
    this.dir[2] = dz / n;
    return a.sunOffsetDeg - (a.sunRadiusDeg + SUN_OUTAGE_BEAMWIDTHS * hpbwDeg);
  }

  /** The Sun's elevation at site at tMs, deg. */
  private sunElevationDeg(site: Site, tMs: number): number {
    this.sky.sunAt(tMs);
    const p = this.sky.sunEcefKm;
    const s = site.ecefKm;
    const u = site.up;
    const dx = p[0]! - s[0];
    const dy = p[1]! - s[1];
    const dz = p[2]! - s[2];
    return (Math.asin((u[0] * dx + u[1] * dy + u[2] * dz) / Math.hypot(dx, dy, dz)) * 180) / Math.PI;
  }

  /**
   * True when no outage is possible in a short contact: the boresight stays between the
   * horizon and the contact's maximum elevation, so a Sun lower (or higher) than that band
   * by more than the limit, all through the contact, cannot come near it.
   */
  private clearOf(site: Site, aosMs: number, losMs: number, hpbwDeg: number, maxElevationDeg: number): boolean {
    if (losMs - aosMs > SUN_OUTAGE_PREFILTER_MAX_S * 1000) return false;
    const limitDeg = 0.3 + SUN_OUTAGE_BEAMWIDTHS * hpbwDeg + (SUN_RATE_DEG_S * (losMs - aosMs)) / 2000;
    const e0 = this.sunElevationDeg(site, aosMs);
    const e1 = this.sunElevationDeg(site, 0.5 * (aosMs + losMs));
    const e2 = this.sunElevationDeg(site, losMs);
    const lo = Math.min(e0, e1, e2);
    const hi = Math.max(e0, e1, e2);
    return hi < -limitDeg || lo > maxElevationDeg + limitDeg;
  }

  /** Outages inside [aosMs, losMs] at site for a beam of hpbwDeg (maxElevationDeg: the contact's, for a quick rejection). */
  find(site: Site, aosMs: number, losMs: number, hpbwDeg: number, maxElevationDeg = 90): SunOutageWindow[] {
    const out: SunOutageWindow[] = [];
    if (!(hpbwDeg > 0) || !(losMs > aosMs)) return out;
    if (this.clearOf(site, aosMs, losMs, hpbwDeg, maxElevationDeg)) return out;
    if (this.surelyClear(site, aosMs, losMs, hpbwDeg)) return out;
    const stepMs = SUN_OUTAGE_SCAN_S * 1000;
    const n = Math.max(1, Math.ceil((losMs - aosMs) / stepMs));
    const times: number[] = [];
    const fs: number[] = [];
    /** Boresight and Sun unit vectors (from the site, ECEF) at each sample. */
    const dirs: number[] = [];
    const suns: number[] = [];
    const s = site.ecefKm;
    for (let k = 0; k <= n; k++) {
      const t = k === n ? losMs : aosMs + k * stepMs;
      const v = this.f(site, t, hpbwDeg);
      const p = this.sky.sunEcefKm;
      const sn = Math.hypot(p[0]! - s[0], p[1]! - s[1], p[2]! - s[2]);
      dirs.push(this.dir[0]!, this.dir[1]!, this.dir[2]!);
      suns.push((p[0]! - s[0]) / sn, (p[1]! - s[1]) / sn, (p[2]! - s[2]) / sn);
      times.push(t);
      fs.push(v);
    }
    let openAt = Number.NaN;
    let bestF = Infinity;
    let bestX = Number.NaN;
    const better = (f: number, x: number) => {
      if (f < bestF) {
        bestF = f;
        bestX = x;
      }
    };
    if (fs[0]! <= 0) {
      openAt = aosMs;
      better(fs[0]!, aosMs);
    }
    for (let k = 0; k < n; k++) {
      const a = times[k]!;
      const b = times[k + 1]!;
      const fa = fs[k]!;
      const fb = fs[k + 1]!;
      if (Number.isNaN(fa) || Number.isNaN(fb)) continue;
      // the Sun's least distance from the great-circle arc between the two boresights,
      // allowing for the track's curvature (ARC_SLACK of the arc) and the Sun's motion
      const arc = arcDistanceDeg(dirs, 3 * k, 3 * (k + 1), suns, 3 * k);
      const slack = ARC_SLACK * arc.arcDeg + (SUN_RATE_DEG_S * (b - a)) / 1000 + 0.01;
      const limitDeg = arc.toADeg - fa; // f = offset - limit, and offset(a) = the angle S..A
      let dipF = Infinity;
      let dipX = Number.NaN;
      if (arc.minDeg - limitDeg - slack <= 0) {
        const m = this.minimum(site, a, b, hpbwDeg);
        dipF = m.f;
        dipX = m.x;
      }
      if (Number.isNaN(openAt)) {
        if (fb <= 0) {
          openAt = this.edge(site, a, fa, b, hpbwDeg);
          bestF = Infinity;
          if (dipF <= 0) better(dipF, dipX);
          better(fb, b);
        } else if (dipF <= 0) {
          // in and out between two samples
          bestF = dipF;
          bestX = dipX;
          out.push(this.window(site, this.edge(site, a, fa, dipX, hpbwDeg), this.edge(site, dipX, dipF, b, hpbwDeg), bestX, hpbwDeg));
        }
      } else {
        if (dipF <= 0) better(dipF, dipX);
        if (fb > 0) {
          out.push(this.window(site, openAt, this.edge(site, a, fa, b, hpbwDeg), bestX, hpbwDeg));
          openAt = Number.NaN;
          bestF = Infinity;
        } else better(fb, b);
      }
    }
    if (!Number.isNaN(openAt)) out.push(this.window(site, openAt, losMs, bestX, hpbwDeg));
    return out;
  }

  /**
   * True when f > 0 all through [aosMs, losMs], proved from a few states (one per piece of up
   * to 2 SUN_OUTAGE_SCREEN_HALF_S): around its middle state the orbiter stays within
   * lineDeviationKm (reach.ts) of the straight line r + v (t - tm), so its direction from the
   * site stays within asin(deviation / least distance) of the great-circle arc that line's
   * piece sweeps; the Sun moves by at most SUN_RATE_BOUND_DEG_S. When the Sun stays further
   * from every arc than its radius bound plus the beam limit, every f the scan below would
   * evaluate is > 0 and it finds nothing: its answer, no outage, is given at once.
   * One-set SGP4 tracks only (reach.ts); false is no answer.
   */
  private surelyClear(site: Site, aosMs: number, losMs: number, hpbwDeg: number): boolean {
    if (this.target.failedAtMs !== undefined || !sgp4SmoothOver(this.target, aosMs, losMs)) return false;
    const limitDeg = SUN_RADIUS_BOUND_DEG + SUN_OUTAGE_BEAMWIDTHS * hpbwDeg + 0.01;
    const n = Math.max(1, Math.ceil((losMs - aosMs) / (2000 * SUN_OUTAGE_SCREEN_HALF_S)));
    const halfMs = (losMs - aosMs) / (2 * n);
    const tauS = halfMs / 1000;
    const st = this.state;
    const s = site.ecefKm;
    const e = this.ends;
    const u = this.sunDir;
    for (let j = 0; j < n; j++) {
      const tm = aosMs + (2 * j + 1) * halfMs;
      if (!this.target.stateEcefAt(tm, st)) return false;
      const devKm = lineDeviationKm(st, tauS);
      if (!(devKm >= 0)) return false;
      // the piece's line ends from the site, and its least distance from the site
      const pc = this.piece;
      const nearKm = pieceFromSite(site, st, tauS, pc);
      if (!(nearKm > devKm)) return false;
      e[0] = pc[0]! / pc[6]!;
      e[1] = pc[1]! / pc[6]!;
      e[2] = pc[2]! / pc[6]!;
      e[3] = pc[3]! / pc[7]!;
      e[4] = pc[4]! / pc[7]!;
      e[5] = pc[5]! / pc[7]!;
      this.sky.at(tm);
      const p = this.sky.sunEcefKm;
      const px = p[0]! - s[0];
      const py = p[1]! - s[1];
      const pz = p[2]! - s[2];
      const np = Math.sqrt(px * px + py * py + pz * pz);
      u[0] = px / np;
      u[1] = py / np;
      u[2] = pz / np;
      const arc = arcDistanceDeg(e, 0, 3, u, 0);
      const leastDeg = arc.minDeg - Math.asin(devKm / nearKm) * RAD_TO_DEG - SUN_RATE_BOUND_DEG_S * tauS - 1e-6;
      if (!(leastDeg > limitDeg)) return false;
    }
    return true;
  }

  private window(site: Site, startMs: number, endMs: number, minAtMs: number, hpbwDeg: number): SunOutageWindow {
    this.f(site, minAtMs, hpbwDeg);
    return { startMs, endMs, minOffsetDeg: this.angles.sunOffsetDeg, minAtMs };
  }

  /** Golden-section minimum of f on [a, b]. */
  private minimum(site: Site, a: number, b: number, hpbwDeg: number): { x: number; f: number } {
    const tol = SUN_OUTAGE_TOLERANCE_S * 1000;
    let lo = a;
    let hi = b;
    let x1 = hi - GOLDEN * (hi - lo);
    let x2 = lo + GOLDEN * (hi - lo);
    let f1 = this.f(site, x1, hpbwDeg);
    let f2 = this.f(site, x2, hpbwDeg);
    for (let it = 0; hi - lo > tol && it < 200; it++) {
      if (f1 < f2) {
        hi = x2;
        x2 = x1;
        f2 = f1;
        x1 = hi - GOLDEN * (hi - lo);
        f1 = this.f(site, x1, hpbwDeg);
      } else {
        lo = x1;
        x1 = x2;
        f1 = f2;
        x2 = lo + GOLDEN * (hi - lo);
        f2 = this.f(site, x2, hpbwDeg);
      }
    }
    return f1 < f2 ? { x: x1, f: f1 } : { x: x2, f: f2 };
  }

  /** Bisection of the sign change of f between a (value fa) and b: the time on the outage's side. */
  private edge(site: Site, a: number, fa: number, b: number, hpbwDeg: number): number {
    const tol = SUN_OUTAGE_TOLERANCE_S * 1000;
    let lo = a;
    let hi = b;
    const loInside = fa <= 0;
    for (let it = 0; hi - lo > tol && it < 200; it++) {
      const mid = 0.5 * (lo + hi);
      const inside = this.f(site, mid, hpbwDeg) <= 0;
      if (inside === loInside) lo = mid;
      else hi = mid;
    }
    return loInside ? lo : hi;
  }
}

/** Share of an arc the boresight's track may bow away from the great circle between its ends (generous: a pass is nearly one). */
const ARC_SLACK = 0.15;

/**
 * Least angle from the direction S to the great-circle arc A..B (unit vectors at offsets
 * in flat arrays), the arc's length and the angle S..A, deg. Allocation-free.
 */
function arcDistanceDeg(d: number[], ia: number, ib: number, sv: number[], is: number): { minDeg: number; arcDeg: number; toADeg: number } {
  const ax = d[ia]!, ay = d[ia + 1]!, az = d[ia + 2]!;
  const bx = d[ib]!, by = d[ib + 1]!, bz = d[ib + 2]!;
  const sx = sv[is]!, sy = sv[is + 1]!, sz = sv[is + 2]!;
  const ang = (ux: number, uy: number, uz: number, wx: number, wy: number, wz: number) =>
    (Math.atan2(Math.hypot(uy * wz - uz * wy, uz * wx - ux * wz, ux * wy - uy * wx), ux * wx + uy * wy + uz * wz) * 180) / Math.PI;
  const toA = ang(sx, sy, sz, ax, ay, az);
  const toB = ang(sx, sy, sz, bx, by, bz);
  const arcDeg = ang(ax, ay, az, bx, by, bz);
  out.minDeg = Math.min(toA, toB);
  out.arcDeg = arcDeg;
  out.toADeg = toA;
  let nx = ay * bz - az * by;
  let ny = az * bx - ax * bz;
  let nz = ax * by - ay * bx;
  const nn = Math.hypot(nx, ny, nz);
  if (nn < 1e-12) return out;
  nx /= nn;
  ny /= nn;
  nz /= nn;
  const sinD = sx * nx + sy * ny + sz * nz;
  const px = sx - sinD * nx;
  const py = sy - sinD * ny;
  const pz = sz - sinD * nz;
  // P between A and B along the arc: A x P and P x B both along n
  const c1 = (ay * pz - az * py) * nx + (az * px - ax * pz) * ny + (ax * py - ay * px) * nz;
  const c2 = (py * bz - pz * by) * nx + (pz * bx - px * bz) * ny + (px * by - py * bx) * nz;
  if (c1 >= 0 && c2 >= 0) out.minDeg = (Math.asin(Math.min(1, Math.abs(sinD))) * 180) / Math.PI;
  return out;
}
const out = { minDeg: 0, arcDeg: 0, toADeg: 0 };
