/**
 * Annual mean surface temperature: Rec. ITU-R P.1510-1 (06/2017), the 0.75° digital map,
 * bilinear interpolation. Units: degrees in, K out.
 */

import { bilinear } from './grid.js';
import { climateMap } from './maps.js';

export const SURFACE_TEMPERATURE_SOURCE = 'ITU-R P.1510-1 (annual mean map)';

export function annualMeanSurfaceTemperatureK(latitudeDeg: number, longitudeDeg: number): number {
  return bilinear(climateMap('tAnnual'), latitudeDeg, longitudeDeg);
}
