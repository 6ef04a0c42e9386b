/**
 * Median wet term of the surface refractivity: Rec. ITU-R P.453-14 (08/2019), the 0.75°
 * digital map of Nwet exceeded 50 % of an average year (the source names the map file
 * revision 13), bilinear interpolation. It feeds P.618-14 §2.4.1 scintillation.
 * Units: degrees in, N-units out.
 */

import { bilinear } from './grid.js';
import { climateMap } from './maps.js';

export const NWET_SOURCE = 'ITU-R P.453-14 (median Nwet map)';

export function medianWetRefractivity(latitudeDeg: number, longitudeDeg: number): number {
  return bilinear(climateMap('nWet'), latitudeDeg, longitudeDeg);
}
