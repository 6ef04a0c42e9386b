/**
 * Sky brightness temperature seen through an absorbing atmosphere:
 * Rec. ITU-R P.618-14 (08/2023), §3, Eq. (65):
 *   Tsky = Tmr (1 - 10^(-A/10)) + Tcmb 10^(-A/10)
 * Tmr: mean radiating temperature; P.618 suggests 275 K when no local value is known
 * (it also gives Tmr = 37.34 + 0.81 Ts, from memory; not used here). Tcmb = 2.7 K, the
 * cosmic background.
 * A must be the absorptive attenuation only: gas + rain + cloud. Scintillation is a
 * redistribution of power by turbulence, not absorption, and emits no noise, so it is left
 * out (the caller passes AG + AR + AC).
 * Units: A dB, temperatures K.
 */

import { dbToLinear } from '../units.js';

/** Mean radiating temperature suggested by P.618-14 §3, K. */
export const MEAN_RADIATING_TEMPERATURE_K = 275;
/** Cosmic microwave background, K (P.618-14 §3). */
export const COSMIC_BACKGROUND_K = 2.7;

export function skyNoiseTemperatureK(
  absorptionDb: number,
  meanRadiatingTemperatureK: number = MEAN_RADIATING_TEMPERATURE_K,
): number {
  const transmission = dbToLinear(-absorptionDb);
  return meanRadiatingTemperatureK * (1 - transmission) + COSMIC_BACKGROUND_K * transmission;
}
