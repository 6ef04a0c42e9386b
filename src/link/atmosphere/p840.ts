/**
 * Attenuation due to clouds: Rec. ITU-R P.840-9 (08/2023), Annex 1.
 *
 * Liquid-water permittivity, double-Debye model (Eqs. 4-11) at T = 273.75 K:
 *   theta = 300/T, eps0 = 77.66 + 103.3 (theta - 1), eps1 = 0.0671 eps0, eps2 = 3.52,
 *   fp = 20.20 - 146 (theta - 1) + 316 (theta - 1)^2, fs = 39.8 fp (GHz),
 *   eps'' = f (eps0 - eps1)/(fp (1 + (f/fp)^2)) + f (eps1 - eps2)/(fs (1 + (f/fs)^2)),
 *   eps'  = (eps0 - eps1)/(1 + (f/fp)^2) + (eps1 - eps2)/(1 + (f/fs)^2) + eps2,
 *   eta = (2 + eps')/eps'',  Kl = 0.819 f / (eps'' (1 + eta^2))      (Eqs. 2-3)
 * Mass absorption coefficient for the integrated-liquid-water method (§3.2, Eqs. 12-14):
 *   K_L = Kl(f, 273.75 K) (A1 exp(-(f - f1)^2/s1) + A2 exp(-(f - f2)^2/s2) + A3),
 *   A1 = 0.1522, A2 = 11.51, A3 = -10.4912, f1 = -23.9589, f2 = 219.2096 GHz,
 *   s1 = 3.2991e3, s2 = 2.7595e6 GHz^2.
 *   A = K_L L / sin(el)                                              (Eq. 13)
 * The temperature 273.75 K and the scaling factor are those the ITU-R SG3 validation
 * workbook (Rev 8.3.0, sheet P.840-9 A_Clouds) reproduces (its eps', eps'' match to 1e-15);
 * the coefficients were transcribed from a public implementation of P.840-9 and are checked
 * against that workbook in test/link/atmosphere/p840.test.ts.
 *
 * P.840 covers 5° <= el <= 90°. Below 5° we replace 1/sin(el) by the slant factor through a
 * thin layer at CLOUD_LAYER_HEIGHT_KM over an Earth of effective radius 8500 km,
 * 1/sqrt(sin^2 el + 2 h/Re) (our assumption, not from P.840; 3 % below 1/sin at 5°).
 *
 * Valid range: 1..200 GHz (outside: ModelRangeError). Units: f GHz, L kg/m^2,
 * K_L dB/(kg/m^2), A dB.
 */

import { ModelRangeError } from '../../errors.js';
import { ITU_EFFECTIVE_EARTH_RADIUS_KM } from '../../geometry/earth.js';

const DEG_TO_RAD = Math.PI / 180;
export const P840_MIN_FREQ_GHZ = 1;
export const P840_MAX_FREQ_GHZ = 200;
/** Liquid water temperature of the §3.2 method, K. */
export const P840_CLOUD_TEMPERATURE_K = 273.75;
/** Nominal cloud layer height for the below-5° path factor, km (our assumption). */
export const CLOUD_LAYER_HEIGHT_KM = 2;

export interface WaterPermittivity {
  epsReal: number;
  epsImag: number;
  eta: number;
  /** Kl, (dB/km)/(g/m^3). */
  klDbPerKmPerGM3: number;
}

export function checkP840Frequency(freqGhz: number): void {
  if (!(freqGhz >= P840_MIN_FREQ_GHZ && freqGhz <= P840_MAX_FREQ_GHZ)) {
    throw new ModelRangeError('ITU-R P.840-9', 'frequencyGHz', freqGhz, '1..200 GHz');
  }
}

/** Double-Debye permittivity of liquid water and Kl (Eqs. 2-11). */
export function waterPermittivity(freqGhz: number, temperatureK: number, out: WaterPermittivity): WaterPermittivity {
  const t1 = 300 / temperatureK - 1;
  const eps0 = 77.66 + 103.3 * t1;
  const eps1 = 0.0671 * eps0;
  const eps2 = 3.52;
  const fp = 20.2 - 146 * t1 + 316 * t1 * t1;
  const fs = 39.8 * fp;
  const rp = freqGhz / fp;
  const rs = freqGhz / fs;
  const epsImag = (freqGhz * (eps0 - eps1)) / (fp * (1 + rp * rp)) + (freqGhz * (eps1 - eps2)) / (fs * (1 + rs * rs));
  const epsReal = (eps0 - eps1) / (1 + rp * rp) + (eps1 - eps2) / (1 + rs * rs) + eps2;
  const eta = (2 + epsReal) / epsImag;
  out.epsReal = epsReal;
  out.epsImag = epsImag;
  out.eta = eta;
  out.klDbPerKmPerGM3 = (0.819 * freqGhz) / (epsImag * (1 + eta * eta));
  return out;
}

const scratch: WaterPermittivity = { epsReal: 0, epsImag: 0, eta: 0, klDbPerKmPerGM3: 0 };

/** K_L, dB per kg/m^2 of integrated liquid water (Eqs. 12-14). */
export function cloudMassAbsorptionDbPerKgM2(freqGhz: number): number {
  checkP840Frequency(freqGhz);
  waterPermittivity(freqGhz, P840_CLOUD_TEMPERATURE_K, scratch);
  const d1 = freqGhz + 23.9589;
  const d2 = freqGhz - 219.2096;
  const scale = 0.1522 * Math.exp(-(d1 * d1) / 3.2991e3) + 11.51 * Math.exp(-(d2 * d2) / 2.7595e6) - 10.4912;
  return scratch.klDbPerKmPerGM3 * scale;
}

/** Slant factor replacing 1/sin(el): 1/sin for el >= 5°, thin-layer curved path below. */
export function cloudSlantFactor(elevationDeg: number): number {
  const s = Math.sin(elevationDeg * DEG_TO_RAD);
  if (elevationDeg >= 5) return 1 / s;
  return 1 / Math.sqrt(s * s + (2 * CLOUD_LAYER_HEIGHT_KM) / ITU_EFFECTIVE_EARTH_RADIUS_KM);
}

/** Cloud attenuation A = K_L L / sin(el), dB (Eq. 13; low-elevation factor as above). */
export function cloudAttenuationDb(massAbsorptionDbPerKgM2: number, liquidWaterKgM2: number, elevationDeg: number): number {
  return massAbsorptionDbPerKgM2 * liquidWaterKgM2 * cloudSlantFactor(elevationDeg);
}
