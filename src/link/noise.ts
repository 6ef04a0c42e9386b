/**
 * Receive noise: noise temperature from noise figure, system noise temperature of a
 * station's receive chain, G/T, and the noise rise of a station given only as G/T.
 *
 * Sources:
 * - Te = T0 (F - 1), F = 10^(NF/10), T0 = 290 K: IEEE noise-figure definition; Pratt &
 *   Allnutt, Satellite Communications, 3rd ed., ch. 4; Roddy, Satellite Communications,
 *   4th ed., ch. 12 (standard result, from memory).
 * - Cascade of an antenna, a passive lossy feed (loss Lf at physical temperature Tf)
 *   and a receiver, all referred to ONE point, the LNA input (Roddy 4th ed. ch. 12;
 *   Maral & Bousquet ch. 5). A passive loss Lf at Tf adds Tf (1 - 1/Lf) at its output
 *   and divides what enters it by Lf:
 *     Tsys(LNA input) = (Tsky + Tant) / Lf + Tf (1 - 1/Lf) + Trx
 *   The gain referred to the same point is G - Lf(dB), so
 *     G/T = G - Lf(dB) - 10 log10 Tsys(LNA input)
 *   (identical to referring both to the antenna flange, where T = Tsky + Tant +
 *   Tf (Lf - 1) + Lf Trx and the gain is G).
 *   Tsky is the sky brightness temperature through the atmosphere (ITU-R P.618 sec. 3,
 *   supplied by src/link/atmosphere); Tant is the non-sky antenna noise (spillover,
 *   ground pick-up), treated as entering at the antenna flange.
 * - N0 = k T: Boltzmann; computation uses BOLTZMANN_EXACT_DBW_PER_K_HZ (units.ts).
 * Valid for Tsys > 0, Lf >= 0 dB.
 */
import { ModelRangeError } from '../errors.js';
import { BOLTZMANN_EXACT_DBW_PER_K_HZ, dbToLinear, linearToDb, T0_K } from './units.js';

/** Noise temperature from a noise figure, K: T0 (10^(NF/10) - 1). */
export function noiseTempFromNoiseFigureK(noiseFigureDb: number): number {
  if (!(noiseFigureDb >= 0)) throw new ModelRangeError('noise figure', 'noiseFigureDb', noiseFigureDb, '>= 0 dB');
  return T0_K * (dbToLinear(noiseFigureDb) - 1);
}

/** Noise figure from a noise temperature, dB: 10 log10(1 + T/T0). */
export function noiseFigureFromNoiseTempDb(noiseTempK: number): number {
  return linearToDb(1 + noiseTempK / T0_K);
}

/**
 * System noise temperature referred to the LNA input, K:
 * (Tsky + Tant) / Lf + Tf (1 - 1/Lf) + Trx.
 */
export function systemNoiseTempK(
  skyNoiseTempK: number,
  antennaNoiseTempK: number,
  feedLossDb: number,
  feedPhysicalTempK: number,
  receiverNoiseTempK: number,
): number {
  const invLf = 1 / dbToLinear(feedLossDb);
  return (skyNoiseTempK + antennaNoiseTempK) * invLf + feedPhysicalTempK * (1 - invLf) + receiverNoiseTempK;
}

/** G/T, dB/K, with gain and temperature referred to the LNA input: G - Lf - 10 log10 Tsys. */
export function gOverTDbK(gainDbi: number, feedLossDb: number, systemNoiseTempK: number): number {
  return gainDbi - feedLossDb - linearToDb(systemNoiseTempK);
}

/** Noise power spectral density, dBW/Hz: 10 log10(k T). */
export function noiseDensityDbwHz(noiseTempK: number): number {
  return BOLTZMANN_EXACT_DBW_PER_K_HZ + linearToDb(noiseTempK);
}

/** System noise temperature implied by a gain and a G/T at the same reference point, K. */
export function impliedSystemNoiseTempK(gainDbi: number, gOverTDbKValue: number): number {
  return dbToLinear(gainDbi - gOverTDbKValue);
}

/**
 * G/T of a station stated as G/T at one elevation, at another sky temperature, dB/K.
 *
 * Assumption (documented): the stated G/T already includes the sky noise
 * referenceSkyNoiseTempK seen at the stated elevation; at another elevation or weather
 * the system noise changes by the difference in sky temperature only:
 *   Tsys = TsysRef + (Tsky - TskyRef),  G/T = G/T_ref - 10 log10(Tsys / TsysRef).
 * The sky change is added unattenuated at the G/T reference point (it ignores any feed
 * loss ahead of that point, so it slightly overstates the rise: conservative).
 * A lower Tsky than the reference (higher elevation) improves G/T accordingly.
 */
export function gOverTAtSkyDbK(
  statedGOverTDbK: number,
  referenceSystemNoiseTempK: number,
  referenceSkyNoiseTempK: number,
  skyNoiseTempK: number,
): number {
  const tsysK = referenceSystemNoiseTempK + (skyNoiseTempK - referenceSkyNoiseTempK);
  return statedGOverTDbK - linearToDb(tsysK / referenceSystemNoiseTempK);
}
