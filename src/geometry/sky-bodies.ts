/**
 * The Sun and the Moon as seen from a station, for the noise they add in the beam
 * (link/body-noise.ts), Sun outages (sun-outage.ts) and the Sun-Earth-probe angle.
 *
 * Model: geocentric positions tabulated once per run over its span and turned to
 * Earth-fixed axes per call (precession-nutation table and GAST, targets/ofDate.ts):
 * - Sun: astronomy-engine 2.1.19 `GeoVector(Body.Sun, t, true)` (VSOP87 Earth, with
 *   aberration: the apparent Sun, ~1 arcsec) every SKY_SUN_STEP_S, linear between nodes:
 *   the chord's sag (|r''| h^2 / 8 = 10 km at 1 h over 1 AU) is 1e-5 deg;
 * - Moon: the tabulated lunar theory of targets/moon-ephemeris.ts (cubic Hermite, < 1 m).
 * Topocentric: directions from the station's ECEF position (parallax included: ~1 deg
 * for the Moon). Angular radii: 696,000 km (IAU 2015 Resolution B3 nominal solar radius)
 * and 1,737.4 km (mean lunar radius) over the topocentric distance.
 * Units: km, degrees, UTC epoch ms.
 */
import { Body, GeoVector, KM_PER_AU } from 'astronomy-engine';
import type { Span } from '../scenario/types.js';
import { gmstRadPrecise, inertialOfDateToEcef } from './frames.js';
import { MOON_MEAN_RADIUS_KM, MoonEphemeris } from './targets/moon-ephemeris.js';
import { EqdTable, astroDays, rotate3 } from './targets/ofDate.js';
import type { Site } from './types.js';

export const SKY_SUN_STEP_S = 3600;
/** Nominal solar radius, km (IAU 2015 Resolution B3). */
export const SUN_RADIUS_KM = 696_000;
const RAD_TO_DEG = 180 / Math.PI;
const PAD_MS = 86_400_000;

/** Angles of the Sun and the Moon against a boresight, deg. */
export interface BodyAngles {
  sunOffsetDeg: number;
  sunRadiusDeg: number;
  moonOffsetDeg: number;
  moonRadiusDeg: number;
}

export function newBodyAngles(): BodyAngles {
  return { sunOffsetDeg: 180, sunRadiusDeg: 0, moonOffsetDeg: 180, moonRadiusDeg: 0 };
}

export class SkyBodies {
  private readonly t0Ms: number;
  private readonly n: number;
  private readonly sun: Float64Array;
  private readonly moon: MoonEphemeris;
  private readonly eqd: EqdTable;
  private readonly m = new Float64Array(9);
  private readonly mDot = new Float64Array(9);
  private readonly eqj = new Float64Array(6);
  private readonly v = new Float64Array(3);
  private readonly zero = new Float64Array(3);
  private readonly out6 = new Float64Array(6);
  /** ECEF positions at `atMs`, km. */
  readonly sunEcefKm = new Float64Array(3);
  readonly moonEcefKm = new Float64Array(3);
  /** Geocentric unit vectors towards them at `atMs` (ECEF), for farFromBoth. */
  private readonly sunU = new Float64Array(3);
  private readonly moonU = new Float64Array(3);
  private unitsAtMs = Number.NaN;
  /** atGrid's grid and the positions kept for it. */
  private gridOriginMs = Number.NaN;
  private gridStepMs = Number.NaN;
  private gridPos: Float64Array | undefined;
  private gridSet: Uint8Array | undefined;
  private atMs = Number.NaN;
  /** The time sunAt last moved the Sun alone to (NaN once at or atGrid moved both). */
  private sunOnlyMs = Number.NaN;

  constructor(span: Span) {
    const stepMs = SKY_SUN_STEP_S * 1000;
    this.t0Ms = span.startMs - PAD_MS;
    this.n = Math.ceil((span.endMs + PAD_MS - this.t0Ms) / stepMs) + 1;
    this.sun = new Float64Array(3 * this.n);
    for (let k = 0; k < this.n; k++) {
      const g = GeoVector(Body.Sun, astroDays(this.t0Ms + k * stepMs), true);
      this.sun[3 * k] = g.x * KM_PER_AU;
      this.sun[3 * k + 1] = g.y * KM_PER_AU;
      this.sun[3 * k + 2] = g.z * KM_PER_AU;
    }
    this.moon = new MoonEphemeris(span.startMs, span.endMs);
    this.eqd = new EqdTable(span.startMs - PAD_MS / 2, span.endMs + PAD_MS / 2);
  }

  /**
   * at(tMs) for a time of a grid, tMs = originMs + k stepMs: the positions at() computed the
   * first time any caller asked for grid point k are kept and copied back (the link sampler's
   * grid is the same for every spacecraft of a run). The same numbers as at(tMs).
   */
  atGrid(originMs: number, stepMs: number, k: number, tMs: number): void {
    if (tMs === this.atMs) return;
    if (originMs !== this.gridOriginMs || stepMs !== this.gridStepMs) {
      this.gridOriginMs = originMs;
      this.gridStepMs = stepMs;
      const n = Math.max(0, Math.ceil((this.t0Ms + this.n * SKY_SUN_STEP_S * 1000 - originMs) / stepMs) + 1);
      this.gridPos = new Float64Array(6 * n);
      this.gridSet = new Uint8Array(n);
    }
    const set = this.gridSet!;
    if (!(k >= 0 && k < set.length) || tMs !== originMs + k * stepMs) {
      this.at(tMs);
      return;
    }
    const g = this.gridPos!;
    const o = 6 * k;
    if (set[k] === 1) {
      this.atMs = tMs;
      this.sunOnlyMs = Number.NaN;
      for (let i = 0; i < 3; i++) {
        this.sunEcefKm[i] = g[o + i]!;
        this.moonEcefKm[i] = g[o + 3 + i]!;
      }
      return;
    }
    this.at(tMs);
    for (let i = 0; i < 3; i++) {
      g[o + i] = this.sunEcefKm[i]!;
      g[o + 3 + i] = this.moonEcefKm[i]!;
    }
    set[k] = 1;
  }

  /** Moves both bodies to tMs (cheap when tMs has not changed). */
  at(tMs: number): void {
    if (tMs === this.atMs) return;
    this.atMs = tMs;
    this.sunOnlyMs = Number.NaN;
    const sidereal = this.sunTo(tMs);
    this.moon.stateAt(tMs, this.eqj);
    this.toEcef(sidereal, this.moonEcefKm);
  }

  /**
   * Moves the Sun alone to tMs (sunEcefKm: the numbers at(tMs) gives it); the Moon's
   * position is left stale, so moonEcefKm, angles and farFromBoth need at() first.
   */
  sunAt(tMs: number): void {
    if (tMs === this.atMs || tMs === this.sunOnlyMs) return;
    this.atMs = Number.NaN;
    this.sunOnlyMs = tMs;
    this.sunTo(tMs);
  }

  /** The Sun's ECEF position at tMs into sunEcefKm; returns the sidereal angle used (rad). */
  private sunTo(tMs: number): number {
    const sidereal = gmstRadPrecise(tMs) + this.eqd.at(tMs, this.m, this.mDot);
    const x = (tMs - this.t0Ms) / (SKY_SUN_STEP_S * 1000);
    const k = Math.min(this.n - 2, Math.max(0, Math.floor(x)));
    const s = x - k;
    for (let i = 0; i < 3; i++) this.eqj[i] = this.sun[3 * k + i]! + s * (this.sun[3 * k + 3 + i]! - this.sun[3 * k + i]!);
    this.toEcef(sidereal, this.sunEcefKm);
    return sidereal;
  }

  /**
   * True when, at the time last given to `at`, the boresight (bx, by, bz) (site -> target,
   * ECEF km, length rangeKm) is surely more than `sunDeg` from the Sun's centre and more
   * than `moonDeg` from the Moon's, as seen from a site on or near the Earth (|site| < 7,000 km):
   * cosines against the geocentric directions with the parallax as margin
   * (asin(7,000 km / 1.47e8 km) < 0.003 deg for the Sun, asin(7,000 km / 356,000 km) < 1.13 deg
   * for the Moon at perigee), plus 0.01 deg for rounding. A cheap test; false is no answer.
   */
  farFromBoth(bx: number, by: number, bz: number, rangeKm: number, cosSunLimit: number, cosMoonLimit: number): boolean {
    if (this.unitsAtMs !== this.atMs) {
      this.unitsAtMs = this.atMs;
      unit(this.sunEcefKm, this.sunU);
      unit(this.moonEcefKm, this.moonU);
    }
    const u = this.sunU;
    if ((bx * u[0]! + by * u[1]! + bz * u[2]!) / rangeKm >= cosSunLimit) return false;
    const m = this.moonU;
    return (bx * m[0]! + by * m[1]! + bz * m[2]!) / rangeKm < cosMoonLimit;
  }

  private toEcef(sidereal: number, out: Float64Array): void {
    rotate3(this.m, this.eqj, this.v);
    inertialOfDateToEcef(this.v, this.zero, sidereal, this.out6);
    out[0] = this.out6[0]!;
    out[1] = this.out6[1]!;
    out[2] = this.out6[2]!;
  }

  /**
   * Offsets of the Sun and the Moon from the boresight site -> target (ECEF km) and their
   * angular radii, at the time last given to `at`, into out.
   */
  angles(site: Site, targetEcefKm: ArrayLike<number>, out: BodyAngles): BodyAngles {
    const s = site.ecefKm;
    const bx = targetEcefKm[0]! - s[0];
    const by = targetEcefKm[1]! - s[1];
    const bz = targetEcefKm[2]! - s[2];
    out.sunOffsetDeg = offsetDeg(bx, by, bz, this.sunEcefKm, s);
    out.sunRadiusDeg = Math.asin(Math.min(1, SUN_RADIUS_KM / distanceKm(this.sunEcefKm, s))) * RAD_TO_DEG;
    out.moonOffsetDeg = offsetDeg(bx, by, bz, this.moonEcefKm, s);
    out.moonRadiusDeg = Math.asin(Math.min(1, MOON_MEAN_RADIUS_KM / distanceKm(this.moonEcefKm, s))) * RAD_TO_DEG;
    return out;
  }

  /** Sun-Earth-probe angle (at the Earth's centre, between the Sun and the target), deg, at the time last given to `at`. */
  sunEarthProbeDeg(targetEcefKm: ArrayLike<number>): number {
    const t = targetEcefKm;
    const u = this.sunEcefKm;
    const dot = t[0]! * u[0]! + t[1]! * u[1]! + t[2]! * u[2]!;
    const c = dot / (Math.hypot(t[0]!, t[1]!, t[2]!) * Math.hypot(u[0]!, u[1]!, u[2]!));
    return Math.acos(Math.max(-1, Math.min(1, c))) * RAD_TO_DEG;
  }
}

/** Margins of farFromBoth over the wanted offsets, deg: parallax bound plus rounding (see there). */
export const FAR_SUN_MARGIN_DEG = 0.003 + 0.01;
export const FAR_MOON_MARGIN_DEG = 1.13 + 0.01;

/**
 * The cosine limit farFromBoth takes for "more than offsetDeg (plus marginDeg) away", or
 * -2 (never far) when that angle reaches 179 deg.
 */
export function farCosLimit(offsetDeg: number, marginDeg: number): number {
  const deg = offsetDeg + marginDeg;
  return deg < 179 ? Math.cos(deg / RAD_TO_DEG) : -2;
}

function unit(p: Float64Array, out: Float64Array): void {
  const n = Math.sqrt(p[0]! * p[0]! + p[1]! * p[1]! + p[2]! * p[2]!);
  out[0] = p[0]! / n;
  out[1] = p[1]! / n;
  out[2] = p[2]! / n;
}

function distanceKm(p: Float64Array, s: readonly number[]): number {
  return Math.hypot(p[0]! - s[0]!, p[1]! - s[1]!, p[2]! - s[2]!);
}

/** Angle between the boresight (bx, by, bz) and the direction site -> p, deg (atan2 form: exact near 0). */
function offsetDeg(bx: number, by: number, bz: number, p: Float64Array, s: readonly number[]): number {
  const px = p[0]! - s[0]!;
  const py = p[1]! - s[1]!;
  const pz = p[2]! - s[2]!;
  const cx = by * pz - bz * py;
  const cy = bz * px - bx * pz;
  const cz = bx * py - by * px;
  const cross = Math.sqrt(cx * cx + cy * cy + cz * cz);
  const dot = bx * px + by * py + bz * pz;
  return Math.atan2(cross, dot) * RAD_TO_DEG;
}
