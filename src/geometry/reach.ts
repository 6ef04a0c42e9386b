/**
 * How far an Earth orbiter can get from one known state within a short time, and how much
 * that can change its elevation seen from a station: a bound that lets the contact search
 * pass over a refinement whose answer is known in advance (passes.ts).
 *
 * Model (Taylor's theorem with a bound on the second derivative): for |t - t0| <= tau,
 *   |r(t) - r(t0)| <= |v(t0)| tau + A tau^2 / 2,
 * where A bounds the Earth-fixed acceleration over the interval:
 *   A = GM / rMin^2 (gravity; J2 and the rest add < 0.2 %)
 *     + 2 omega V (Coriolis) + omega^2 R (centrifugal),
 * V and R bounding speed and radius over the interval. A is found by assuming A0, checking
 * that the A it implies is no larger (a consistent bound), else no bound is given.
 * The least radius rMin follows from the radial speed: d2|r|/dt2 >= -A.
 * Margins: the velocity is taken 2 % + 0.01 km/s high (an SGP4 velocity is its position's
 * derivative to m/s), gravity taken twice, plus 1 km on the radius.
 * Near a line: |r(t) - r(t0) - v(t0)(t - t0)| <= |dv| tau + A tau^2 / 2, dv the velocity's margin.
 * Elevation: a ball of radius rho at distance d is seen within asin(rho / d) of its
 * centre's direction, and elevation changes no faster than direction (1-Lipschitz).
 * Units: km, km/s, s, degrees.
 */
import { WGS84_EARTH_ROTATION_RAD_S, WGS84_GM_KM3_S2 } from './earth.js';

/** Assumed (and checked) bound on the Earth-fixed acceleration, km/s^2 (about 2.5 g). */
const A0_KM_S2 = 0.025;
/** Below this geocentric radius no bound is given, km (SGP4 ends a track below the Earth's surface). */
const MIN_RADIUS_KM = 6378.135;
const RAD_TO_DEG = 180 / Math.PI;

/**
 * Bound on the Earth-fixed acceleration of the orbiter of `state` (ECEF km, km/s) over
 * |t - t0| <= tauS, km/s^2; NaN when no bound holds (too close to the Earth, or too fast).
 * The radius |r| itself moves by at most |dr/dt| tau + A tau^2 / 2 (d2|r|/dt2 >= -A), which
 * bounds the least radius, hence gravity.
 */
export function accelerationBoundKmS2(state: Float64Array, tauS: number): number {
  const x = state[0]!;
  const y = state[1]!;
  const z = state[2]!;
  const r = Math.hypot(x, y, z);
  const v = speedBoundKmS(state);
  const radialKmS = (1.02 * Math.abs(x * state[3]! + y * state[4]! + z * state[5]!)) / r + 0.01;
  const sag0 = 0.5 * A0_KM_S2 * tauS * tauS;
  const rMin = r - radialKmS * tauS - sag0;
  if (!(rMin > MIN_RADIUS_KM)) return Number.NaN;
  const w = WGS84_EARTH_ROTATION_RAD_S;
  const vMax = v + A0_KM_S2 * tauS;
  const rMax = r + v * tauS + sag0;
  // gravity taken twice (margin), Coriolis and centrifugal terms of Earth-fixed axes
  const a = (2 * WGS84_GM_KM3_S2) / (rMin * rMin) + 2 * w * vMax + w * w * rMax;
  return a <= A0_KM_S2 ? a : Number.NaN;
}

/** The state's speed with the margin for the derivative of an SGP4 position (2 % + 0.01 km/s), km/s. */
function speedBoundKmS(state: Float64Array): number {
  return 1.02 * Math.hypot(state[3]!, state[4]!, state[5]!) + 0.01;
}

/**
 * Radius of a ball around the position of `state` (ECEF km, km/s) that holds the orbiter for
 * |t - t0| <= tauS, km; NaN when no bound holds (too close to the Earth, or too fast).
 */
export function reachRadiusKm(state: Float64Array, tauS: number): number {
  const a = accelerationBoundKmS2(state, tauS);
  return a >= 0 ? speedBoundKmS(state) * tauS + 0.5 * a * tauS * tauS + 1 : Number.NaN;
}

/**
 * Largest distance of the orbiter from the straight line r0 + v0 (t - t0) over
 * |t - t0| <= tauS, km (the velocity's margin times tau, plus A tau^2 / 2, plus 1 km);
 * NaN when no bound holds.
 */
export function lineDeviationKm(state: Float64Array, tauS: number): number {
  const a = accelerationBoundKmS2(state, tauS);
  const dv = 0.02 * Math.hypot(state[3]!, state[4]!, state[5]!) + 0.01;
  return a >= 0 ? dv * tauS + 0.5 * a * tauS * tauS + 1 : Number.NaN;
}

/** Largest change of elevation (or of any direction) of a point within rhoKm of one at rangeKm, deg; Infinity when rho >= range. */
export function reachAngleDeg(rhoKm: number, rangeKm: number): number {
  return rhoKm < rangeKm ? Math.asin(rhoKm / rangeKm) * RAD_TO_DEG : Number.POSITIVE_INFINITY;
}
