/**
 * The atmosphere at one station, frequency and exceedance, split into the part that does
 * not depend on elevation (prepared once: line-by-line gas sums, P.838 coefficients,
 * P.840 K_L, scintillation constants) and a cheap, allocation-free evaluation per elevation.
 * Models: ITU-R P.676-13 (gas), P.618-14 §2.2.1.1 (rain), §2.4.1 (scintillation),
 * P.840-9 (clouds), P.618-14 §2.5 (combination), P.618-14 §3 (sky noise); see each file.
 *
 * Input validation (ModelRangeError, field named as in AtmosphereInput):
 *   frequency 1..55 GHz when rain is modelled (P.618 rain), else 1..200 GHz (P.840; P.676
 *   Annex 2 reaches 350 GHz); exceedance 0.001..10 %; elevation 0..90°; and plausible
 *   ranges for the station and weather inputs listed in checkInput().
 * Rain: modelled when both rainRate001MmH and rainHeightKm are present (one without the
 * other is an error). P.618 rain is defined for p <= 5 %; for 5 < p <= 10 % the total has no rain
 * term (P.618-14 §2.5 Eq. 66: AT = AG + sqrt(AC^2 + AS^2) for 5 % < p <= 50 %; the validation
 * workbook's CCDF rows show AR = 0 at p = 20 %). Cloud: absent cloudLiquidWaterKgM2 -> 0 dB.
 */

import { ModelRangeError } from '../../errors.js';
import { totalAttenuationDb } from './combine.js';
import { gasSlantAttenuationDb, gasZenith, type GasZenith } from './p676.js';
import { newRainDetail, newRainPath, prepareRainPath, rainAtExceedanceDb, rainAttenuationDb, rainAttenuationDetail, type RainPath } from './p618-rain.js';
import {
  newScintillationPath,
  prepareScintillationPath,
  scintillationFadeDb,
  type ScintillationPath,
} from './p618-scintillation.js';
import { cloudAttenuationDb, cloudMassAbsorptionDbPerKgM2 } from './p840.js';
import { skyNoiseTemperatureK } from './sky-noise.js';
import type { AtmosphereInput, AtmosphereResult } from './types.js';

export const MIN_FREQ_GHZ = 1;
export const MAX_FREQ_WITH_RAIN_GHZ = 55;
export const MAX_FREQ_WITHOUT_RAIN_GHZ = 200;
export const MIN_EXCEEDANCE_PERCENT = 0.001;
export const MAX_EXCEEDANCE_PERCENT = 10;
/** Upper limit of P.618-14 §2.2.1.1 and of Eq. 65; above it the total has no rain term (Eq. 66). */
export const RAIN_MAX_EXCEEDANCE_PERCENT = 5;

export type AtmosphereStationInput = Omit<AtmosphereInput, 'elevationDeg'>;

export interface AtmospherePrepared {
  freqGhz: number;
  stationHeightKm: number;
  gas: GasZenith;
  rainModelled: boolean;
  rain: RainPath;
  scintillation: ScintillationPath;
  /** K_L L, dB at zenith. */
  cloudZenithDb: number;
}

export function newAtmospherePrepared(): AtmospherePrepared {
  return {
    freqGhz: 0,
    stationHeightKm: 0,
    gas: { gammaODbPerKm: 0, gammaWDbPerKm: 0, hOKm: 0, hWKm: 0 },
    rainModelled: false,
    rain: newRainPath(),
    scintillation: newScintillationPath(),
    cloudZenithDb: 0,
  };
}

/** True when the input carries both R0.01 and the rain height, i.e. rain is modelled. */
export function rainModelled(input: AtmosphereStationInput): boolean {
  return input.rainRate001MmH !== undefined && input.rainHeightKm !== undefined;
}

function inRange(model: string, field: string, value: number, lo: number, hi: number, unit: string): void {
  if (!(value >= lo && value <= hi)) {
    throw new ModelRangeError(model, field, value, `${lo}..${hi}${unit}`);
  }
}

const INPUT = 'atmosphere input';

function checkInput(input: AtmosphereStationInput): boolean {
  const withRain = rainModelled(input);
  if (!withRain && (input.rainRate001MmH !== undefined || input.rainHeightKm !== undefined)) {
    const missing = input.rainRate001MmH === undefined ? 'rainRate001MmH' : 'rainHeightKm';
    throw new ModelRangeError(INPUT, missing, Number.NaN, 'rainRate001MmH and rainHeightKm are given together');
  }
  const freqGhz = input.frequencyHz / 1e9;
  if (withRain) inRange('ITU-R P.618-14 rain', 'frequencyHz/1e9', freqGhz, MIN_FREQ_GHZ, MAX_FREQ_WITH_RAIN_GHZ, ' GHz');
  else inRange('ITU-R P.840-9 / P.676-13', 'frequencyHz/1e9', freqGhz, MIN_FREQ_GHZ, MAX_FREQ_WITHOUT_RAIN_GHZ, ' GHz');
  inRange(INPUT, 'exceedancePercent', input.exceedancePercent, MIN_EXCEEDANCE_PERCENT, MAX_EXCEEDANCE_PERCENT, ' %');
  inRange(INPUT, 'latitudeDeg', input.latitudeDeg, -90, 90, ' deg');
  inRange(INPUT, 'stationHeightKm', input.stationHeightKm, -1, 10, ' km');
  inRange(INPUT, 'polarizationTiltDeg', input.polarizationTiltDeg, -180, 180, ' deg');
  if (!(input.antennaDiameterM > 0 && input.antennaDiameterM <= 300)) {
    throw new ModelRangeError(INPUT, 'antennaDiameterM', input.antennaDiameterM, '> 0 and <= 300 m');
  }
  if (!(input.apertureEfficiency > 0 && input.apertureEfficiency <= 1)) {
    throw new ModelRangeError(INPUT, 'apertureEfficiency', input.apertureEfficiency, '> 0 and <= 1');
  }
  inRange(INPUT, 'surfaceWaterVapourDensityGM3', input.surfaceWaterVapourDensityGM3, 0, 50, ' g/m^3');
  inRange(INPUT, 'surfaceTemperatureK', input.surfaceTemperatureK, 200, 330, ' K');
  inRange(INPUT, 'surfacePressureHpa', input.surfacePressureHpa, 300, 1100, ' hPa');
  inRange(INPUT, 'nWetMedian', input.nWetMedian, 0, 300, ' N-units');
  if (input.cloudLiquidWaterKgM2 !== undefined) {
    inRange(INPUT, 'cloudLiquidWaterKgM2', input.cloudLiquidWaterKgM2, 0, 20, ' kg/m^2');
  }
  if (withRain) {
    inRange(INPUT, 'rainRate001MmH', input.rainRate001MmH as number, 0, 500, ' mm/h');
    inRange(INPUT, 'rainHeightKm', input.rainHeightKm as number, -1, 15, ' km');
  }
  return withRain;
}

/** Validates the input and fills out with everything that does not depend on elevation. */
export function prepareAtmosphere(input: AtmosphereStationInput, out: AtmospherePrepared): AtmospherePrepared {
  const withRain = checkInput(input);
  const freqGhz = input.frequencyHz / 1e9;
  out.freqGhz = freqGhz;
  out.stationHeightKm = input.stationHeightKm;
  gasZenith(freqGhz, input.surfacePressureHpa, input.surfaceTemperatureK, input.surfaceWaterVapourDensityGM3, out.gas);
  if (!(out.gas.hOKm > 0)) {
    throw new ModelRangeError('ITU-R P.676-13 Annex 2', 'oxygen equivalent height (from surface inputs)', out.gas.hOKm, '> 0 km');
  }
  out.rainModelled = withRain && input.exceedancePercent <= RAIN_MAX_EXCEEDANCE_PERCENT;
  if (out.rainModelled) {
    prepareRainPath(
      freqGhz,
      input.exceedancePercent,
      input.latitudeDeg,
      input.stationHeightKm,
      input.rainHeightKm as number,
      input.rainRate001MmH as number,
      input.polarizationTiltDeg,
      out.rain,
    );
  }
  prepareScintillationPath(
    freqGhz,
    input.exceedancePercent,
    input.nWetMedian,
    input.antennaDiameterM,
    input.apertureEfficiency,
    out.scintillation,
  );
  const liquidKgM2 = input.cloudLiquidWaterKgM2 ?? 0;
  out.cloudZenithDb = liquidKgM2 > 0 ? cloudMassAbsorptionDbPerKgM2(freqGhz) * liquidKgM2 : 0;
  return out;
}

export function checkElevation(elevationDeg: number, minDeg = 0): void {
  if (!(elevationDeg >= minDeg && elevationDeg <= 90)) {
    throw new ModelRangeError('atmosphere', 'elevationDeg', elevationDeg, `${minDeg}..90 deg`);
  }
}

/** The four model terms at one elevation (no combination), allocation-free. */
export function evaluateTerms(prep: AtmospherePrepared, elevationDeg: number, out: AtmosphereResult): void {
  out.gasDb = gasSlantAttenuationDb(prep.gas, elevationDeg, prep.stationHeightKm);
  out.rainDb = prep.rainModelled ? rainAttenuationDb(prep.rain, elevationDeg) : 0;
  out.cloudDb = prep.cloudZenithDb > 0 ? cloudAttenuationDb(prep.cloudZenithDb, 1, elevationDeg) : 0;
  out.scintillationDb = scintillationFadeDb(prep.scintillation, elevationDeg);
}

/** The absorptive terms AG + AR + AC at one elevation (no scintillation), dB. */
export function absorptionDb(prep: AtmospherePrepared, elevationDeg: number): number {
  const gas = gasSlantAttenuationDb(prep.gas, elevationDeg, prep.stationHeightKm);
  const rain = prep.rainModelled ? rainAttenuationDb(prep.rain, elevationDeg) : 0;
  const cloud = prep.cloudZenithDb > 0 ? cloudAttenuationDb(prep.cloudZenithDb, 1, elevationDeg) : 0;
  return gas + rain + cloud;
}

/** True when two prepared rain paths differ only in their exceedance (steps 2-9 shared). */
export function sameRainPath(a: AtmospherePrepared, b: AtmospherePrepared): boolean {
  const x = a.rain;
  const y = b.rain;
  return (
    a.rainModelled && b.rainModelled && x.freqGhz === y.freqGhz && x.absLatitudeDeg === y.absLatitudeDeg && x.stationHeightKm === y.stationHeightKm &&
    x.rainHeightKm === y.rainHeightKm && x.rainRate001MmH === y.rainRate001MmH && x.polarizationTiltDeg === y.polarizationTiltDeg
  );
}

const levelDetail = newRainDetail();

/**
 * absorptionDb of each of preps at one elevation into out; the rain of the levels that
 * share the first rain level's path (sameRainPath) is scaled from its A0.01 (P.618-14 step
 * 10) instead of recomputed.
 */
export function absorptionAtLevelsDb(preps: readonly AtmospherePrepared[], elevationDeg: number, out: number[]): void {
  const first = preps.find((p) => p.rainModelled);
  if (first) rainAttenuationDetail(first.rain, elevationDeg, levelDetail);
  preps.forEach((prep, k) => {
    if (!first || !prep.rainModelled || !sameRainPath(first, prep)) {
      out[k] = absorptionDb(prep, elevationDeg);
      return;
    }
    const gas = gasSlantAttenuationDb(prep.gas, elevationDeg, prep.stationHeightKm);
    const cloud = prep.cloudZenithDb > 0 ? cloudAttenuationDb(prep.cloudZenithDb, 1, elevationDeg) : 0;
    out[k] = gas + rainAtExceedanceDb(prep.rain, levelDetail, elevationDeg, prep.rain.exceedancePercent) + cloud;
  });
}

/** Fills totalDb (P.618-14 §2.5) and skyNoiseTempK (§3, absorptive terms only) from the terms. */
export function combineTerms(out: AtmosphereResult): void {
  out.totalDb = totalAttenuationDb(out.gasDb, out.rainDb, out.cloudDb, out.scintillationDb);
  out.skyNoiseTempK = skyNoiseTemperatureK(out.gasDb + out.rainDb + out.cloudDb);
}
