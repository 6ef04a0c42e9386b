/**
 * Rain attenuation exceeded for p % of an average year on an Earth-space path:
 * Rec. ITU-R P.618-14 (08/2023), §2.2.1.1, steps 1-10 (Eqs. 1-8 of that section).
 *
 *  1. hR rain height (input, P.839).                  6. r001 = 1/(1 + 0.78 sqrt(LG gR / f) - 0.38 (1 - e^(-2 LG)))
 *  2. Ls = (hR - hs)/sin(el) for el >= 5°, else        7. zeta = atan((hR - hs)/(LG r001));
 *     2 (hR - hs)/(sqrt(sin^2 el + 2 (hR - hs)/Re) + sin el),  LR = LG r001/cos(el) if zeta > el, else (hR - hs)/sin(el);
 *     Re = 8500 km; hR - hs <= 0 -> A = 0.                chi = 36 - |lat| if |lat| < 36 else 0;
 *  3. LG = Ls cos(el).                                    nu001 = 1/(1 + sqrt(sin el) (31 (1 - e^(-el/(1+chi)))
 *  4. R001 (input, P.837); R001 = 0 -> A = 0.                     sqrt(LR gR)/f^2 - 0.45))
 *  5. gR = k R001^alpha (P.838-3, p838.ts).            8. LE = LR nu001.   9. A001 = gR LE.
 * 10. beta = 0 if p >= 1 % or |lat| >= 36°; -0.005 (|lat| - 36) if el >= 25°;
 *     else -0.005 (|lat| - 36) + 1.8 - 4.25 sin(el);
 *     Ap = A001 (p/0.01)^-(0.655 + 0.033 ln p - 0.045 ln A001 - beta (1 - p) sin el).
 *
 * Valid range: f 1..55 GHz, p 0.001..5 % (outside: ModelRangeError), el 0..90°.
 * Units: f GHz, heights km, R mm/h, lat and el degrees, A dB. Angles inside exp(-el/(1+chi))
 * and in zeta are in degrees as in the Recommendation.
 */

import { ModelRangeError } from '../../errors.js';
import {
  p838HvCoefficients,
  p838PathCoefficients,
  rainSpecificAttenuationDbPerKm,
  type P838HvCoefficients,
  type P838PathCoefficients,
} from './p838.js';
import { ITU_EFFECTIVE_EARTH_RADIUS_KM } from '../../geometry/earth.js';

const DEG_TO_RAD = Math.PI / 180;
const RAD_TO_DEG = 180 / Math.PI;
/** Effective radius of the Earth, km (P.618-14 §2.2.1.1 step 2). */
export const P618_RAIN_MAX_FREQ_GHZ = 55;
export const P618_RAIN_MIN_PERCENT = 0.001;
export const P618_RAIN_MAX_PERCENT = 5;

/** Inputs that do not depend on elevation, prepared once. */
export interface RainPath {
  freqGhz: number;
  exceedancePercent: number;
  absLatitudeDeg: number;
  stationHeightKm: number;
  rainHeightKm: number;
  rainRate001MmH: number;
  polarizationTiltDeg: number;
  hv: P838HvCoefficients;
}

/** Intermediate values of the ten steps (for checks against the validation workbook). */
export interface RainDetail {
  slantLengthKm: number;
  horizontalProjectionKm: number;
  gammaRDbPerKm: number;
  r001: number;
  nu001: number;
  effectiveLengthKm: number;
  /** Step 7 angle zeta, degrees (LR uses the horizontal branch when zeta > el). */
  zetaDeg: number;
  a001Db: number;
  beta: number;
  attenuationDb: number;
}

export function newRainDetail(): RainDetail {
  return {
    slantLengthKm: 0,
    horizontalProjectionKm: 0,
    gammaRDbPerKm: 0,
    r001: 0,
    nu001: 0,
    effectiveLengthKm: 0,
    zetaDeg: 0,
    a001Db: 0,
    beta: 0,
    attenuationDb: 0,
  };
}

/** Validates and prepares the elevation-independent part. */
export function prepareRainPath(
  freqGhz: number,
  exceedancePercent: number,
  latitudeDeg: number,
  stationHeightKm: number,
  rainHeightKm: number,
  rainRate001MmH: number,
  polarizationTiltDeg: number,
  out: RainPath,
): RainPath {
  if (!(freqGhz >= 1 && freqGhz <= P618_RAIN_MAX_FREQ_GHZ)) {
    throw new ModelRangeError('ITU-R P.618-14 §2.2.1.1 rain', 'frequencyGHz', freqGhz, '1..55 GHz');
  }
  if (!(exceedancePercent >= P618_RAIN_MIN_PERCENT && exceedancePercent <= P618_RAIN_MAX_PERCENT)) {
    throw new ModelRangeError('ITU-R P.618-14 §2.2.1.1 rain', 'exceedancePercent', exceedancePercent, '0.001..5 %');
  }
  if (!(rainRate001MmH >= 0 && Number.isFinite(rainRate001MmH))) {
    throw new ModelRangeError('ITU-R P.618-14 §2.2.1.1 rain', 'rainRate001MmH', rainRate001MmH, '>= 0 mm/h');
  }
  if (!Number.isFinite(rainHeightKm)) {
    throw new ModelRangeError('ITU-R P.618-14 §2.2.1.1 rain', 'rainHeightKm', rainHeightKm, 'a finite height in km');
  }
  out.freqGhz = freqGhz;
  out.exceedancePercent = exceedancePercent;
  out.absLatitudeDeg = Math.abs(latitudeDeg);
  out.stationHeightKm = stationHeightKm;
  out.rainHeightKm = rainHeightKm;
  out.rainRate001MmH = rainRate001MmH;
  out.polarizationTiltDeg = polarizationTiltDeg;
  p838HvCoefficients(freqGhz, out.hv);
  return out;
}

export function newRainPath(): RainPath {
  return {
    freqGhz: 0,
    exceedancePercent: 0,
    absLatitudeDeg: 0,
    stationHeightKm: 0,
    rainHeightKm: 0,
    rainRate001MmH: 0,
    polarizationTiltDeg: 0,
    hv: { kH: 0, kV: 0, alphaH: 0, alphaV: 0 },
  };
}

const scratchPath: P838PathCoefficients = { k: 0, alpha: 0 };

/** Steps 2-10 at one elevation (0..90°); writes every intermediate into d; returns Ap, dB. */
export function rainAttenuationDetail(rp: RainPath, elevationDeg: number, d: RainDetail): number {
  const dh = rp.rainHeightKm - rp.stationHeightKm;
  d.slantLengthKm = 0;
  d.horizontalProjectionKm = 0;
  d.gammaRDbPerKm = 0;
  d.r001 = 0;
  d.nu001 = 0;
  d.effectiveLengthKm = 0;
  d.zetaDeg = 0;
  d.a001Db = 0;
  d.beta = 0;
  d.attenuationDb = 0;
  if (!(dh > 0) || !(rp.rainRate001MmH > 0)) return 0;
  const f = rp.freqGhz;
  const p = rp.exceedancePercent;
  const elRad = elevationDeg * DEG_TO_RAD;
  const sinEl = Math.sin(elRad);
  const cosEl = Math.cos(elRad);
  // Step 2
  const ls =
    elevationDeg >= 5
      ? dh / sinEl
      : (2 * dh) / (Math.sqrt(sinEl * sinEl + (2 * dh) / ITU_EFFECTIVE_EARTH_RADIUS_KM) + sinEl);
  // Step 3
  const lg = ls * cosEl;
  // Step 5
  p838PathCoefficients(rp.hv, elevationDeg, rp.polarizationTiltDeg, scratchPath);
  const gammaR = rainSpecificAttenuationDbPerKm(scratchPath.k, scratchPath.alpha, rp.rainRate001MmH);
  // Step 6
  const r001 = 1 / (1 + 0.78 * Math.sqrt((lg * gammaR) / f) - 0.38 * (1 - Math.exp(-2 * lg)));
  // Step 7
  const zetaDeg = Math.atan2(dh, lg * r001) * RAD_TO_DEG;
  const lr = zetaDeg > elevationDeg ? (lg * r001) / cosEl : dh / sinEl;
  const lat = rp.absLatitudeDeg;
  const chi = lat < 36 ? 36 - lat : 0;
  const nu001 =
    1 /
    (1 +
      Math.sqrt(sinEl) *
        ((31 * (1 - Math.exp(-elevationDeg / (1 + chi))) * Math.sqrt(lr * gammaR)) / (f * f) - 0.45));
  // Steps 8-9
  const le = lr * nu001;
  const a001 = gammaR * le;
  // Step 10
  const beta = step10Beta(p, lat, elevationDeg, sinEl);
  const ap = step10Scaling(a001, p, beta, sinEl);
  d.slantLengthKm = ls;
  d.horizontalProjectionKm = lg;
  d.gammaRDbPerKm = gammaR;
  d.r001 = r001;
  d.nu001 = nu001;
  d.effectiveLengthKm = le;
  d.zetaDeg = zetaDeg;
  d.a001Db = a001;
  d.beta = beta;
  d.attenuationDb = ap;
  return ap;
}

function step10Beta(p: number, absLatitudeDeg: number, elevationDeg: number, sinEl: number): number {
  if (p >= 1 || absLatitudeDeg >= 36) return 0;
  if (elevationDeg >= 25) return -0.005 * (absLatitudeDeg - 36);
  return -0.005 * (absLatitudeDeg - 36) + 1.8 - 4.25 * sinEl;
}

function step10Scaling(a001: number, p: number, beta: number, sinEl: number): number {
  const exponent = -(0.655 + 0.033 * Math.log(p) - 0.045 * Math.log(a001) - beta * (1 - p) * sinEl);
  return a001 * Math.pow(p / 0.01, exponent);
}

/**
 * Step 10 alone: Ap at another exceedance p (0.001..5 %) from a detail that
 * rainAttenuationDetail filled at this elevation for the same path (steps 2-9 do not
 * depend on p). Same result as rainAttenuationDetail at p, for a fraction of the work.
 */
export function rainAtExceedanceDb(rp: RainPath, d: RainDetail, elevationDeg: number, exceedancePercent: number): number {
  if (!(d.a001Db > 0)) return 0;
  const sinEl = Math.sin(elevationDeg * DEG_TO_RAD);
  return step10Scaling(d.a001Db, exceedancePercent, step10Beta(exceedancePercent, rp.absLatitudeDeg, elevationDeg, sinEl), sinEl);
}

const scratchDetail = newRainDetail();

/** Ap, dB, at one elevation (allocation-free). */
export function rainAttenuationDb(rp: RainPath, elevationDeg: number): number {
  return rainAttenuationDetail(rp, elevationDeg, scratchDetail);
}
