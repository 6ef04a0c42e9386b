/**
 * One link budget, term by term, at a stated elevation and/or slant range:
 * the static point a hand-made budget gives, computed by the same chain as
 * every sample of `plan`. With only an elevation, the slant range follows
 * from the orbit's typical radius (SGP4: semi-major axis from the mean motion
 * of the first element set; Moon: its mean distance 384,400 km, common
 * practice; fixed sky: the given range); with only a range, the elevation
 * follows from the same triangle. Handbook overrides replace a modelled term
 * by a given value.
 */
import { ScenarioError, UsageError } from '../errors.js';
import { makeSite } from '../geometry/earth.js';
import { slantRangeKm, elevationForRangeDeg, semiMajorAxisKm } from '../geometry/slant.js';
import type { Look } from '../geometry/types.js';
import { budgetTerms } from '../link/budget.js';
import type { AtmosphereResult, AtmosphereTable } from '../link/atmosphere/types.js';
import type { BudgetTerm, PreparedLink } from '../link/types.js';
import type { Radio, Scenario, Spacecraft } from '../scenario/types.js';
import { linkExceedancePercent, lowestMaskDeg, prepareRadioAtStation } from './link.js';
import { stationClimate, type StationClimate } from '../link/climate/station.js';

export const MOON_MEAN_DISTANCE_KM = 384_400;

export interface SingleBudgetRequest {
  spacecraftId: string;
  stationId: string;
  radioId?: string;
  elevationDeg?: number;
  rangeKm?: number;
  /** Handbook overrides, dB (replace the modelled term). */
  atmosphereDb?: number;
  pointingLossDb?: number;
  extraLossDb?: number;
}

export interface SingleBudget {
  spacecraftId: string;
  stationId: string;
  radioId: string;
  look: Look;
  orbitRadiusKm: number;
  terms: BudgetTerm[];
  /** The station's climate inputs and where each came from (file or ITU-R map). */
  climate: StationClimate;
}

/** Typical geocentric distance of the spacecraft, km. */
export function typicalRadiusKm(sc: Spacecraft): number {
  const o = sc.orbit;
  if (o.kind === 'moon') return MOON_MEAN_DISTANCE_KM;
  if (o.kind === 'fixedSky') return o.rangeKm;
  const set = o.sets[0];
  const n = set?.omm?.meanMotionRevPerDay ?? (set?.tle ? Number(set.tle.line2.slice(52, 63)) : Number.NaN);
  return semiMajorAxisKm(n);
}

/** An atmosphere of a fixed total (handbook value): no rain split, sky noise unchanged. */
function fixedAtmosphere(totalDb: number, base: AtmosphereTable): AtmosphereTable {
  return {
    minElevationDeg: base.minElevationDeg,
    at(elevationDeg: number, out: AtmosphereResult) {
      base.at(elevationDeg, out);
      out.gasDb = totalDb;
      out.rainDb = 0;
      out.cloudDb = 0;
      out.scintillationDb = 0;
      out.totalDb = totalDb;
    },
  };
}

export interface PointRequest {
  spacecraftId: string;
  stationId: string;
  radioId?: string;
  elevationDeg?: number;
  rangeKm?: number;
}

/**
 * The prepared budget and the look of one static point: the spacecraft's radio (its
 * first unless named) at a station, at an elevation and/or range. `command` names the
 * command in messages. Shared by `budget` and `size` (one geometry).
 */
export function preparePoint(scenario: Scenario, req: PointRequest, command: string): { sc: Spacecraft; radio: Radio; link: PreparedLink; look: Look; orbitRadiusKm: number } {
  const sc = scenario.spacecraft.find((s) => s.id === req.spacecraftId);
  if (!sc) throw new UsageError(`--spacecraft-id: "${req.spacecraftId}" is not in ${scenario.sources.spacecraftFile} (ids: ${scenario.spacecraft.map((s) => s.id).join(', ')})`);
  const station = scenario.stations.find((s) => s.id === req.stationId);
  if (!station) throw new UsageError(`--station-id: "${req.stationId}" is not in ${scenario.sources.networkFile} (ids: ${scenario.stations.map((s) => s.id).join(', ')})`);
  const radio = req.radioId === undefined ? sc.radios[0] : sc.radios.find((r) => r.id === req.radioId);
  if (!radio) {
    if (req.radioId !== undefined) throw new UsageError(`--radio-id: "${req.radioId}" is not a radio of ${sc.id} (radios: ${sc.radios.map((r) => r.id).join(', ') || 'none'})`);
    throw new ScenarioError([{ file: scenario.sources.spacecraftFile, path: `spacecraft ${sc.id}.radios`, message: `has no radio; ${command} needs one` }]);
  }
  if (req.elevationDeg === undefined && req.rangeKm === undefined) throw new UsageError(`${command}: give --elevation DEG or --range-km KM (or both)`);
  const site = makeSite(station.id, station.latitudeDeg, station.longitudeDeg, station.heightKm);
  const stationRadiusKm = Math.hypot(...site.ecefKm);
  const orbitRadiusKm = typicalRadiusKm(sc);
  const elevationDeg = req.elevationDeg ?? elevationForRangeDeg(stationRadiusKm, orbitRadiusKm, req.rangeKm!);
  const rangeKm = req.rangeKm ?? slantRangeKm(stationRadiusKm, orbitRadiusKm, elevationDeg);
  const minEl = Math.min(lowestMaskDeg(station), Math.max(0, elevationDeg));
  const link = prepareRadioAtStation(radio, station, site, scenario.link, minEl);
  return { sc, radio, link, look: { azimuthDeg: 0, elevationDeg, rangeKm, rangeRateKmS: 0 }, orbitRadiusKm };
}

export function singleBudget(scenario: Scenario, req: SingleBudgetRequest): SingleBudget {
  const point = preparePoint(scenario, req, 'budget');
  const { sc, radio, look, orbitRadiusKm } = point;
  let link = point.link;
  if (req.atmosphereDb !== undefined) link = { ...link, atmosphere: fixedAtmosphere(req.atmosphereDb, link.atmosphere) };
  if (req.pointingLossDb !== undefined) link = { ...link, pointingLossDb: req.pointingLossDb };
  if (req.extraLossDb !== undefined) link = { ...link, extraLossDb: req.extraLossDb };
  const terms = budgetTerms(link, look).map((t) => {
    if (req.atmosphereDb !== undefined && /^(Gaseous|Rain|Cloud|Scintillation)/.test(t.name)) return { ...t, source: 'replaced by --atmosphere-db' };
    if (req.atmosphereDb !== undefined && t.name === 'Atmosphere total') return { ...t, source: 'given (--atmosphere-db)' };
    if (req.pointingLossDb !== undefined && t.name === 'Pointing loss') return { ...t, source: 'given (--pointing-loss-db)' };
    return t;
  });
  const station = scenario.stations.find((s) => s.id === req.stationId)!; // preparePoint checked it
  const climate = stationClimate(station, linkExceedancePercent(scenario.link));
  return { spacecraftId: sc.id, stationId: req.stationId, radioId: radio.id, look, orbitRadiusKm, terms, climate };
}
