/**
 * RF constants and decibel conversions: the one home of `10*log10` in passbudget.
 *
 * Sources (edition on each line):
 * - BIPM, The International System of Units (SI Brochure), 9th ed. (2019): c and k are
 *   exact defined constants.
 * - ITU-R P.372 (reference temperature 290 K for noise figure), common practice.
 *
 * Which Boltzmann figure is used where:
 * - Computation (C/N0, N0, G/T chains) uses BOLTZMANN_EXACT_DBW_PER_K_HZ
 *   = 10*log10(1.380649e-23) = -228.59916 dBW/(K.Hz).
 * - BOLTZMANN_DBW_PER_K_HZ = -228.6 is the trade rounding printed in textbooks and
 *   filings (Roddy, Satellite Communications 4th ed., Example 12.9). It is only for
 *   printed budgets and for checks against textbook arithmetic; test/link/units.test.ts
 *   checks that the exact value rounds to it (0.01 dB). The two differ by 0.0008 dB.
 */

/** Speed of light in vacuum, m/s (exact; BIPM SI Brochure 9th ed. 2019). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;
/** Boltzmann constant, J/K (exact since the 2019 SI revision; BIPM SI Brochure 9th ed. 2019, CODATA 2018). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** 10*log10(k), dBW/(K.Hz): -228.59916 (derived from the exact SI 2019 value); used in all computation. */
export const BOLTZMANN_EXACT_DBW_PER_K_HZ = 10 * Math.log10(BOLTZMANN_J_PER_K);
/** Trade rounding of 10*log10(k), dBW/(K.Hz) (Roddy, Satellite Communications 4th ed., Ex. 12.9); printouts only. */
export const BOLTZMANN_DBW_PER_K_HZ = -228.6;
/** Reference noise temperature for noise figure, K (IEEE/ITU-R P.372 convention, common practice). */
export const T0_K = 290;

/** Power ratio (linear, > 0) to decibels. */
export function linearToDb(ratio: number): number {
  return 10 * Math.log10(ratio);
}

const LN10_OVER_10 = Math.LN10 / 10;

/** Decibels to power ratio: 10^(dB/10), computed as exp(dB ln10 / 10) (faster than pow in V8, same to ~1 ulp). */
export function dbToLinear(db: number): number {
  return Math.exp(db * LN10_OVER_10);
}

/** Amplitude (field) ratio to decibels: 20*log10(ratio). */
export function amplitudeToDb(ratio: number): number {
  return 20 * Math.log10(ratio);
}

/** Power in watts to dBW. */
export function wattsToDbw(powerW: number): number {
  return 10 * Math.log10(powerW);
}

/** Power in dBW to watts. */
export function dbwToWatts(powerDbw: number): number {
  return Math.pow(10, powerDbw / 10);
}

/** Wavelength, m, of a carrier at freqHz. */
export function wavelengthM(freqHz: number): number {
  return SPEED_OF_LIGHT_M_S / freqHz;
}
