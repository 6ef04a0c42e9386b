/**
 * Sun outages: the parts of a contact during which the Sun is near the station's
 * boresight (the antenna tracking the spacecraft), so its noise floods the receiver.
 *
 * Criterion: the Sun's limb within SUN_OUTAGE_BEAMWIDTHS half-power beamwidths of
 * boresight, i.e. the offset of the Sun's centre below (solar radius + k theta3). At
 * k = 1 that is where the disc noise of link/body-noise.ts is above ~6 % of its
 * peak for a beam narrower than the Sun (common practice for outage prediction
 * counts from about the same point).
 * Search (our own): f(t) = offset - limit sampled every SUN_OUTAGE_SCAN_S inside the
 * contact; an interval whose two samples are further from the limit than the largest
 * change the offset can make in it (the boresight's measured angular rate over the
 * neighbouring intervals, x 1.5, plus the Sun's own 0.0042 deg/s in Earth-fixed axes,
 * times half the interval) holds no outage; any other interval is searched for its
 * minimum (golden section to SUN_OUTAGE_TOLERANCE_S) and, when it dips below zero, its
 * edges are bisected to the same tolerance.
 * Units: ms, s, degrees.
 */
import type { SkyBodies, BodyAngles } from './sky-bodies.js';
import { newBodyAngles } from './sky-bodies.js';
import type { Site, Target } from './types.js';

export const SUN_OUTAGE_BEAMWIDTHS = 1;
export const SUN_OUTAGE_SCAN_S = 30;
export const SUN_OUTAGE_TOLERANCE_S = 0.5;
/** The Sun's apparent motion in Earth-fixed axes, deg/s (Earth rotation, 360 deg per day). */
const SUN_RATE_DEG_S = 360 / 86_400;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

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

  /** Outages inside [aosMs, losMs] at site for a beam of hpbwDeg. */
  find(site: Site, aosMs: number, losMs: number, hpbwDeg: number): SunOutageWindow[] {
    const out: SunOutageWindow[] = [];
    if (!(hpbwDeg > 0) || !(losMs > aosMs)) return out;
    const stepMs = SUN_OUTAGE_SCAN_S * 1000;
    const n = Math.max(1, Math.ceil((losMs - aosMs) / stepMs));
    const times: number[] = [];
    const fs: number[] = [];
    const rates: number[] = [];
    let px = 0;
    let py = 0;
    let pz = 0;
    for (let k = 0; k <= n; k++) {
      const t = k === n ? losMs : aosMs + k * stepMs;
      const v = this.f(site, t, hpbwDeg);
      if (k > 0) {
        const dot = px * this.dir[0]! + py * this.dir[1]! + pz * this.dir[2]!;
        rates.push((Math.acos(Math.max(-1, Math.min(1, dot))) * 180) / Math.PI / ((t - times[k - 1]!) / 1000));
      }
      px = this.dir[0]!;
      py = this.dir[1]!;
      pz = this.dir[2]!;
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
      const rate = 1.5 * Math.max(rates[k]!, rates[k - 1] ?? 0, rates[k + 1] ?? 0) + SUN_RATE_DEG_S;
      const slack = (rate * (b - a)) / 2000;
      let dipF = Infinity;
      let dipX = Number.NaN;
      if (Math.min(fa, fb) - slack <= 0) {
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
