/**
 * Attenuation by atmospheric gases: Rec. ITU-R P.676-13 (08/2022).
 *
 * Annex 1 §1 (line-by-line specific attenuation):
 *   gamma = gamma_o + gamma_w = 0.1820 f (N''_Oxygen(f) + N''_WaterVapour(f))   (Eq. 1), dB/km
 *   N''_Oxygen = sum_i S_i F_i + N''_D(f),  N''_WaterVapour = sum_i S_i F_i      (Eqs. 2a-2b)
 *   S (oxygen) = a1 1e-7 p theta^3 exp(a2 (1 - theta))                          (Eq. 3)
 *   S (water)  = b1 1e-1 e theta^3.5 exp(b2 (1 - theta))
 *   F_i line shape with interference delta                                      (Eq. 5)
 *   oxygen width a3 1e-4 (p theta^(0.8-a4) + 1.1 e theta), Zeeman sqrt(df^2 + 2.25e-6)  (Eqs. 6a)
 *   water width b3 1e-4 (p theta^b4 + b5 e theta^b6), Doppler 0.535 df + sqrt(0.217 df^2
 *     + 2.1316e-12 f0^2 / theta)                                                (Eq. 6b)
 *   delta (oxygen) = (a5 + a6 theta) 1e-4 (p + e) theta^0.8, delta (water) = 0   (Eq. 7)
 *   dry continuum N''_D                                                          (Eqs. 8-9)
 * theta = 300/T, p dry pressure (hPa), e = rho T / 216.7 water-vapour pressure (hPa) (Eq. 4).
 * Line data: p676-13-oxygen-lines.ts (Table 1), p676-13-water-lines.ts (Table 2).
 *
 * Annex 2 §2.1 (instantaneous slant path from surface pressure Ps, temperature Ts,
 * water-vapour density rho at the station):
 *   Ao = gamma_o h0,  h0 = a0 + b0 Ts + c0 Ps + d0 rho     (Eq. 31, data p676-13-h0.ts,
 *        linear interpolation between tabulated frequencies)
 *   Aw = gamma_w hw,  hw = 5.6585e-5 f + 1.8348 + sum_i a_i / ((f - f_i)^2 + b_i)  (Eq. 37, Table 4)
 *   A  = (Ao + Aw) / sin(el)                                for 5° <= el <= 90°
 * Below 5° P.676-13 Annex 2 gives no formula. We use the curved-Earth form of the earlier
 * Annex 2 (Rec. ITU-R P.676-11 (09/2016) Annex 2 §2.2.2, equations for 0..5°, transcribed
 * from memory and checked against a public implementation of that edition):
 *   A = sum_{o,w} gamma h^{1/2} (Re + hs)^{1/2} F(tan(el) ((Re + hs)/h)^{1/2}) / cos(el),
 *   F(x) = 1 / (0.661 x + 0.339 (x^2 + 5.51)^{1/2}),  Re = 8500 km (effective Earth radius),
 * with the station term exp(-hs/h) of that edition omitted because gamma and h here already
 * use the conditions measured at the station. This is the airmass of an exponential layer
 * over a curved Earth; at 5° it gives about 7 % less than 1/sin(5°) (so A steps at 5°).
 *
 * Valid range: 1..350 GHz (Annex 2; outside: ModelRangeError). Units: f GHz, pressures hPa,
 * T K, rho g/m^3, heights km, gamma dB/km, A dB.
 */

import { ModelRangeError } from '../../errors.js';
import { P676_13_H0_COEFFICIENTS, P676_13_H0_STRIDE } from './p676-13-h0.js';
import { P676_13_OXYGEN_LINES, P676_13_OXYGEN_LINE_STRIDE } from './p676-13-oxygen-lines.js';
import { P676_13_WATER_LINES, P676_13_WATER_LINE_STRIDE } from './p676-13-water-lines.js';
import { ITU_EFFECTIVE_EARTH_RADIUS_KM } from '../../geometry/earth.js';

const DEG_TO_RAD = Math.PI / 180;
export const P676_MIN_FREQ_GHZ = 1;
export const P676_MAX_FREQ_GHZ = 350;
/** Effective Earth radius used by the low-elevation path (P.676-11 Annex 2 §2.2.2), km. */
/** Elevation below which the curved-Earth path replaces 1/sin(el), degrees. */
export const P676_LOW_ELEVATION_LIMIT_DEG = 5;

export function checkP676Frequency(freqGhz: number): void {
  if (!(freqGhz >= P676_MIN_FREQ_GHZ && freqGhz <= P676_MAX_FREQ_GHZ)) {
    throw new ModelRangeError('ITU-R P.676-13 Annex 2', 'frequencyGHz', freqGhz, '1..350 GHz');
  }
}

/** Water-vapour partial pressure e = rho T / 216.7, hPa (Annex 1 Eq. 4). */
export function vapourPressureHpa(waterVapourDensityGM3: number, temperatureK: number): number {
  return (waterVapourDensityGM3 * temperatureK) / 216.7;
}

function lineShape(freqGhz: number, lineGhz: number, widthGhz: number, delta: number): number {
  const dm = lineGhz - freqGhz;
  const dp = lineGhz + freqGhz;
  const w2 = widthGhz * widthGhz;
  return (
    (freqGhz / lineGhz) *
    ((widthGhz - delta * dm) / (dm * dm + w2) + (widthGhz - delta * dp) / (dp * dp + w2))
  );
}

/** N''_Oxygen(f): oxygen lines plus dry continuum (Annex 1 Eqs. 2a, 3, 5-9). */
export function oxygenImaginaryRefractivity(
  freqGhz: number,
  pDryHpa: number,
  eHpa: number,
  temperatureK: number,
): number {
  const theta = 300 / temperatureK;
  const lines = P676_13_OXYGEN_LINES;
  let sum = 0;
  for (let i = 0; i < lines.length; i += P676_13_OXYGEN_LINE_STRIDE) {
    const f0 = lines[i] as number;
    const a1 = lines[i + 1] as number;
    const a2 = lines[i + 2] as number;
    const a3 = lines[i + 3] as number;
    const a4 = lines[i + 4] as number;
    const a5 = lines[i + 5] as number;
    const a6 = lines[i + 6] as number;
    const strength = a1 * 1e-7 * pDryHpa * theta * theta * theta * Math.exp(a2 * (1 - theta));
    let width = a3 * 1e-4 * (pDryHpa * Math.pow(theta, 0.8 - a4) + 1.1 * eHpa * theta);
    width = Math.sqrt(width * width + 2.25e-6);
    const delta = (a5 + a6 * theta) * 1e-4 * (pDryHpa + eHpa) * Math.pow(theta, 0.8);
    sum += strength * lineShape(freqGhz, f0, width, delta);
  }
  const d = 5.6e-4 * (pDryHpa + eHpa) * Math.pow(theta, 0.8);
  const fd = freqGhz / d;
  const dryContinuum =
    freqGhz *
    pDryHpa *
    theta *
    theta *
    (6.14e-5 / (d * (1 + fd * fd)) +
      (1.4e-12 * pDryHpa * Math.pow(theta, 1.5)) / (1 + 1.9e-5 * Math.pow(freqGhz, 1.5)));
  return sum + dryContinuum;
}

/** N''_WaterVapour(f) (Annex 1 Eqs. 2b, 3, 5-6). */
export function waterVapourImaginaryRefractivity(
  freqGhz: number,
  pDryHpa: number,
  eHpa: number,
  temperatureK: number,
): number {
  const theta = 300 / temperatureK;
  const lines = P676_13_WATER_LINES;
  let sum = 0;
  for (let i = 0; i < lines.length; i += P676_13_WATER_LINE_STRIDE) {
    const f0 = lines[i] as number;
    const b1 = lines[i + 1] as number;
    const b2 = lines[i + 2] as number;
    const b3 = lines[i + 3] as number;
    const b4 = lines[i + 4] as number;
    const b5 = lines[i + 5] as number;
    const b6 = lines[i + 6] as number;
    const strength = b1 * 1e-1 * eHpa * Math.pow(theta, 3.5) * Math.exp(b2 * (1 - theta));
    let width = b3 * 1e-4 * (pDryHpa * Math.pow(theta, b4) + b5 * eHpa * Math.pow(theta, b6));
    width = 0.535 * width + Math.sqrt(0.217 * width * width + (2.1316e-12 * f0 * f0) / theta);
    sum += strength * lineShape(freqGhz, f0, width, 0);
  }
  return sum;
}

/** gamma_o, dB/km (Annex 1 Eq. 1, oxygen part including the dry continuum). */
export function oxygenSpecificAttenuationDbPerKm(
  freqGhz: number,
  pDryHpa: number,
  eHpa: number,
  temperatureK: number,
): number {
  return 0.182 * freqGhz * oxygenImaginaryRefractivity(freqGhz, pDryHpa, eHpa, temperatureK);
}

/** gamma_w, dB/km (Annex 1 Eq. 1, water-vapour part). */
export function waterVapourSpecificAttenuationDbPerKm(
  freqGhz: number,
  pDryHpa: number,
  eHpa: number,
  temperatureK: number,
): number {
  return 0.182 * freqGhz * waterVapourImaginaryRefractivity(freqGhz, pDryHpa, eHpa, temperatureK);
}

/**
 * Oxygen equivalent height h0, km (Annex 2 Eq. 31), coefficients linearly interpolated in
 * frequency between tabulated rows.
 */
export function oxygenEquivalentHeightKm(
  freqGhz: number,
  temperatureK: number,
  totalPressureHpa: number,
  waterVapourDensityGM3: number,
): number {
  checkP676Frequency(freqGhz);
  const t = P676_13_H0_COEFFICIENTS;
  const s = P676_13_H0_STRIDE;
  const rows = t.length / s;
  let lo = 0;
  let hi = rows - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((t[mid * s] as number) <= freqGhz) lo = mid;
    else hi = mid;
  }
  const f0 = t[lo * s] as number;
  const f1 = t[hi * s] as number;
  const w = f1 > f0 ? (freqGhz - f0) / (f1 - f0) : 0;
  const coef = (k: number): number =>
    (t[lo * s + k] as number) + w * ((t[hi * s + k] as number) - (t[lo * s + k] as number));
  return coef(1) + coef(2) * temperatureK + coef(3) * totalPressureHpa + coef(4) * waterVapourDensityGM3;
}

/** Water-vapour equivalent height hw, km (Annex 2 Eq. 37, Table 4). */
export function waterVapourEquivalentHeightKm(freqGhz: number): number {
  checkP676Frequency(freqGhz);
  const d1 = freqGhz - 22.23508;
  const d2 = freqGhz - 183.310087;
  const d3 = freqGhz - 325.152888;
  return (
    5.6585e-5 * freqGhz +
    1.8348 +
    2.6846 / (d1 * d1 + 2.7649) +
    5.8905 / (d2 * d2 + 4.9219) +
    2.981 / (d3 * d3 + 3.0748)
  );
}

/** Zenith quantities of Annex 2 §2.1 at one station and frequency. */
export interface GasZenith {
  gammaODbPerKm: number;
  gammaWDbPerKm: number;
  hOKm: number;
  hWKm: number;
}

/**
 * Annex 2 §2.1 instantaneous inputs -> specific attenuations and equivalent heights.
 * surfacePressureHpa is the total (barometric) pressure; dry pressure = Ps - e.
 */
export function gasZenith(
  freqGhz: number,
  surfacePressureHpa: number,
  surfaceTemperatureK: number,
  waterVapourDensityGM3: number,
  out: GasZenith,
): GasZenith {
  checkP676Frequency(freqGhz);
  const eHpa = vapourPressureHpa(waterVapourDensityGM3, surfaceTemperatureK);
  const pDryHpa = surfacePressureHpa - eHpa;
  out.gammaODbPerKm = oxygenSpecificAttenuationDbPerKm(freqGhz, pDryHpa, eHpa, surfaceTemperatureK);
  out.gammaWDbPerKm = waterVapourSpecificAttenuationDbPerKm(freqGhz, pDryHpa, eHpa, surfaceTemperatureK);
  out.hOKm = oxygenEquivalentHeightKm(freqGhz, surfaceTemperatureK, surfacePressureHpa, waterVapourDensityGM3);
  out.hWKm = waterVapourEquivalentHeightKm(freqGhz);
  return out;
}

function curvedEarthPathKm(heightKm: number, elevationRad: number, stationHeightKm: number): number {
  const r = ITU_EFFECTIVE_EARTH_RADIUS_KM + stationHeightKm;
  const x = Math.tan(elevationRad) * Math.sqrt(r / heightKm);
  const f = 1 / (0.661 * x + 0.339 * Math.sqrt(x * x + 5.51));
  return (Math.sqrt(heightKm * r) * f) / Math.cos(elevationRad);
}

/**
 * Slant-path gaseous attenuation, dB: (gamma_o h0 + gamma_w hw)/sin(el) for el >= 5°,
 * the curved-Earth form (see head comment) below 5°. elevationDeg in 0..90.
 */
export function gasSlantAttenuationDb(z: GasZenith, elevationDeg: number, stationHeightKm: number): number {
  const elRad = elevationDeg * DEG_TO_RAD;
  if (elevationDeg >= P676_LOW_ELEVATION_LIMIT_DEG) {
    return (z.gammaODbPerKm * z.hOKm + z.gammaWDbPerKm * z.hWKm) / Math.sin(elRad);
  }
  return (
    z.gammaODbPerKm * curvedEarthPathKm(z.hOKm, elRad, stationHeightKm) +
    z.gammaWDbPerKm * curvedEarthPathKm(z.hWKm, elRad, stationHeightKm)
  );
}
