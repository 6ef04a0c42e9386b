/**
 * Surface pressure from the station height: Rec. ITU-R P.835-6 (12/2017) §1, the mean annual
 * global reference atmosphere (the US Standard Atmosphere 1976 form), lowest layer:
 *   h' = 6356.766 h / (6356.766 + h)          geopotential height, km (h geometric, km)
 *   P  = 1013.25 (288.15 / (288.15 - 6.5 h'))^(-34.1632 / 6.5)  hPa,  0 <= h' < 11 km
 * (from memory; checked against the P.835-6 profile column of the ITU-R SG3 validation
 * workbook in test/link/climate/p835-6.test.ts). Below sea level (h < 0) the same formula
 * is extended. Units: km in, hPa out.
 */

import { ModelRangeError } from '../../errors.js';

export const PRESSURE_SOURCE = 'ITU-R P.835-6 (mean annual global reference atmosphere at the station height)';

export function standardPressureHpa(heightKm: number): number {
  if (!(heightKm >= -1 && heightKm <= 11)) throw new ModelRangeError('ITU-R P.835-6', 'heightKm', heightKm, '-1..11 km');
  const hp = (6356.766 * heightKm) / (6356.766 + heightKm);
  return 1013.25 * Math.pow(288.15 / (288.15 - 6.5 * hp), -34.1632 / 6.5);
}
