/**
 * Frames: TEME (SGP4 output) and true-equator-of-date frames to Earth-fixed.
 *
 * Model: a rotation about the z axis by Greenwich sidereal time, and for velocity the
 * transport term v_ecef = R v_inertial - omega x r_ecef. Source: D. A. Vallado,
 * "Fundamentals of Astrodynamics and Applications", 4th ed. (2013), section 3.7
 * (TEME -> PEF with GMST), and Vallado, Crawford, Hujsak, Kelso, AIAA 2006-6753,
 * appendix C (teme2ecef). GMST is the IAU-1982 expression as implemented by satellite.js
 * `gstime` (Vallado 2004, eq. 3-45).
 *
 * Simplifications (documented limits):
 * - Polar motion is ignored: the result is the pseudo-Earth-fixed frame (PEF), which
 *   differs from the ITRF by at most ~0.5 arcsec (~15 m at the Earth's surface, far less
 *   in look angles from a station).
 * - UT1 is taken equal to UTC (|UT1 - UTC| < 0.9 s): Earth-rotation angle error up to
 *   6.6e-5 rad, i.e. up to ~0.4 km along-track at the surface, a few 0.001 deg in look
 *   angles. SGP4 element sets themselves are good to ~1 km.
 * - The frame rotation rate is WGS-84 omega (the small precession term of d(GMST)/dt
 *   and length-of-day variation are ignored: < 1e-9 relative in velocity).
 * Units: km, km/s, radians, epoch milliseconds (UTC).
 */
import { gstime } from 'satellite.js';
import { WGS84_EARTH_ROTATION_RAD_S } from './earth.js';

const MS_PER_DAY = 86_400_000;
/** Julian date of the Unix epoch 1970-01-01T00:00:00 UTC. */
export const JULIAN_DATE_UNIX_EPOCH = 2_440_587.5;

/** Julian date (UTC, used as UT1) from epoch milliseconds. No Date object. */
export function julianDateFromMs(tMs: number): number {
  return tMs / MS_PER_DAY + JULIAN_DATE_UNIX_EPOCH;
}

/** Greenwich mean sidereal time (IAU-1982, satellite.js gstime), rad in [0, 2 pi). */
export function gmstRadAt(tMs: number): number {
  return gstime(julianDateFromMs(tMs));
}

/**
 * Rotate an inertial-of-date state (TEME with GMST, or true equator of date with GAST)
 * into Earth-fixed axes: out[0..2] position km, out[3..5] velocity km/s.
 * `siderealRad` is the Greenwich sidereal angle between the frame's x axis and the
 * Greenwich meridian. Allocation-free; `out` must not alias the inputs.
 */
export function inertialOfDateToEcef(
  rKm: ArrayLike<number>,
  vKmS: ArrayLike<number>,
  siderealRad: number,
  out: Float64Array,
): void {
  const c = Math.cos(siderealRad);
  const s = Math.sin(siderealRad);
  const rx = rKm[0]!;
  const ry = rKm[1]!;
  const vx = vKmS[0]!;
  const vy = vKmS[1]!;
  const xEcef = c * rx + s * ry;
  const yEcef = -s * rx + c * ry;
  out[0] = xEcef;
  out[1] = yEcef;
  out[2] = rKm[2]!;
  // v_ecef = R v - omega x r_ecef, omega = (0, 0, w): omega x r = (-w y, w x, 0)
  out[3] = c * vx + s * vy + WGS84_EARTH_ROTATION_RAD_S * yEcef;
  out[4] = -s * vx + c * vy - WGS84_EARTH_ROTATION_RAD_S * xEcef;
  out[5] = vKmS[2]!;
}

/**
 * TEME -> ECEF (PEF, polar motion ignored): rotation by GMST plus the omega x r term.
 * rTeme km, vTeme km/s (indices 0..2), gmstRad from `gmstRadAt`; out[0..5] km, km/s.
 */
export function temeToEcef(
  rTeme: ArrayLike<number>,
  vTeme: ArrayLike<number>,
  gmstRad: number,
  out: Float64Array,
): void {
  inertialOfDateToEcef(rTeme, vTeme, gmstRad, out);
}

/** Unix ms of J2000.0 (2000-01-01T12:00:00 UT). */
const J2000_UNIX_MS = 946_728_000_000;
const MS_PER_JULIAN_CENTURY = 36525 * MS_PER_DAY;

/**
 * GMST (IAU-1982, Vallado 4th ed. eq. 3-45, the expression satellite.js `gstime` uses),
 * rad in [0, 2 pi), with the time argument formed from epoch ms directly: no Julian-date
 * rounding (a Julian date near 2.46e6 holds time to ~47 us, a 3.4e-9 rad step of the
 * angle; harmless near the Earth, but it shakes a range rate at 1 AU by cm/s).
 */
export function gmstRadPrecise(tMs: number): number {
  const t = (tMs - J2000_UNIX_MS) / MS_PER_JULIAN_CENTURY;
  // seconds of time: 67310.54841 + (876600 h + 8640184.812866 s) T + 0.093104 T^2 - 6.2e-6 T^3
  const whole = 876600 * 3600 * t; // whole turns' part, split off before the small terms
  const secs = 67310.54841 + 8640184.812866 * t + (0.093104 - 6.2e-6 * t) * t * t;
  const turns = (whole % 86400) / 86400 + secs / 86400;
  let rad = (turns - Math.floor(turns)) * 2 * Math.PI;
  if (rad < 0) rad += 2 * Math.PI;
  return rad;
}
