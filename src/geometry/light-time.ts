/**
 * Light time: targets whose state is known as a geocentric inertial trajectory are seen
 * as they were when the signal left them. The program's times are Earth-received times.
 *
 * Model: for a reception time t_r the transmit time t_t = t_r - tau solves
 *   c tau = |r(t_t)|            (r: geocentric position, EME2000 axes)
 * by fixed-point iteration from tau = |r(t_r)| / c (each step shrinks the error by
 * |v| / c ~ 1e-4: three evaluations leave < 1 mm at 1 AU). The position r(t_t) is then
 * rotated to Earth-fixed axes at t_r (precession-nutation EQJ -> EQD and GAST at t_r;
 * targets/ofDate.ts), the station being where it is at reception. Velocity: the exact
 * derivative of that position with respect to t_r,
 *   d r(t_t)/dt_r = v(t_t) (1 - dtau/dt_r),  dtau/dt_r = (u.v / c) / (1 + u.v / c),
 * plus the frame terms (dM/dt r and the Earth-rotation omega x r, frames.ts), so
 * range rates and Doppler include both ends' motion. Source: the Newtonian light-time
 * equation of D. A. Vallado, "Fundamentals of Astrodynamics and Applications", 4th ed.,
 * sec. 4.6 (light-time), and T. D. Moyer, "Formulation for Observed and Computed Values
 * of Deep Space Network Data Types", JPL DESCANSO Monograph 2 (2000), ch. 8 (one-way
 * light time, without the relativistic Shapiro delay: < 0.1 ms for ray paths away from
 * the Sun).
 * Limits: tau is geocentric; a station's own light time differs by up to R_E / c =
 * 21 ms, so the state is that of 21 ms earlier or later at most (|v| x 21 ms: < 0.7 km
 * at 30 km/s, nothing in the look angles; the range itself is exact geometry from the
 * station to that position). Aberration of the station's motion (~20 arcsec) is not
 * applied (the station points at the geometric, light-time corrected direction).
 * Units: km, km/s, s, epoch ms (UTC).
 */
import { SPEED_OF_LIGHT_M_S } from '../link/units.js';
import { gmstRadPrecise, inertialOfDateToEcef } from './frames.js';
import { moonSightMarginDeg } from './occultation.js';
import { MOON_MEAN_RADIUS_KM, type MoonEphemeris } from './targets/moon-ephemeris.js';
import { EqdTable, rotate3 } from './targets/ofDate.js';
import type { Target } from './types.js';

export const SPEED_OF_LIGHT_KM_S = SPEED_OF_LIGHT_M_S / 1000;
/** Light-time iterations (see the head comment). */
export const LIGHT_TIME_ITERATIONS = 3;

/** One-way light time of a range, s. */
export function lightTimeS(rangeKm: number): number {
  return rangeKm / SPEED_OF_LIGHT_KM_S;
}

/**
 * A Target defined by its geocentric EME2000 state. Subclasses give `geoEqjAt`; this
 * class solves light time and turns the result into the received ECEF state. After each
 * stateEcefAt it keeps the transmit time and the rotation used, so a subclass can place
 * other points (the Moon's centre, a site's local axes) in the same ECEF frame.
 */
export abstract class LightTimeTarget implements Target {
  abstract readonly spacecraftId: string;
  abstract readonly scanStepS: number;
  evaluations = 0;
  failedAtMs: number | undefined = undefined;
  failureReason: string | undefined = undefined;
  /** Transmit time and light time of the last state returned. */
  lastTransmitMs = Number.NaN;
  lastLightTimeS = Number.NaN;
  private readonly eqd: EqdTable;
  private readonly s = new Float64Array(6);
  protected readonly m = new Float64Array(9);
  protected readonly mDot = new Float64Array(9);
  protected siderealRad = 0;
  private readonly rEqd = new Float64Array(3);
  private readonly vEqd = new Float64Array(3);
  private readonly tmp = new Float64Array(3);
  private readonly pos = new Float64Array(3);
  private readonly zero = new Float64Array(3);
  private readonly scratch = new Float64Array(6);
  private readonly sEcef = new Float64Array(3);
  private readonly moonState = new Float64Array(6);
  private readonly moonEcef = new Float64Array(3);
  private moonAtMs = Number.NaN;
  /** The Moon that may hide the target (occultation.ts) and the grazing height, km. */
  private occulter: MoonEphemeris | undefined;
  private grazingMarginKm = 0;

  constructor(startMs: number, endMs: number) {
    this.eqd = new EqdTable(startMs, endMs);
  }

  /** Lets the Moon (as tabulated) cut the line of sight, with a grazing height in km. */
  protected occultedBy(moon: MoonEphemeris, grazingMarginKm: number): void {
    this.occulter = moon;
    this.grazingMarginKm = grazingMarginKm;
  }

  /** ECEF position of the Moon's centre at the last transmit time (km), computed once per state. */
  protected moonEcefNow(moon: MoonEphemeris): Float64Array {
    if (this.moonAtMs !== this.lastTransmitMs) {
      moon.stateAt(this.lastTransmitMs, this.moonState);
      this.eqjToEcef(this.moonState, this.moonEcef);
      this.moonAtMs = this.lastTransmitMs;
    }
    return this.moonEcef;
  }

  sightMarginDeg(stationEcefKm: ArrayLike<number>): number {
    const moon = this.occulter;
    if (moon === undefined) return Number.POSITIVE_INFINITY;
    return moonSightMarginDeg(stationEcefKm, this.sEcef, this.moonEcefNow(moon), MOON_MEAN_RADIUS_KM + this.grazingMarginKm);
  }

  /** Geocentric EME2000 state at tMs (km, km/s) into out[0..5]; false when none. */
  protected abstract geoEqjAt(tMs: number, out: Float64Array): boolean;

  stateEcefAt(tMs: number, out: Float64Array): boolean {
    this.evaluations++;
    const s = this.s;
    if (!this.geoEqjAt(tMs, s)) return this.fail(tMs);
    let tau = Math.hypot(s[0]!, s[1]!, s[2]!) / SPEED_OF_LIGHT_KM_S;
    for (let i = 1; i < LIGHT_TIME_ITERATIONS; i++) {
      if (!this.geoEqjAt(tMs - tau * 1000, s)) return this.fail(tMs);
      tau = Math.hypot(s[0]!, s[1]!, s[2]!) / SPEED_OF_LIGHT_KM_S;
    }
    const tTransmit = tMs - tau * 1000;
    if (!this.geoEqjAt(tTransmit, s)) return this.fail(tMs);
    this.lastTransmitMs = tTransmit;
    this.lastLightTimeS = tau;
    const r = Math.hypot(s[0]!, s[1]!, s[2]!);
    const uv = (s[0]! * s[3]! + s[1]! * s[4]! + s[2]! * s[5]!) / r / SPEED_OF_LIGHT_KM_S;
    const scale = 1 - uv / (1 + uv);
    this.siderealRad = gmstRadPrecise(tMs) + this.eqd.at(tMs, this.m, this.mDot);
    rotate3(this.m, s, this.rEqd);
    this.tmp[0] = s[3]! * scale;
    this.tmp[1] = s[4]! * scale;
    this.tmp[2] = s[5]! * scale;
    rotate3(this.m, this.tmp, this.vEqd);
    rotate3(this.mDot, s, this.tmp);
    for (let i = 0; i < 3; i++) this.vEqd[i] = this.vEqd[i]! + this.tmp[i]!;
    inertialOfDateToEcef(this.rEqd, this.vEqd, this.siderealRad, out);
    this.sEcef[0] = out[0]!;
    this.sEcef[1] = out[1]!;
    this.sEcef[2] = out[2]!;
    return true;
  }

  /** A geocentric EME2000 position (v[vo..vo+2]) into ECEF at the last reception time, out[o..o+2]. */
  protected eqjToEcef(v: ArrayLike<number>, out: Float64Array, o = 0, vo = 0): void {
    const m = this.m;
    const x = v[vo]!;
    const y = v[vo + 1]!;
    const z = v[vo + 2]!;
    this.pos[0] = m[0]! * x + m[1]! * y + m[2]! * z;
    this.pos[1] = m[3]! * x + m[4]! * y + m[5]! * z;
    this.pos[2] = m[6]! * x + m[7]! * y + m[8]! * z;
    inertialOfDateToEcef(this.pos, this.zero, this.siderealRad, this.scratch);
    out[o] = this.scratch[0]!;
    out[o + 1] = this.scratch[1]!;
    out[o + 2] = this.scratch[2]!;
  }

  private fail(tMs: number): false {
    if (this.failedAtMs === undefined || tMs < this.failedAtMs) this.failedAtMs = tMs;
    return false;
  }
}
