/**
 * Rain height: Rec. ITU-R P.839-4 (09/2013): hR = h0 + 0.36 km, h0 the mean annual 0 °C
 * isotherm height read from the Recommendation's 1.5° digital map by bilinear interpolation.
 * Units: degrees in, km out.
 */

import { bilinear } from './grid.js';
import { climateMap } from './maps.js';

export const RAIN_HEIGHT_SOURCE = 'ITU-R P.839-4 (h0 map + 0.36 km)';

export function zeroDegreeIsothermHeightKm(latitudeDeg: number, longitudeDeg: number): number {
  return bilinear(climateMap('h0'), latitudeDeg, longitudeDeg);
}

export function rainHeightKm(latitudeDeg: number, longitudeDeg: number): number {
  return zeroDegreeIsothermHeightKm(latitudeDeg, longitudeDeg) + 0.36;
}
