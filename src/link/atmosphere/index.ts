/**
 * Atmosphere stage of the link engine: gas (ITU-R P.676-13), rain (P.618-14 §2.2.1.1 with
 * P.838-3), clouds (P.840-9), scintillation (P.618-14 §2.4.1), their combination (P.618-14
 * §2.5) and the sky noise temperature (P.618-14 §3) on an Earth-space path.
 * Validity, low-elevation handling and input checks: see prepare.ts and each model file.
 */

import {
  checkElevation,
  combineTerms,
  evaluateTerms,
  newAtmospherePrepared,
  prepareAtmosphere,
} from './prepare.js';
import type { AtmosphereInput, AtmosphereResult } from './types.js';

export type { AtmosphereInput, AtmosphereResult, AtmosphereTable, ExceedanceLevelsTable } from './types.js';
export { rainModelled, type AtmosphereStationInput } from './prepare.js';
export { buildAtmosphereTable, buildExceedanceLevelsTable } from './table.js';

const scratch = newAtmospherePrepared();

/**
 * Direct evaluation at input.elevationDeg (0..90°) into out. Throws ModelRangeError for
 * out-of-range input. Rain absent (see rainModelled) -> rainDb = 0.
 */
export function atmosphereAt(input: AtmosphereInput, out: AtmosphereResult): void {
  checkElevation(input.elevationDeg);
  prepareAtmosphere(input, scratch);
  evaluateTerms(scratch, input.elevationDeg, out);
  combineTerms(out);
}
