/**
 * Specific attenuation due to rain: Rec. ITU-R P.838-3 (03/2005).
 *
 *   gammaR = k R^alpha                                     (Eq. 1), dB/km
 *   k, alpha for H and V polarisation from Tables 1-4      (Eqs. 2-3, data in p838-3.ts)
 *   k     = [kH + kV + (kH - kV) cos^2(theta) cos(2 tau)] / 2                  (Eq. 4)
 *   alpha = [kH aH + kV aV + (kH aH - kV aV) cos^2(theta) cos(2 tau)] / (2 k)  (Eq. 5)
 * theta: path elevation, tau: polarisation tilt relative to horizontal (45° circular).
 *
 * Valid range: 1..1000 GHz (outside: ModelRangeError). Units: f in GHz, R in mm/h,
 * angles in degrees, gammaR in dB/km.
 */

import { ModelRangeError } from '../../errors.js';
import {
  P838_3_ALPHA_H,
  P838_3_ALPHA_V,
  P838_3_KH,
  P838_3_KV,
  type P838Coefficients,
} from './p838-3.js';

const DEG_TO_RAD = Math.PI / 180;
export const P838_MIN_FREQ_GHZ = 1;
export const P838_MAX_FREQ_GHZ = 1000;

/** Horizontal and vertical coefficients at one frequency. */
export interface P838HvCoefficients {
  kH: number;
  kV: number;
  alphaH: number;
  alphaV: number;
}

/** k and alpha for a given path elevation and tilt. */
export interface P838PathCoefficients {
  k: number;
  alpha: number;
}

function gaussianSum(t: P838Coefficients, log10FreqGhz: number): number {
  let sum = 0;
  for (let j = 0; j < t.a.length; j++) {
    const x = (log10FreqGhz - (t.b[j] as number)) / (t.c[j] as number);
    sum += (t.a[j] as number) * Math.exp(-x * x);
  }
  return sum + t.m * log10FreqGhz + t.c0;
}

export function checkP838Frequency(freqGhz: number): void {
  if (!(freqGhz >= P838_MIN_FREQ_GHZ && freqGhz <= P838_MAX_FREQ_GHZ)) {
    throw new ModelRangeError('ITU-R P.838-3', 'frequencyGHz', freqGhz, '1..1000 GHz');
  }
}

/** kH, kV, alphaH, alphaV at freqGhz (Eqs. 2-3), written into out. */
export function p838HvCoefficients(freqGhz: number, out: P838HvCoefficients): P838HvCoefficients {
  checkP838Frequency(freqGhz);
  const lf = Math.log10(freqGhz);
  out.kH = Math.pow(10, gaussianSum(P838_3_KH, lf));
  out.kV = Math.pow(10, gaussianSum(P838_3_KV, lf));
  out.alphaH = gaussianSum(P838_3_ALPHA_H, lf);
  out.alphaV = gaussianSum(P838_3_ALPHA_V, lf);
  return out;
}

/** k and alpha for path elevation and polarisation tilt (Eqs. 4-5), from precomputed H/V values. */
export function p838PathCoefficients(
  hv: P838HvCoefficients,
  elevationDeg: number,
  tiltDeg: number,
  out: P838PathCoefficients,
): P838PathCoefficients {
  const cosEl = Math.cos(elevationDeg * DEG_TO_RAD);
  const g = cosEl * cosEl * Math.cos(2 * tiltDeg * DEG_TO_RAD);
  const k = (hv.kH + hv.kV + (hv.kH - hv.kV) * g) / 2;
  const kaH = hv.kH * hv.alphaH;
  const kaV = hv.kV * hv.alphaV;
  out.k = k;
  out.alpha = (kaH + kaV + (kaH - kaV) * g) / (2 * k);
  return out;
}

/** Specific attenuation gammaR = k R^alpha, dB/km (Eq. 1). */
export function rainSpecificAttenuationDbPerKm(k: number, alpha: number, rainRateMmH: number): number {
  return rainRateMmH > 0 ? k * Math.pow(rainRateMmH, alpha) : 0;
}
