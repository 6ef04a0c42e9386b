/**
 * Topocentric look angles: azimuth, elevation, slant range and range rate of an ECEF
 * state seen from a ground site.
 *
 * Model: the relative vector d = r_target - r_site is projected on the site's local
 * east/north/up axes (geodetic normal as up); azimuth = atan2(east, north) measured
 * clockwise from north (0 = N, 90 = E), elevation = atan2(up, horizontal), range = |d|,
 * range rate = (d . v_target) / |d| (the site is fixed in ECEF, so the relative velocity
 * is the target's ECEF velocity). Source: D. A. Vallado, "Fundamentals of Astrodynamics
 * and Applications", 4th ed. (2013), section 4.4 (SEZ/topocentric horizon frame), with
 * ENU instead of SEZ axes. Geometric (no refraction); light time, where modelled, is in
 * the target's state (light-time.ts).
 * Valid range: any target not at the site (range > 0). Units: km, km/s, degrees.
 */
import type { Look, Site } from './types.js';

const RAD_TO_DEG = 180 / Math.PI;

/** Scratch of relativeEnu: d = target - site (km) and its east, north, up components (km). */
const rel = new Float64Array(6);

/** The target's position relative to the site into rel: [dx, dy, dz, east, north, up], km. */
function relativeEnu(site: Site, stateEcef: Float64Array): void {
  const s = site.ecefKm;
  const dx = stateEcef[0]! - s[0];
  const dy = stateEcef[1]! - s[1];
  const dz = stateEcef[2]! - s[2];
  const e = site.east;
  const n = site.north;
  const u = site.up;
  rel[0] = dx;
  rel[1] = dy;
  rel[2] = dz;
  rel[3] = e[0] * dx + e[1] * dy + e[2] * dz;
  rel[4] = n[0] * dx + n[1] * dy + n[2] * dz;
  rel[5] = u[0] * dx + u[1] * dy + u[2] * dz;
}

/** Look angles of stateEcef (km, km/s; indices 0..5) from site, written into out. */
export function lookFrom(site: Site, stateEcef: Float64Array, out: Look): Look {
  relativeEnu(site, stateEcef);
  const dx = rel[0]!;
  const dy = rel[1]!;
  const dz = rel[2]!;
  const eastKm = rel[3]!;
  const northKm = rel[4]!;
  const rangeKm = Math.sqrt(dx * dx + dy * dy + dz * dz);
  let azimuthDeg = Math.atan2(eastKm, northKm) * RAD_TO_DEG;
  if (azimuthDeg < 0) azimuthDeg += 360;
  out.azimuthDeg = azimuthDeg;
  out.elevationDeg = Math.atan2(rel[5]!, Math.sqrt(eastKm * eastKm + northKm * northKm)) * RAD_TO_DEG;
  out.rangeKm = rangeKm;
  out.rangeRateKmS = (dx * stateEcef[3]! + dy * stateEcef[4]! + dz * stateEcef[5]!) / rangeKm;
  return out;
}

/**
 * Elevation alone of stateEcef from site, deg: lookFrom's elevationDeg (the same
 * arithmetic, so the same number), without the azimuth, range and range rate.
 */
export function elevationFrom(site: Site, stateEcef: Float64Array): number {
  relativeEnu(site, stateEcef);
  const eastKm = rel[3]!;
  const northKm = rel[4]!;
  return Math.atan2(rel[5]!, Math.sqrt(eastKm * eastKm + northKm * northKm)) * RAD_TO_DEG;
}

/** A fresh Look to be reused as `out`. */
export function newLook(): Look {
  return { azimuthDeg: 0, elevationDeg: 0, rangeKm: 0, rangeRateKmS: 0 };
}
