/**
 * A station's climate: every input the atmosphere models take, each from the network file
 * when it gives one, else from the ITU-R maps for the station's latitude, longitude and
 * height, with where it came from (the map and its Recommendation's revision, or "file").
 *
 *   R0.01              ITU-R P.837-7 Annex 1 (shipped 0.25 deg grid, p837-7.ts)
 *   rain height        ITU-R P.839-4: h0 + 0.36 km
 *   water vapour rho   ITU-R P.836-6 Annex 2, at the gas/cloud exceedance, scaled to the
 *                      station height
 *   temperature        ITU-R P.1510-1 annual mean
 *   pressure           ITU-R P.835-6 mean annual global reference atmosphere at the height
 *   Nwet (median)      ITU-R P.453-14
 *   cloud liquid water ITU-R P.840-9 at the gas/cloud exceedance
 * Gas/cloud exceedance: Rec. ITU-R P.618-14 §2.5 takes AG and AC at p = 5 % for p < 5 %
 * (as the ITU-R SG3 validation workbook Rev 8.3.0, sheet P.618-14 Att_Tot, does: its AC
 * equals K_L L(5 %) / sin(el) for p = 1, 0.1 and 0.01 %), else at the link's p.
 * A map that cannot serve the station (no value there, an exceedance it is not shipped at)
 * is a ScenarioError naming the station, the field and what is valid.
 */

import { ModelRangeError, ScenarioError } from '../../errors.js';
import type { Climate } from '../../scenario/types.js';
import { rainRate001MmH, R001_SOURCE } from './p837-7.js';
import { rainHeightKm, RAIN_HEIGHT_SOURCE } from './p839-4.js';
import { surfaceWaterVapourDensityGM3, P836_REVISION } from './p836-6.js';
import { annualMeanSurfaceTemperatureK, SURFACE_TEMPERATURE_SOURCE } from './p1510-1.js';
import { standardPressureHpa, PRESSURE_SOURCE } from './p835-6.js';
import { medianWetRefractivity, NWET_SOURCE } from './p453-14.js';
import { cloudLiquidWaterKgM2, P840_REVISION } from './p840-9.js';

/** P.618-14 §2.5: gas and cloud are taken at this exceedance when the link's p is below it, %. */
export const GAS_CLOUD_HOLD_PERCENT = 5;

export type ClimateField = keyof Required<Climate>;

export interface ClimateInput {
  field: ClimateField;
  /** The network file's name of the field (climate.<fileField>). */
  fileField: string;
  label: string;
  unit: string;
  value: number;
  /** "file", or the map (Recommendation and revision) it was read from. */
  source: string;
}

export interface StationClimate {
  values: Required<Climate>;
  inputs: ClimateInput[];
  /** The link's exceedance, and the one gas and cloud inputs are taken at, %. */
  exceedancePercent: number;
  gasCloudExceedancePercent: number;
}

export interface ClimateSite {
  id: string;
  latitudeDeg: number;
  longitudeDeg: number;
  heightKm: number;
  climate: Climate;
}

const FIELDS: { field: ClimateField; fileField: string; label: string; unit: string }[] = [
  { field: 'rainRate001MmH', fileField: 'rainRate001MmH', label: 'Rain rate R0.01', unit: 'mm/h' },
  { field: 'rainHeightKm', fileField: 'rainHeightKm', label: 'Rain height', unit: 'km' },
  { field: 'surfaceWaterVapourDensityGM3', fileField: 'waterVapourDensityGM3', label: 'Surface water vapour density', unit: 'g/m3' },
  { field: 'surfaceTemperatureK', fileField: 'temperatureK', label: 'Surface temperature', unit: 'K' },
  { field: 'surfacePressureHpa', fileField: 'pressureHpa', label: 'Surface pressure', unit: 'hPa' },
  { field: 'nWetMedian', fileField: 'nWetMedian', label: 'Wet refractivity Nwet (median)', unit: 'N-units' },
  { field: 'cloudLiquidWaterKgM2', fileField: 'cloudLiquidWaterKgM2', label: 'Cloud liquid water', unit: 'kg/m2' },
];

/** The exceedance gas and cloud are taken at for a link exceedance p (P.618-14 §2.5). */
export function gasCloudExceedancePercent(linkExceedancePercent: number): number {
  return Math.max(linkExceedancePercent, GAS_CLOUD_HOLD_PERCENT);
}

/** stationClimate's values by site content and exceedance (the maps are pure functions of them). */
const valuesMemo = new Map<string, Readonly<Required<Climate>>>();

/**
 * The climate values of stationClimate (site.climate's values, else the maps'), remembered
 * per site content and exceedance: the link engine asks for them once per radio, station
 * and exceedance level. Read-only: the same object is returned to every caller.
 */
export function stationClimateValues(site: ClimateSite, linkExceedancePercent: number): Readonly<Required<Climate>> {
  let key = `${keyNum(site.latitudeDeg)}|${keyNum(site.longitudeDeg)}|${keyNum(site.heightKm)}|${keyNum(linkExceedancePercent)}`;
  for (const f of FIELDS) key += `|${keyNum(site.climate[f.field])}`;
  let v = valuesMemo.get(key);
  if (v === undefined) {
    v = stationClimate(site, linkExceedancePercent).values;
    valuesMemo.set(key, v);
  }
  return v;
}

/** A number as a memo key part (-0 kept apart from 0; undefined as "u"). */
function keyNum(v: number | undefined): string {
  return v === undefined ? 'u' : Object.is(v, -0) ? '-0' : String(v);
}

/** Every climate input of a station for a link at linkExceedancePercent, with its source. */
export function stationClimate(site: ClimateSite, linkExceedancePercent: number): StationClimate {
  const lat = site.latitudeDeg;
  const lon = site.longitudeDeg;
  const hKm = site.heightKm;
  const pGas = gasCloudExceedancePercent(linkExceedancePercent);
  const fromMap: Record<ClimateField, () => { value: number; source: string }> = {
    rainRate001MmH: () => ({ value: rainRate001MmH(lat, lon), source: R001_SOURCE }),
    rainHeightKm: () => ({ value: rainHeightKm(lat, lon), source: RAIN_HEIGHT_SOURCE }),
    surfaceWaterVapourDensityGM3: () => ({
      value: surfaceWaterVapourDensityGM3(lat, lon, pGas, hKm),
      source: `${P836_REVISION} Annex 2 (rho map at ${pGas} %, scaled to ${hKm.toFixed(3)} km)`,
    }),
    surfaceTemperatureK: () => ({ value: annualMeanSurfaceTemperatureK(lat, lon), source: SURFACE_TEMPERATURE_SOURCE }),
    surfacePressureHpa: () => ({ value: standardPressureHpa(hKm), source: `${PRESSURE_SOURCE.replace('the station height', `${hKm.toFixed(3)} km`)}` }),
    nWetMedian: () => ({ value: medianWetRefractivity(lat, lon), source: NWET_SOURCE }),
    cloudLiquidWaterKgM2: () => ({ value: cloudLiquidWaterKgM2(lat, lon, pGas), source: `${P840_REVISION} (L map at ${pGas} %)` }),
  };
  const values = {} as Required<Climate>;
  const inputs: ClimateInput[] = [];
  const problems: { file: string; path: string; message: string }[] = [];
  for (const f of FIELDS) {
    const typed = site.climate[f.field];
    let value: number;
    let source: string;
    if (typed !== undefined) {
      value = typed;
      source = 'file';
    } else {
      try {
        ({ value, source } = fromMap[f.field]());
      } catch (err) {
        if (!(err instanceof ModelRangeError)) throw err;
        problems.push({ file: `station ${site.id}`, path: `climate.${f.fileField}`, message: `${err.message}; or give climate.${f.fileField} in the network file` });
        continue;
      }
    }
    values[f.field] = value;
    inputs.push({ ...f, value, source });
  }
  if (problems.length > 0) throw new ScenarioError(problems);
  return { values, inputs, exceedancePercent: linkExceedancePercent, gasCloudExceedancePercent: pGas };
}
