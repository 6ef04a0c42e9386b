/**
 * Tropospheric scintillation fade depth exceeded for p % of the time:
 * Rec. ITU-R P.618-14 (08/2023), §2.4.1, steps 1-9.
 *
 *   sigma_ref = 3.6e-3 + 1e-4 Nwet                               (step 3), dB
 *   L = 2 hL / (sqrt(sin^2 el + 2.35e-4) + sin el), hL = 1000 m  (step 4), m
 *   Deff = sqrt(eta) D                                           (step 5), m
 *   x = 1.22 Deff^2 f / L;  g(x) = sqrt(3.86 (x^2 + 1)^(11/12) sin((11/6) atan(1/x)) - 7.08 x^(5/6))
 *     (step 6); when the radicand is negative (x >= 7.0) the fade depth is zero
 *   sigma = sigma_ref f^(7/12) g(x) / (sin el)^1.2               (step 7), dB
 *   a(p) = -0.061 (log10 p)^3 + 0.072 (log10 p)^2 - 1.71 log10 p + 3.0   (step 8)
 *   As(p) = a(p) sigma                                           (step 9), dB
 *
 * Valid range: el >= 5°, p 0.01..50 %, f 4..55 GHz per the Recommendation. Our handling:
 * - el below 5° is evaluated at 5° (clamp; the §2.4.2 low-elevation method needs inputs
 *   we do not carry). This under-states scintillation below 5°; the caller is told by
 *   SCINTILLATION_MIN_ELEVATION_DEG.
 * - p is accepted from 0.001 % : a(p) is extrapolated below 0.01 % exactly as the ITU-R SG3
 *   validation workbook (Rev 8.3.0, sheet P.618-14 Att_Tot CCDF) does for its 0.005..0.002 %
 *   rows. Outside 0.001..50 %: ModelRangeError.
 * - frequency is not range-checked here (the caller's other models bound it).
 * Units: f GHz, D m, eta 0..1, Nwet N-units, el degrees, As dB.
 */

import { ModelRangeError } from '../../errors.js';

const DEG_TO_RAD = Math.PI / 180;
/** Elevation below which the §2.4.1 method is evaluated at this elevation, degrees. */
export const SCINTILLATION_MIN_ELEVATION_DEG = 5;
/** Height of the turbulent layer, m (step 4). */
const TURBULENT_LAYER_HEIGHT_M = 1000;

/** Elevation-independent part, prepared once. */
export interface ScintillationPath {
  freqGhz: number;
  /** sigma_ref f^(7/12), dB. */
  sigmaScaledDb: number;
  /** 1.22 Deff^2 f, m (x = this / L). */
  xNumeratorM: number;
  /** a(p). */
  percentFactor: number;
}

export function newScintillationPath(): ScintillationPath {
  return { freqGhz: 0, sigmaScaledDb: 0, xNumeratorM: 0, percentFactor: 0 };
}

/** a(p) of step 8. */
export function scintillationPercentFactor(exceedancePercent: number): number {
  const lp = Math.log10(exceedancePercent);
  return -0.061 * lp * lp * lp + 0.072 * lp * lp - 1.71 * lp + 3.0;
}

/** sigma_ref of step 3, dB. */
export function scintillationSigmaRefDb(nWetMedian: number): number {
  return 3.6e-3 + 1e-4 * nWetMedian;
}

/** Effective turbulence path length L of step 4, m. */
export function turbulencePathLengthM(elevationDeg: number): number {
  const s = Math.sin(elevationDeg * DEG_TO_RAD);
  return (2 * TURBULENT_LAYER_HEIGHT_M) / (Math.sqrt(s * s + 2.35e-4) + s);
}

/** Aperture averaging factor g(x) of step 6 (0 when the radicand is negative). */
export function apertureAveragingFactor(x: number): number {
  if (x >= 7.0) return 0;
  const r = 3.86 * Math.pow(x * x + 1, 11 / 12) * Math.sin((11 / 6) * Math.atan(1 / x)) - 7.08 * Math.pow(x, 5 / 6);
  return r > 0 ? Math.sqrt(r) : 0;
}

export function prepareScintillationPath(
  freqGhz: number,
  exceedancePercent: number,
  nWetMedian: number,
  antennaDiameterM: number,
  apertureEfficiency: number,
  out: ScintillationPath,
): ScintillationPath {
  if (!(exceedancePercent >= 0.001 && exceedancePercent <= 50)) {
    throw new ModelRangeError('ITU-R P.618-14 §2.4.1 scintillation', 'exceedancePercent', exceedancePercent, '0.001..50 %');
  }
  out.freqGhz = freqGhz;
  out.sigmaScaledDb = scintillationSigmaRefDb(nWetMedian) * Math.pow(freqGhz, 7 / 12);
  out.xNumeratorM = 1.22 * apertureEfficiency * antennaDiameterM * antennaDiameterM * freqGhz;
  out.percentFactor = scintillationPercentFactor(exceedancePercent);
  return out;
}

/** As(p), dB, at elevationDeg (clamped to >= 5°, see head comment). */
export function scintillationFadeDb(sp: ScintillationPath, elevationDeg: number): number {
  const el = elevationDeg < SCINTILLATION_MIN_ELEVATION_DEG ? SCINTILLATION_MIN_ELEVATION_DEG : elevationDeg;
  const x = sp.xNumeratorM / turbulencePathLengthM(el);
  const g = apertureAveragingFactor(x);
  if (g === 0) return 0;
  const sigma = (sp.sigmaScaledDb * g) / Math.pow(Math.sin(el * DEG_TO_RAD), 1.2);
  return sp.percentFactor * sigma;
}

/**
 * Elevation (deg, in 5..90) above which x >= 7 and the fade depth is zero, or +Infinity
 * when x < 7 at every elevation. Closed-form inverse of step 4.
 */
export function scintillationCutoffElevationDeg(sp: ScintillationPath): number {
  const lStarM = sp.xNumeratorM / 7;
  if (!(lStarM > 0)) return Number.POSITIVE_INFINITY;
  const q = (2 * TURBULENT_LAYER_HEIGHT_M) / lStarM; // sqrt(s^2 + c) + s = q
  const s = (q * q - 2.35e-4) / (2 * q);
  if (s >= 1) return Number.POSITIVE_INFINITY;
  if (s <= Math.sin(SCINTILLATION_MIN_ELEVATION_DEG * DEG_TO_RAD)) return SCINTILLATION_MIN_ELEVATION_DEG;
  return Math.asin(s) / DEG_TO_RAD;
}
