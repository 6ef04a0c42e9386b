/**
 * Slant range and elevation on a spherical triangle: Earth centre, station,
 * spacecraft. With r_s the station's geocentric distance, r the spacecraft's
 * and e the elevation above the local horizontal (the horizontal taken normal
 * to the geocentric radius), the law of cosines gives
 *   r^2 = r_s^2 + d^2 + 2 r_s d sin(e)   =>   d = sqrt(r^2 - r_s^2 cos^2 e) - r_s sin e
 * (standard satellite-communications geometry, e.g. Pratt, Bostian & Allnutt,
 * ch. 3; from memory). Treating geodetic and geocentric verticals as the same
 * errs by under 0.2 deg in elevation.
 * Valid for r > r_s and -90 <= e <= 90. Units km, degrees.
 */
import { ModelRangeError } from '../errors.js';
import { WGS84_GM_KM3_S2 } from './earth.js';

const DEG = Math.PI / 180;

export function slantRangeKm(stationRadiusKm: number, targetRadiusKm: number, elevationDeg: number): number {
  if (!(targetRadiusKm > stationRadiusKm)) throw new ModelRangeError('slant range', 'targetRadiusKm', targetRadiusKm, `> station radius ${stationRadiusKm} km`);
  const s = Math.sin(elevationDeg * DEG);
  const c = Math.cos(elevationDeg * DEG);
  return Math.sqrt(targetRadiusKm * targetRadiusKm - stationRadiusKm * stationRadiusKm * c * c) - stationRadiusKm * s;
}

/** Elevation (deg) at which a target at targetRadiusKm is seen at slant range rangeKm. */
export function elevationForRangeDeg(stationRadiusKm: number, targetRadiusKm: number, rangeKm: number): number {
  const sinE = (targetRadiusKm * targetRadiusKm - stationRadiusKm * stationRadiusKm - rangeKm * rangeKm) / (2 * stationRadiusKm * rangeKm);
  if (!(sinE >= -1 && sinE <= 1)) {
    const lo = targetRadiusKm - stationRadiusKm;
    throw new ModelRangeError('slant range', 'rangeKm', rangeKm, `${lo.toFixed(1)}..${Math.sqrt(targetRadiusKm ** 2 - stationRadiusKm ** 2).toFixed(1)} km for this orbit radius`);
  }
  return Math.asin(sinE) / DEG;
}

/** Semi-major axis (km) from mean motion (rev/day), Kepler's third law with WGS-84 GM. */
export function semiMajorAxisKm(meanMotionRevPerDay: number): number {
  const nRadS = (meanMotionRevPerDay * 2 * Math.PI) / 86_400;
  return Math.cbrt(WGS84_GM_KM3_S2 / (nRadS * nRadS));
}
