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
import { geocentricStates } from '../geometry/targets/ephemeris.js';
import { ScenarioError, UsageError } from '../errors.js';
import { makeSite } from '../geometry/earth.js';
import { slantRangeKm, elevationForRangeDeg, semiMajorAxisKm } from '../geometry/slant.js';
import type { Look } from '../geometry/types.js';
import { budgetTerms } from '../link/budget.js';
import { worstMoonTempK } from './margin.js';
import type { AtmosphereResult, AtmosphereTable } from '../link/atmosphere/types.js';
import type { BudgetTerm, PreparedLink } from '../link/types.js';
import { skyNoiseTemperatureK } from '../link/atmosphere/sky-noise.js';
import type { Radio, Scenario, Spacecraft } from '../scenario/types.js';
import { linkExceedancePercent, lowestMaskDeg, prepareRadioAtStation, radioHeardAt } from './link.js';
import { stationClimate, type StationClimate } from '../link/climate/station.js';

export const MOON_MEAN_DISTANCE_KM = 384_400;

export interface SingleBudgetRequest extends LinkOverrides {
  spacecraftId: string;
  stationId: string;
  radioId?: string;
  elevationDeg?: number;
  rangeKm?: number;
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
  if (o.kind === 'moon' || o.kind === 'lunarSite' || o.kind === 'lunarOrbit') return MOON_MEAN_DISTANCE_KM;
  if (o.kind === 'fixedSky') return o.rangeKm;
  if (o.kind === 'ephemeris') {
    const seg = o.ephemeris.segments[0]!;
    const s = geocentricStates(seg);
    return Math.hypot(s[0]!, s[1]!, s[2]!);
  }
  const set = o.sets[0];
  const n = set?.omm?.meanMotionRevPerDay ?? (set?.tle ? Number(set.tle.line2.slice(52, 63)) : Number.NaN);
  return semiMajorAxisKm(n);
}

/**
 * An atmosphere of a fixed total (handbook value): no split into terms, and the sky
 * noise that attenuation implies by ITU-R P.618-14 §3 (src/link/atmosphere/sky-noise.ts:
 * Tsky = Tmr (1 - 10^(-A/10)) + 2.7 K 10^(-A/10), Tmr = 275 K), the whole given total
 * taken as absorption (a handbook total does not say how much is scintillation).
 */
export function fixedAtmosphere(totalDb: number, base: AtmosphereTable): AtmosphereTable {
  const skyNoiseTempK = skyNoiseTemperatureK(totalDb);
  return {
    minElevationDeg: base.minElevationDeg,
    at(_elevationDeg: number, out: AtmosphereResult) {
      out.gasDb = totalDb;
      out.rainDb = 0;
      out.cloudDb = 0;
      out.scintillationDb = 0;
      out.totalDb = totalDb;
      out.skyNoiseTempK = skyNoiseTempK;
    },
  };
}

/** Handbook overrides of a prepared budget (budget and size's one-geometry mode). */
export interface LinkOverrides {
  /** Replaces the modelled atmosphere (and its sky noise, from this attenuation), dB. */
  atmosphereDb?: number;
  pointingLossDb?: number;
  extraLossDb?: number;
  /** Replaces the computed G/T (a handbook's stated figure for the budget's conditions), dB/K. */
  gOverTDbK?: number;
}

/** The prepared link with the given overrides applied. */
export function withOverrides(link: PreparedLink, o: LinkOverrides): PreparedLink {
  let out = link;
  if (o.atmosphereDb !== undefined) out = { ...out, atmosphere: fixedAtmosphere(o.atmosphereDb, out.atmosphere) };
  if (o.pointingLossDb !== undefined) out = { ...out, pointingLossDb: o.pointingLossDb };
  if (o.extraLossDb !== undefined) out = { ...out, extraLossDb: o.extraLossDb };
  if (o.gOverTDbK !== undefined) out = { ...out, gOverTOverrideDbK: o.gOverTDbK };
  return out;
}

/** The budget's terms with the sources of overridden terms restated. */
export function overriddenTerms(terms: BudgetTerm[], o: LinkOverrides): BudgetTerm[] {
  return terms.map((t) => {
    if (o.atmosphereDb !== undefined && /^(Gaseous|Rain|Cloud|Scintillation)/.test(t.name)) return { ...t, source: 'replaced by --atmosphere-db' };
    if (o.atmosphereDb !== undefined && t.name === 'Atmosphere total') return { ...t, source: 'given (--atmosphere-db)' };
    if (o.atmosphereDb !== undefined && t.name === 'Sky noise temperature') {
      return { ...t, source: 'ITU-R P.618-14 sec. 3 from the given attenuation (all of it taken as absorption, Tmr 275 K)' };
    }
    if (o.pointingLossDb !== undefined && t.name === 'Pointing loss') return { ...t, source: 'given (--pointing-loss-db)' };
    return t;
  });
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
  if (req.elevationDeg === undefined && sc.orbit.kind !== 'elements') {
    // The Moon's or a fixed sky direction's elevation does not follow from a range: a
    // made-up triangle would give an elevation (3 deg for the Moon) nobody asked for.
    throw new UsageError(
      `${command}: ${sc.id} is ${sc.orbit.kind === 'fixedSky' ? 'at a fixed sky direction' : sc.orbit.kind === 'ephemeris' ? 'on an ephemeris' : 'at the Moon'}; its elevation does not follow from --range-km: give --elevation DEG too`,
    );
  }
  const site = makeSite(station.id, station.latitudeDeg, station.longitudeDeg, station.heightKm);
  const stationRadiusKm = Math.hypot(...site.ecefKm);
  const orbitRadiusKm = typicalRadiusKm(sc);
  const elevationDeg = req.elevationDeg ?? elevationForRangeDeg(stationRadiusKm, orbitRadiusKm, req.rangeKm!);
  const rangeKm = req.rangeKm ?? slantRangeKm(stationRadiusKm, orbitRadiusKm, elevationDeg);
  const minEl = Math.min(lowestMaskDeg(station), Math.max(0, elevationDeg));
  if (!radioHeardAt(station, radio)) {
    throw new UsageError(`${command}: no feed of station ${station.id} covers ${(radio.frequencyHz / 1e6).toFixed(3)} MHz (radio ${radio.id} of ${sc.id}); there is no link to budget`);
  }
  const link = prepareRadioAtStation(radio, station, site, scenario.link, minEl);
  return { sc, radio, link, look: { azimuthDeg: 0, elevationDeg, rangeKm, rangeRateKmS: 0 }, orbitRadiusKm };
}

export function singleBudget(scenario: Scenario, req: SingleBudgetRequest): SingleBudget {
  const point = preparePoint(scenario, req, 'budget');
  const { sc, radio, look, orbitRadiusKm } = point;
  const link = withOverrides(point.link, req);
  // a lunar target's budget carries the Moon's noise, its disc centred in the beam (the worst case)
  const lunar = sc.orbit.kind === 'moon' || sc.orbit.kind === 'lunarSite' || sc.orbit.kind === 'lunarOrbit';
  const terms = overriddenTerms(budgetTerms(link, look, lunar ? worstMoonTempK(link, look.rangeKm) : 0), req);
  const station = scenario.stations.find((s) => s.id === req.stationId)!; // preparePoint checked it
  const climate = stationClimate(station, linkExceedancePercent(scenario.link));
  return { spacecraftId: sc.id, stationId: req.stationId, radioId: radio.id, look, orbitRadiusKm, terms, climate };
}
