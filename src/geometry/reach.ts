/**
 * How far an Earth orbiter can get from one known state within a short time, and how much
 * that can change its direction seen from a station: bounds that let the contact search
 * (passes.ts) and the Sun-outage search (sun-outage.ts) pass over work whose answer is
 * known in advance.
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
 * derivative to m/s), gravity taken twice, plus 1 km on every deviation.
 * Near a line: |r(t) - r(t0) - v(t0)(t - t0)| <= |dv| tau + A tau^2 / 2, dv the velocity's margin.
 * Elevation: a point within dev of one at distance d is seen within asin(dev / d) of its
 * direction, and elevation changes no faster than direction (1-Lipschitz).
 * Units: km, km/s, s, degrees.
 */
import { WGS84_EARTH_ROTATION_RAD_S, WGS84_GM_KM3_S2 } from './earth.js';
import type { Site } from './types.js';

/** |(x, y, z)| (a bound's input: sqrt, not the slower Math.hypot). */
function norm3(x: number, y: number, z: number): number {
  return Math.sqrt(x * x + y * y + z * z);
}

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
  const r = Math.sqrt(x * x + y * y + z * z);
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
  return 1.02 * norm3(state[3]!, state[4]!, state[5]!) + 0.01;
}

/**
 * Largest distance of the orbiter from the straight line r0 + v0 (t - t0) over
 * |t - t0| <= tauS, km (the velocity's margin times tau, plus A tau^2 / 2, plus 1 km);
 * NaN when no bound holds.
 */
export function lineDeviationKm(state: Float64Array, tauS: number): number {
  const a = accelerationBoundKmS2(state, tauS);
  const dv = 0.02 * norm3(state[3]!, state[4]!, state[5]!) + 0.01;
  return a >= 0 ? dv * tauS + 0.5 * a * tauS * tauS + 1 : Number.NaN;
}

/** Scratch of pieceFromSite for elevationBoundsDeg (single-threaded, never held across calls). */
const piece = new Float64Array(8);

/**
 * The tangent-line piece r0 + v0 t, |t| <= tauS, of `state` (ECEF km, km/s) seen from
 * `site`: its ends A (t = -tauS) and B (t = +tauS) relative to the site into out[0..5]
 * (ax, ay, az, bx, by, bz) and their lengths into out[6], out[7]; returns the least
 * distance from the site to the piece, km. Shared by elevationBoundsDeg and the Sun-outage
 * screen (sun-outage.ts).
 */
export function pieceFromSite(site: Site, state: Float64Array, tauS: number, out: Float64Array): number {
  const s = site.ecefKm;
  const ax = state[0]! - state[3]! * tauS - s[0];
  const ay = state[1]! - state[4]! * tauS - s[1];
  const az = state[2]! - state[5]! * tauS - s[2];
  const dx = 2 * state[3]! * tauS;
  const dy = 2 * state[4]! * tauS;
  const dz = 2 * state[5]! * tauS;
  const bx = ax + dx;
  const by = ay + dy;
  const bz = az + dz;
  const dd = dx * dx + dy * dy + dz * dz;
  const w = dd > 0 ? Math.min(1, Math.max(0, -(ax * dx + ay * dy + az * dz) / dd)) : 0;
  out[0] = ax;
  out[1] = ay;
  out[2] = az;
  out[3] = bx;
  out[4] = by;
  out[5] = bz;
  out[6] = Math.sqrt(ax * ax + ay * ay + az * az);
  out[7] = Math.sqrt(bx * bx + by * by + bz * bz);
  return Math.sqrt((ax + w * dx) ** 2 + (ay + w * dy) ** 2 + (az + w * dz) ** 2);
}

/**
 * Bounds on the elevation from `site` of the orbiter of `state` (ECEF km, km/s, at t0) over
 * |t - t0| <= tauS, deg, into out[0] (lowest) and out[1] (highest); false when no bound holds.
 * The orbiter stays within lineDeviationKm of the tangent piece A..B = r0 -/+ v0 tau, whose
 * directions from the site sweep the great-circle arc between those of A and B: the arc's
 * elevations lie between its ends' and, when its highest (lowest) point lies inside it,
 * that point's, +/- asin(deviation / least distance to the piece) (1e-7 deg for rounding).
 * devKm: lineDeviationKm(state, tauS), when the caller has it.
 */
export function elevationBoundsDeg(site: Site, state: Float64Array, tauS: number, out: Float64Array, devKm = lineDeviationKm(state, tauS)): boolean {
  if (!(devKm >= 0)) return false;
  const nearKm = pieceFromSite(site, state, tauS, piece);
  if (!(nearKm > devKm)) return false;
  const ax = piece[0]!;
  const ay = piece[1]!;
  const az = piece[2]!;
  const bx = piece[3]!;
  const by = piece[4]!;
  const bz = piece[5]!;
  const na = piece[6]!;
  const nb = piece[7]!;
  const u = site.up;
  const sinA = (u[0] * ax + u[1] * ay + u[2] * az) / na;
  const sinB = (u[0] * bx + u[1] * by + u[2] * bz) / nb;
  let lo = Math.min(sinA, sinB);
  let hi = Math.max(sinA, sinB);
  // plane of the arc: n = a x b
  let nx = ay * bz - az * by;
  let ny = az * bx - ax * bz;
  let nz = ax * by - ay * bx;
  const nn = Math.sqrt(nx * nx + ny * ny + nz * nz);
  if (!(nn > 1e-9 * na * nb)) return false; // a degenerate (nearly radial) piece: no bound
  nx /= nn;
  ny /= nn;
  nz /= nn;
  const un = u[0] * nx + u[1] * ny + u[2] * nz;
  // the up direction projected on the plane: the great circle's highest point (its opposite the lowest)
  const px = u[0] - un * nx;
  const py = u[1] - un * ny;
  const pz = u[2] - un * nz;
  const pn = Math.sqrt(px * px + py * py + pz * pz);
  // P between A and B along the arc: (A x P) . n >= 0 and (P x B) . n >= 0
  const c1 = (ay * pz - az * py) * nx + (az * px - ax * pz) * ny + (ax * py - ay * px) * nz;
  const c2 = (py * bz - pz * by) * nx + (pz * bx - px * bz) * ny + (px * by - py * bx) * nz;
  if (c1 >= 0 && c2 >= 0) hi = Math.max(hi, pn);
  if (c1 <= 0 && c2 <= 0) lo = Math.min(lo, -pn); // -P between A and B
  const slackDeg = Math.asin(devKm / nearKm) * RAD_TO_DEG + 1e-7;
  out[0] = Math.asin(Math.max(-1, Math.min(1, lo))) * RAD_TO_DEG - slackDeg;
  out[1] = Math.asin(Math.max(-1, Math.min(1, hi))) * RAD_TO_DEG + slackDeg;
  return true;
}
