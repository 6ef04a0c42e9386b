/**
 * Free-space basic transmission loss between isotropic antennas.
 *
 * Source: ITU-R P.525 (Calculation of free-space attenuation), section 2.2:
 *   Lbf = 20 log10(4 pi d / lambda) dB
 *       = 32.45 + 20 log10(f / MHz) + 20 log10(d / km)   (exact constant 32.4478;
 *         the Recommendation prints 32.4)
 * Valid for far-field paths (d >> lambda); any d > 0 and f > 0 is accepted here.
 * Units in: rangeKm (km), freqHz (Hz). Out: dB.
 */
import { ModelRangeError } from '../errors.js';
import { amplitudeToDb, SPEED_OF_LIGHT_M_S } from './units.js';

/** 20 log10(4 pi / c), dB per (Hz m): the frequency-and-distance-free part of Lbf. */
const FOUR_PI_OVER_C_DB = amplitudeToDb((4 * Math.PI) / SPEED_OF_LIGHT_M_S);
/** 20 log10(1000): metres per kilometre, dB. */
const KM_DB = amplitudeToDb(1000);

/** ITU-R P.525 free-space basic loss, dB, at slant range rangeKm and frequency freqHz. */
export function freeSpaceLossDb(rangeKm: number, freqHz: number): number {
  if (!(rangeKm > 0)) throw new ModelRangeError('ITU-R P.525 free-space loss', 'rangeKm', rangeKm, '> 0');
  if (!(freqHz > 0)) throw new ModelRangeError('ITU-R P.525 free-space loss', 'freqHz', freqHz, '> 0');
  return FOUR_PI_OVER_C_DB + KM_DB + amplitudeToDb(rangeKm) + amplitudeToDb(freqHz);
}

/**
 * Power flux density at range from an EIRP, dBW/m^2: EIRP - 10 log10(4 pi d^2)
 * (spreading loss of an isotropic radiator; the free-space loss without the
 * 4 pi / lambda^2 isotropic-aperture term).
 */
export function fluxDensityDbwM2(eirpDbw: number, rangeKm: number): number {
  if (!(rangeKm > 0)) throw new ModelRangeError('spreading loss', 'rangeKm', rangeKm, '> 0');
  const rangeM = rangeKm * 1000;
  return eirpDbw - amplitudeToDb(rangeM * Math.sqrt(4 * Math.PI));
}
