/**
 * The link engine over the contacts: a budget at every time step inside every
 * contact, and the data volume each contact carries.
 *
 * Which radio: a spacecraft's first radio (radios[0]) is its data downlink (the file's
 * dataRadio is put first); every other radio gets its own volume too (Contact.otherLinks).
 * Which feed: a radio links at a station through the station feed covering its frequency
 * (scenario/feeds.ts); with none, the pair keeps its windows but has no link (one warning).
 * Sampling: per spacecraft, one common grid span.start + k * stepS; the target
 * is propagated once per grid time and that state serves every station in
 * contact then. Each contact is also evaluated at its own data start and end.
 * Volume rule: data flows from AOS + acquisition time to LOS while the elevation is
 * at or above the minimum data elevation, at the rate the link supports (the
 * adaptive table's best entry, or the fixed code's rate when its margin is >= 0).
 * That rate is a step function of the budget, so between two samples
 * [data start, grid times inside, data end] the budget's closing quantity (Es/N0
 * net of losses and required margin, or the fixed code's margin) and the
 * elevation are taken linear in time, the segment is cut where they cross a
 * step or the minimum data elevation (and at 15-minute bin edges), and each
 * piece carries its rate: the step function is integrated exactly up to that
 * interpolation (integrateSegment). Time in each MODCOD comes from the same
 * pieces. The worst margin is the lowest closure margin (above the most robust
 * entry's threshold plus the required margin, LinkSample.closureMarginDb) over the
 * samples of the whole contact (AOS..LOS, both edges sampled).
 * Every sample carries the noise the Sun and the Moon add in the station's beam
 * (bodyTempK: geometry/sky-bodies.ts and link/body-noise.ts), so Sun outages and a
 * lunar target's Moon noise are in the volumes.
 */
import { lookFrom, newLook } from '../geometry/topocentric.js';
import { FAR_MOON_MARGIN_DEG, FAR_SUN_MARGIN_DEG, farCosLimit, newBodyAngles, type BodyAngles, type SkyBodies } from '../geometry/sky-bodies.js';
import { BODY_NOISE_CUTOFF_BEAMWIDTHS, beamBodiesTempK } from '../link/body-noise.js';
import { StateInterpolator } from '../geometry/interpolate.js';
import type { Look, Site } from '../geometry/types.js';
import { buildAtmosphereTable, buildExceedanceLevelsTable, rainModelled, type AtmosphereStationInput } from '../link/atmosphere/index.js';
import { EXPECTED_VOLUME_LEVELS, expectationWeights, expectedValueBound } from '../link/atmosphere/exceedance-levels.js';
import type { AtmosphereTable, ExceedanceLevelsTable } from '../link/atmosphere/types.js';
import { prepareLink, evaluateLink, esN0ShiftDb } from '../link/budget.js';
import { polarizationTiltDeg } from '../link/polarization.js';
import { stationClimateValues } from '../link/climate/station.js';
import { wavelengthM } from '../link/units.js';
import { newLinkSample, type LinkSample, type PreparedLink } from '../link/types.js';
import { modcodStaircase, stepAt, type ModcodStaircase } from '../link/modcod/acm.js';
import type { LinkSettings, Radio, Scenario, Station } from '../scenario/types.js';
import type { Geometry } from './contacts.js';
import { ModelRangeError } from '../errors.js';
import { feedFor, stationThroughFeed } from '../scenario/feeds.js';
import { VOLUME_BIN_MS, type Contact, type ContactLink, type WarningOrigin } from './types.js';

/** Frequency above which a missing rain climate is worth a warning, Hz. */
export const RAIN_WARNING_ABOVE_HZ = 3e9;
/**
 * Link sampling step inside contacts, s. With the step-function integration, demo
 * day 1 volumes agree with 0.1 s sampling to 0.035 % per contact at 10 s, 0.09 % at
 * 20 s, 0.21 % at 30 s, 0.65 % at 60 s (worst contact); 30 s keeps within 0.5 %.
 */
export const DEFAULT_LINK_STEP_S = 30;

export interface LinkSetup {
  /** PreparedLink by `${spacecraftId}|${stationId}` for the data radio. */
  links: Map<string, PreparedLink>;
  /** The other radios' links: index r - 1 holds radios[r]'s, by `${spacecraftId}|${stationId}`. */
  otherLinks?: Map<string, PreparedLink>[];
  warnings: string[];
  /** warningOrigins[i]: the station, spacecraft and radio index that raised warnings[i]. */
  warningOrigins?: WarningOrigin[];
}

export const linkKey = (spacecraftId: string, stationId: string) => `${spacecraftId}|${stationId}`;

/** Receive dish diameter for scintillation aperture averaging: given, or from the gain. */
function effectiveDiameterM(station: Station, freqHz: number): { diameterM: number; efficiency: number } {
  const rx = station.receiver;
  if (!rx) throw new Error(`station ${station.id} has no receiver (callers check radioHeardAt first)`);
  const efficiency = rx.apertureEfficiency ?? 0.6;
  if (rx.dishDiameterM !== undefined) return { diameterM: rx.dishDiameterM, efficiency };
  const gainDbi = rx.gainDbi ?? 40;
  const lambda = wavelengthM(freqHz);
  return { diameterM: (lambda / Math.PI) * Math.sqrt(10 ** (gainDbi / 10) / efficiency), efficiency };
}

/** The link's exceedance, % of an average year (100 - availability). */
export function linkExceedancePercent(settings: LinkSettings): number {
  return Number((100 - settings.availabilityPercent).toPrecision(12));
}

export function atmosphereInputFor(station: Station, radio: Radio, settings: LinkSettings): AtmosphereStationInput {
  const exceedancePercent = linkExceedancePercent(settings);
  const c = stationClimateValues(station, exceedancePercent);
  const { diameterM, efficiency } = effectiveDiameterM(station, radio.frequencyHz);
  return {
    frequencyHz: radio.frequencyHz,
    exceedancePercent,
    latitudeDeg: station.latitudeDeg,
    stationHeightKm: station.heightKm,
    polarizationTiltDeg: polarizationTiltDeg(radio.polarization),
    antennaDiameterM: diameterM,
    apertureEfficiency: efficiency,
    ...(c.rainRate001MmH !== undefined ? { rainRate001MmH: c.rainRate001MmH } : {}),
    ...(c.rainHeightKm !== undefined ? { rainHeightKm: c.rainHeightKm } : {}),
    surfaceWaterVapourDensityGM3: c.surfaceWaterVapourDensityGM3,
    surfaceTemperatureK: c.surfaceTemperatureK,
    surfacePressureHpa: c.surfacePressureHpa,
    nWetMedian: c.nWetMedian,
    ...(c.cloudLiquidWaterKgM2 !== undefined ? { cloudLiquidWaterKgM2: c.cloudLiquidWaterKgM2 } : {}),
  };
}

/** Lowest elevation the station's mask allows, clamped to 0 (tables start there). */
export function lowestMaskDeg(station: Station): number {
  const m = station.mask;
  const lowest = m.kind === 'constant' ? m.elevationDeg : Math.min(...m.elevationDeg);
  return Math.max(0, lowest);
}

/** True when a feed of the station covers the radio's frequency (scenario/feeds.ts). */
export function radioHeardAt(station: Station, radio: Radio): boolean {
  return feedFor(station, radio.frequencyHz) !== undefined;
}

/** The one warning for a pair whose station has no feed for the radio's frequency. */
export function noFeedWarning(station: Station, spacecraftId: string, radio: Radio): string {
  return `${station.id}: no feed covers ${(radio.frequencyHz / 1e9).toPrecision(6)} GHz (radio ${radio.id} of ${spacecraftId}): its windows there carry no link`;
}

/** Builds the prepared budget of one radio at one station (atmosphere tables included). */
export function prepareRadioAtStation(
  radio: Radio,
  station: Station,
  site: Site,
  settings: LinkSettings,
  minElevationDeg: number,
  tableCache?: Map<string, AtmosphereTable>,
  /** Also tabulate the absorption at the expected volume's exceedance levels (cached by the same map's owner). */
  levelsCache?: Map<string, ExceedanceLevelsTable>,
): PreparedLink {
  try {
    // the receiver of the feed that hears the radio (callers check radioHeardAt first)
    const heard = stationThroughFeed(station, radio.frequencyHz) ?? station;
    const link = prepareRadioAtStationUnnamed(radio, heard, site, settings, minElevationDeg, tableCache);
    if (!levelsCache) return link;
    return { ...link, exceedanceLevels: exceedanceLevelsFor(link, heard, radio, settings, minElevationDeg, levelsCache) };
  } catch (err) {
    // A model asked for outside its range (a frequency above P.618's 55 GHz, a pointing
    // error wider than the beam) stays a ModelRangeError (sizing ends its scan on one),
    // with the radio and the station as its context; the CLI prints it as one line.
    if (err instanceof ModelRangeError) throw err.withContext(`radio ${radio.id} at station ${station.id}`);
    throw err;
  }
}

/** prepareRadioAtStation without naming: a model's ModelRangeError as thrown (src/plan/preflight.ts names it). */
export function prepareRadioAtStationUnnamed(
  radio: Radio,
  station: Station,
  site: Site,
  settings: LinkSettings,
  minElevationDeg: number,
  tableCache: Map<string, AtmosphereTable> | undefined,
): PreparedLink {
  const input = memoInputFor(station, radio, settings.availabilityPercent);
  const cached = (inp: AtmosphereStationInput, minEl: number): AtmosphereTable => {
    const key = inp === input ? `${input.key}|${minEl}` : `${JSON.stringify(inp)}|${minEl}`;
    let t = tableCache?.get(key);
    if (!t) {
      t = buildAtmosphereTable(inp, minEl);
      tableCache?.set(key, t);
    }
    return t;
  };
  const table = cached(input, minElevationDeg);
  const opts: Parameters<typeof prepareLink>[4] = {
    stationGeocentricRadiusKm: Math.hypot(site.ecefKm[0], site.ecefKm[1], site.ecefKm[2]),
  };
  if (station.receiver?.kind === 'gt') {
    const { rainRate001MmH: _r, rainHeightKm: _h, cloudLiquidWaterKgM2: _c, key: _k, ...clear } = input;
    opts.clearSkyAtmosphere = cached(clear, Math.min(minElevationDeg, station.receiver.atElevationDeg));
  }
  return prepareLink(radio, station, settings, table, opts);}

/** An atmosphere input with its JSON text (the table caches' key). */
type KeyedInput = AtmosphereStationInput & { readonly key: string };

/**
 * atmosphereInputFor's inputs kept per station (by its frequency, polarisation and
 * availability: all the input depends on besides the station), each with its JSON text:
 * a fleet's pairs at one station share them instead of making them per pair. The
 * key is JSON.stringify of the input as atmosphereInputFor makes it.
 */
const inputMemo = new WeakMap<Station, Map<string, KeyedInput>>();

function memoInputFor(station: Station, radio: Radio, availabilityPercent: number): KeyedInput {
  let byRadio = inputMemo.get(station);
  if (!byRadio) {
    byRadio = new Map();
    inputMemo.set(station, byRadio);
  }
  const sub = `${radio.frequencyHz}|${JSON.stringify(radio.polarization)}|${availabilityPercent}`;
  let k = byRadio.get(sub);
  if (!k) {
    const input = atmosphereInputFor(station, radio, { availabilityPercent } as LinkSettings);
    k = Object.defineProperty({ ...input }, 'key', { value: JSON.stringify(input), enumerable: false }) as KeyedInput;
    byRadio.set(sub, k);
  }
  return k;
}

/** The exceedance levels' inputs of a station and radio with their table key (exceedanceLevelsFor), kept like memoInputFor's. */
const levelInputsMemo = new WeakMap<Station, Map<string, { inputs: AtmosphereStationInput[]; key: string }>>();


/**
 * The change of the link's closing quantity (Es/N0, or the fixed code's margin) from its
 * atmosphere at the chosen availability to the absorption at each level of
 * EXPECTED_VOLUME_LEVELS (budget.ts esN0ShiftDb: loss and sky noise), tabulated over
 * elevation: a function of elevation only, so a sample needs one table lookup per level.
 * The climate is read at each level's exceedance; rain is dropped where the level has none.
 */
function exceedanceLevelsFor(
  link: PreparedLink,
  station: Station,
  radio: Radio,
  settings: LinkSettings,
  minElevationDeg: number,
  cache: Map<string, ExceedanceLevelsTable>,
): ExceedanceLevelsTable {
  let byRadio = levelInputsMemo.get(station);
  if (!byRadio) {
    byRadio = new Map();
    levelInputsMemo.set(station, byRadio);
  }
  const sub = `${radio.frequencyHz}|${JSON.stringify(radio.polarization)}|${settings.availabilityPercent}|${minElevationDeg}`;
  let memo = byRadio.get(sub);
  if (!memo) {
    const inputs = EXPECTED_VOLUME_LEVELS.map((level) => {
      const input = atmosphereInputFor(station, radio, { ...settings, availabilityPercent: 100 - level.exceedancePercent });
      if (level.rain) return input;
      const { rainRate001MmH: _r, rainHeightKm: _h, ...dry } = input;
      return dry;
    });
    memo = { inputs, key: `${JSON.stringify(inputs)}|${JSON.stringify(station.receiver)}|${settings.availabilityPercent}|${minElevationDeg}` };
    byRadio.set(sub, memo);
  }
  const { inputs, key } = memo;
  let t = cache.get(key);
  if (!t) {
    const look = newLook();
    look.rangeKm = 1000; // the atmosphere and G/T do not depend on it
    const s = newLinkSample();
    let lastEl = Number.NaN;
    t = buildExceedanceLevelsTable(inputs, minElevationDeg, (_level, absorptionDb, elevationDeg) => {
      if (elevationDeg !== lastEl) {
        look.elevationDeg = elevationDeg;
        evaluateLink(link, look, s, false);
        lastEl = elevationDeg;
      }
      return esN0ShiftDb(link, s, absorptionDb);
    });
    cache.set(key, t);
  }
  return t;
}

export interface PrepareLinksOptions {
  /** Tabulate the expected volume's exceedance levels, so that contacts carry their expected volume (default true). */
  expectedVolume?: boolean;
  /** Tables kept across calls (a worker's batches share them); default: new ones. */
  cache?: LinkTableCache;
}

/**
 * Tables a run builds once: the atmosphere depends on the station, frequency,
 * polarisation and availability only, so spacecraft sharing a band share them.
 */
export interface LinkTableCache {
  atmosphere: Map<string, AtmosphereTable>;
  levels: Map<string, ExceedanceLevelsTable>;
}

export const newLinkTableCache = (): LinkTableCache => ({ atmosphere: new Map(), levels: new Map() });

/** The prepared link of every radio of every spacecraft at every station. */
export function prepareLinks(scenario: Scenario, geometry: Geometry, opts: PrepareLinksOptions = {}): LinkSetup {
  const links = new Map<string, PreparedLink>();
  const otherLinks: Map<string, PreparedLink>[] = [];
  const warnings: string[] = [];
  const warningOrigins: WarningOrigin[] = [];
  const warnedRain = new Set<string>();
  const cache = opts.cache ?? newLinkTableCache();
  const tables = cache.atmosphere;
  const levels = opts.expectedVolume === false ? undefined : cache.levels;
  scenario.stations.forEach((station, i) => {
    const site = geometry.sites[i]!;
    if (!station.receiver) return; // windows only (a notice of the scenario says so)
    for (const sc of scenario.spacecraft) {
      sc.radios.forEach((radio, r) => {
        if (!radioHeardAt(station, radio)) {
          warnings.push(noFeedWarning(station, sc.id, radio));
          warningOrigins.push({ stationId: station.id, spacecraftId: sc.id, radioIndex: r });
          return;
        }
        const input = atmosphereInputFor(station, radio, scenario.link);
        if (!rainModelled(input) && radio.frequencyHz > RAIN_WARNING_ABOVE_HZ && !warnedRain.has(station.id)) {
          warnedRain.add(station.id);
          warnings.push(`${station.id}: no rain climate (rainRate001MmH, rainHeightKm); the rain term is not modelled above ${RAIN_WARNING_ABOVE_HZ / 1e9} GHz`);
          warningOrigins.push({ stationId: station.id, spacecraftId: sc.id, radioIndex: r });
        }
        const link = prepareRadioAtStation(radio, station, site, scenario.link, lowestMaskDeg(station), tables, levels);
        if (r === 0) links.set(linkKey(sc.id, station.id), link);
        else {
          while (otherLinks.length < r) otherLinks.push(new Map());
          otherLinks[r - 1]!.set(linkKey(sc.id, station.id), link);
        }
      });
    }
  });
  return { links, ...(otherLinks.length > 0 ? { otherLinks } : {}), warnings, warningOrigins };
}

/**
 * How the data rate follows from one sample, as a step function of a "closing
 * quantity" q: adaptive coding, q = Es/N0 - implementation loss - required margin
 * against the table's staircase (modcodStaircase: the same choice as bestModcod);
 * fixed coding, q = margin against one step at 0 dB. No data below the minimum
 * data elevation.
 */
interface RateModel {
  adaptive: boolean;
  stairs: ModcodStaircase;
  /** Bit/s of each step. */
  rateBps: Float64Array;
  qOffsetDb: number;
  minDataElevationDeg: number;
}

function rateModelOf(link: PreparedLink): RateModel {
  if (link.codingKind === 'adaptive') {
    const stairs = modcodStaircase(link.modcodTable);
    return {
      adaptive: true,
      stairs,
      rateBps: stairs.efficiency.map((e) => e * link.symbolRateBaud),
      qOffsetDb: link.implementationLossDb + link.requiredMarginDb,
      minDataElevationDeg: link.minDataElevationDeg,
    };
  }
  return {
    adaptive: false,
    stairs: { thresholdsDb: Float64Array.of(0), efficiency: Float64Array.of(link.spectralEfficiencyBitsPerSymbol), index: Int32Array.of(0) },
    rateBps: Float64Array.of(link.informationRateBps),
    qOffsetDb: 0,
    minDataElevationDeg: link.minDataElevationDeg,
  };
}

/** What every contact of one link shares, made once per link and run. */
interface LinkContext {
  link: PreparedLink;
  model: RateModel;
  site: Site;
  /** SkyBodies.farFromBoth limits beyond which the Sun and the Moon add nothing to this beam (farLimits). */
  cosSunFar: number;
  cosMoonFar: number;
  /** The expected volume's exceedance levels, when the link carries them. */
  levels: ExceedanceLevelsTable | undefined;
  /** Names of the MODCOD table's indices 0 .. modcodCount - 1 (modcodNameAt). */
  modcodNames: string[];
  modcodCount: number;
}

function linkContextOf(link: PreparedLink, site: Site): LinkContext {
  const modcodCount = Math.max(1, link.modcodTable.length);
  const modcodNames: string[] = [];
  for (let i = 0; i < modcodCount; i++) modcodNames.push(modcodNameAt(link, i));
  const far = farLimits(link, site);
  return {
    link,
    model: rateModelOf(link),
    site,
    cosSunFar: far.cosSunFar,
    cosMoonFar: far.cosMoonFar,
    levels: link.exceedanceLevels,
    modcodNames,
    modcodCount,
  };
}

const LEVEL_WEIGHTS = expectationWeights(EXPECTED_VOLUME_LEVELS);
/** Closing-quantity shift per level at one sample (reused). */
const levelShiftDb = new Float64Array(EXPECTED_VOLUME_LEVELS.length);

/**
 * Running sums of one contact while its samples come in. Accumulators are pooled: one is
 * taken when its contact opens (open) and given back when it closes (finish), so a run
 * allocates only a few, with their scratch arrays, whatever its number of contacts.
 */
class Accumulator {
  contact: Contact | undefined = undefined;
  ctx: LinkContext | undefined = undefined;
  link: PreparedLink | undefined = undefined;
  model: RateModel | undefined = undefined;
  site: Site | undefined = undefined;
  aosMs = 0;
  losMs = 0;
  dataStartMs = 0;
  dataEndMs = 0;
  /** Time, closing quantity and elevation of the last sample inside the data span. */
  lastMs = -Infinity;
  lastQ = 0;
  lastElevationDeg = 0;
  volumeBits = 0;
  closedS = 0;
  worstMarginDb = Infinity;
  worstAtMs = 0;
  worstElevationDeg = Number.NaN;
  peakRateBps = 0;
  /** Seconds per MODCOD table index (fixed coding: index 0), named only at the end. */
  modcodTimeS: Float64Array;
  samples = 0;
  binStartMs = 0;
  /** Volume per 15-min bin (fractional while integrating): bins[0 .. binCount - 1], zero beyond. */
  bins = new Float64Array(16);
  binCount = 0;
  /**
   * The rate step function as [startMs, endMs, rateBps] triplets (rate > 0 only, adjacent
   * pieces of one rate merged), kept only for contacts that overlap another contact of
   * the same spacecraft: the unique-volume rule (unique-volume.ts) needs it there.
   */
  pieces: number[] | undefined = undefined;
  /** The expected volume's running sums, when the link carries exceedance levels (levels !== undefined). */
  levels: ExceedanceLevelsTable | undefined = undefined;
  levelCount = 0;
  /** Closing quantity per level at the last sample, and at the current one (swapped after each sample). */
  lastLevelQ: Float64Array;
  levelQ: Float64Array;
  /** The rate step in force at those samples (stepAt), per level. */
  lastLevelStep: Int32Array;
  levelStep: Int32Array;
  /** Volume per level, bits (fractional). */
  levelBits: Float64Array;
  /** Expected volume per 15-min bin (same bins as the volume): expectedBins[0 .. expectedBinCount - 1]. */
  expectedBins = new Float64Array(16);
  expectedBinCount = 0;
  /** Expected-rate pieces, kept where the volume's rate pieces are. */
  expectedPieces: number[] | undefined = undefined;
  /** SkyBodies.farFromBoth limits (LinkContext). */
  cosSunFar = -2;
  cosMoonFar = -2;

  constructor(modcodStride: number, levelCapacity: number) {
    this.modcodTimeS = new Float64Array(modcodStride);
    this.lastLevelQ = new Float64Array(levelCapacity);
    this.levelQ = new Float64Array(levelCapacity);
    this.lastLevelStep = new Int32Array(levelCapacity).fill(-1);
    this.levelStep = new Int32Array(levelCapacity).fill(-1);
    this.levelBits = new Float64Array(levelCapacity);
  }

  /** Starts the sums of contact c (the accumulator is clean: new, or given back by finish). */
  open(c: Contact, ctx: LinkContext, dataStartMs: number, keepPieces: boolean): void {
    this.contact = c;
    this.ctx = ctx;
    this.link = ctx.link;
    this.model = ctx.model;
    this.site = ctx.site;
    this.aosMs = c.aosMs;
    this.losMs = c.losMs;
    this.dataStartMs = dataStartMs;
    this.dataEndMs = c.losMs;
    this.lastMs = -Infinity;
    this.lastQ = 0;
    this.lastElevationDeg = 0;
    this.volumeBits = 0;
    this.closedS = 0;
    this.worstMarginDb = Infinity;
    this.worstAtMs = c.aosMs;
    this.worstElevationDeg = Number.NaN;
    this.peakRateBps = 0;
    if (this.modcodTimeS.length < ctx.modcodCount) this.modcodTimeS = new Float64Array(ctx.modcodCount);
    this.samples = 0;
    this.binStartMs = Math.floor(c.aosMs / VOLUME_BIN_MS) * VOLUME_BIN_MS;
    this.pieces = keepPieces ? [] : undefined;
    const t = ctx.levels;
    this.levels = t;
    this.expectedPieces = undefined;
    if (t !== undefined) {
      const n = t.levels;
      if (this.levelBits.length < n) {
        this.lastLevelQ = new Float64Array(n);
        this.levelQ = new Float64Array(n);
        this.lastLevelStep = new Int32Array(n).fill(-1);
        this.levelStep = new Int32Array(n).fill(-1);
        this.levelBits = new Float64Array(n);
      }
      this.levelCount = n;
      if (keepPieces) this.expectedPieces = [];
    } else this.levelCount = 0;
    this.cosSunFar = ctx.cosSunFar;
    this.cosMoonFar = ctx.cosMoonFar;
  }

  /** Clears the sums for the next contact (finish calls it). */
  release(): void {
    this.modcodTimeS.fill(0);
    this.bins.fill(0, 0, this.binCount);
    this.binCount = 0;
    this.expectedBins.fill(0, 0, this.expectedBinCount);
    this.expectedBinCount = 0;
    const n = this.levelCount;
    this.lastLevelQ.fill(0, 0, n);
    this.levelQ.fill(0, 0, n);
    this.lastLevelStep.fill(-1, 0, n);
    this.levelStep.fill(-1, 0, n);
    this.levelBits.fill(0, 0, n);
    this.contact = undefined;
    this.ctx = undefined;
    this.link = undefined;
    this.model = undefined;
    this.site = undefined;
    this.pieces = undefined;
    this.levels = undefined;
    this.expectedPieces = undefined;
  }
}

/** `bins` itself, or a copy of it twice as long (at least bin + 1) when bin lies beyond it. */
function binsHolding(bins: Float64Array<ArrayBuffer>, bin: number): Float64Array<ArrayBuffer> {
  if (bin < bins.length) return bins;
  const grown = new Float64Array(Math.max(bin + 1, 2 * bins.length));
  grown.set(bins);
  return grown;
}

/** Adds dv to bin `bin` of the volume's bins, growing them as needed. */
function addToBin(acc: Accumulator, bin: number, dv: number): void {
  acc.bins = binsHolding(acc.bins, bin);
  if (bin >= acc.binCount) acc.binCount = bin + 1;
  acc.bins[bin]! += dv;
}

/** Adds ev to bin `bin` of the expected volume's bins, growing them as needed. */
function addToExpectedBin(acc: Accumulator, bin: number, ev: number): void {
  acc.expectedBins = binsHolding(acc.expectedBins, bin);
  if (bin >= acc.expectedBinCount) acc.expectedBinCount = bin + 1;
  acc.expectedBins[bin]! += ev;
}

function modcodNameAt(link: PreparedLink, index: number): string {
  return link.codingKind === 'fixed' ? link.codingName : (link.modcodTable[index]?.name ?? '');
}

/** Breakpoints of one segment (fractions of it), reused: steps + elevation + bin edges. */
const breaks = new Float64Array(256);

/**
 * Integrates the rate over [t0, t1] with q and the elevation taken linear in time
 * between the two samples: the segment is cut where q crosses a step threshold, where
 * the elevation crosses the minimum data elevation and at 15-minute bin edges; each piece
 * carries the rate of its midpoint. The step function is thus integrated exactly, up to
 * the linear interpolation of q (smooth over a step of seconds).
 */
function integrateSegment(acc: Accumulator, t0: number, q0: number, el0: number, t1: number, q1: number, el1: number): void {
  const m = acc.model!;
  const thr = m.stairs.thresholdsDb;
  let n = 0;
  breaks[n++] = 0;
  const dq = q1 - q0;
  if (dq !== 0) {
    // only a threshold strictly between q0 and q1 can give 0 < f < 1 (rounding is monotone:
    // one at or beyond either end gives f <= 0 or f >= 1), so the others are not divided
    const lo = dq > 0 ? q0 : q1;
    const hi = dq > 0 ? q1 : q0;
    for (let k = 0; k < thr.length; k++) {
      const tk = thr[k] as number;
      if (!(tk > lo && tk < hi)) continue;
      const f = (tk - q0) / dq;
      if (f > 0 && f < 1 && n < breaks.length - 8) breaks[n++] = f;
    }
  }
  const del = el1 - el0;
  if (del !== 0) {
    const f = (m.minDataElevationDeg - el0) / del;
    if (f > 0 && f < 1) breaks[n++] = f;
  }
  const span = t1 - t0;
  for (let edge = acc.binStartMs + Math.ceil((t0 - acc.binStartMs) / VOLUME_BIN_MS) * VOLUME_BIN_MS; edge < t1; edge += VOLUME_BIN_MS) {
    const f = (edge - t0) / span;
    if (f > 0 && f < 1 && n < breaks.length - 1) breaks[n++] = f;
  }
  breaks[n++] = 1;
  // insertion sort of the few breakpoints
  for (let i = 1; i < n; i++) {
    const v = breaks[i] as number;
    let j = i - 1;
    while (j >= 0 && (breaks[j] as number) > v) {
      breaks[j + 1] = breaks[j] as number;
      j--;
    }
    breaks[j + 1] = v;
  }
  const modcod = acc.modcodTimeS;
  const index = m.stairs.index;
  for (let i = 0; i + 1 < n; i++) {
    const fa = breaks[i] as number;
    const fb = breaks[i + 1] as number;
    if (fb <= fa) continue;
    const fm = 0.5 * (fa + fb);
    if (el0 + del * fm < m.minDataElevationDeg) continue;
    const step = stepAt(m.stairs, q0 + dq * fm);
    if (step < 0) continue;
    const rate = m.rateBps[step] as number;
    const dtS = ((fb - fa) * span) / 1000;
    const dv = rate * dtS;
    acc.volumeBits += dv;
    const bin = Math.floor((t0 + fm * span - acc.binStartMs) / VOLUME_BIN_MS);
    addToBin(acc, bin, dv);
    acc.closedS += dtS;
    modcod[index[step] as number]! += dtS;
    if (rate > acc.peakRateBps) acc.peakRateBps = rate;
    const pc = acc.pieces;
    if (pc !== undefined && rate > 0) {
      const a = t0 + fa * span;
      const b = t0 + fb * span;
      const n = pc.length;
      if (n >= 3 && pc[n - 1] === rate && pc[n - 2] === a) pc[n - 2] = b;
      else pc.push(a, b, rate);
    }
  }
}

/** Breakpoints of one segment for the expected volume (elevation + bin edges), reused. */
const levelBreaks = new Float64Array(64);

/**
 * Mean rate over a piece along which q runs linearly from qa to qb: the step function
 * integrated exactly (the share of the piece spent on each step).
 */
function meanRateBps(m: RateModel, qa: number, qb: number, sa = stepAt(m.stairs, qa), sb = stepAt(m.stairs, qb)): number {
  if (sa === sb) return sa < 0 ? 0 : (m.rateBps[sa] as number);
  const lo = Math.min(qa, qb);
  const hi = Math.max(qa, qb);
  const first = Math.min(sa, sb);
  const last = Math.max(sa, sb);
  const thr = m.stairs.thresholdsDb;
  let sum = 0;
  for (let step = first; step <= last; step++) {
    const a = step < 0 ? lo : Math.max(lo, thr[step] as number);
    const b = step + 1 < thr.length ? Math.min(hi, thr[step + 1] as number) : hi;
    if (b > a && step >= 0) sum += (m.rateBps[step] as number) * (b - a);
  }
  return sum / (hi - lo);
}

/** True when q lies on step st of thresholds thr (thr[st] <= q < thr[st + 1]): stepAt(q) === st exactly. */
function onStep(thr: Float64Array, st: number, q: number): boolean {
  return (st < 0 || (thr[st] as number) <= q) && (st + 1 >= thr.length || q < (thr[st + 1] as number));
}

/**
 * The expected volume's part of integrateSegment: each level's closing quantity linear in
 * time between the two samples like the volume's, cut at the minimum data elevation and
 * at bin edges; each level's step function integrated exactly (meanRateBps). A level whose
 * two samples sit on one step gives that step's rate over a whole segment at once, and
 * over a piece of it once both ends of the piece are checked on that step (onStep: the
 * steps meanRateBps would find).
 */
function integrateLevels(acc: Accumulator, t0: number, el0: number, t1: number, el1: number): void {
  const m = acc.model!;
  let n = 0;
  levelBreaks[n++] = 0;
  const del = el1 - el0;
  if (del !== 0) {
    const f = (m.minDataElevationDeg - el0) / del;
    if (f > 0 && f < 1) levelBreaks[n++] = f;
  }
  const span = t1 - t0;
  for (let edge = acc.binStartMs + Math.ceil((t0 - acc.binStartMs) / VOLUME_BIN_MS) * VOLUME_BIN_MS; edge < t1; edge += VOLUME_BIN_MS) {
    const f = (edge - t0) / span;
    if (f > 0 && f < 1 && n < levelBreaks.length - 1) levelBreaks[n++] = f;
  }
  levelBreaks[n++] = 1;
  for (let i = 1; i < n; i++) {
    const v = levelBreaks[i] as number;
    let j = i - 1;
    while (j >= 0 && (levelBreaks[j] as number) > v) {
      levelBreaks[j + 1] = levelBreaks[j] as number;
      j--;
    }
    levelBreaks[j + 1] = v;
  }
  const qa = acc.lastLevelQ;
  const qb = acc.levelQ;
  const sa = acc.lastLevelStep;
  const sb = acc.levelStep;
  const bits = acc.levelBits;
  const weights = LEVEL_WEIGHTS;
  const rates = m.rateBps;
  const thr = m.stairs.thresholdsDb;
  const levels = acc.levelCount;
  const whole = n === 2; // one piece: its ends are the samples, whose steps are known
  for (let i = 0; i + 1 < n; i++) {
    const fa = levelBreaks[i] as number;
    const fb = levelBreaks[i + 1] as number;
    if (fb <= fa) continue;
    const fm = 0.5 * (fa + fb);
    if (el0 + del * fm < m.minDataElevationDeg) continue;
    const dtS = ((fb - fa) * span) / 1000;
    let ev = 0;
    for (let k = 0; k < levels; k++) {
      const q0 = qa[k] as number;
      const dq = (qb[k] as number) - q0;
      const s0 = sa[k] as number;
      let rate: number;
      if (whole) {
        const s1 = sb[k] as number;
        rate = s0 === s1 ? (s0 < 0 ? 0 : (rates[s0] as number)) : meanRateBps(m, q0, q0 + dq, s0, s1);
      } else {
        const qx = q0 + dq * fa;
        const qy = q0 + dq * fb;
        rate = s0 === (sb[k] as number) && onStep(thr, s0, qx) && onStep(thr, s0, qy) ? (s0 < 0 ? 0 : (rates[s0] as number)) : meanRateBps(m, qx, qy);
      }
      const dv = rate * dtS;
      bits[k]! += dv;
      ev += (weights[k] as number) * dv;
    }
    const bin = Math.floor((t0 + fm * span - acc.binStartMs) / VOLUME_BIN_MS);
    addToExpectedBin(acc, bin, ev);
    const pc = acc.expectedPieces;
    if (pc !== undefined && ev > 0) {
      const rate = ev / dtS;
      const a = t0 + fa * span;
      const b = t0 + fb * span;
      const np = pc.length;
      if (np >= 3 && pc[np - 1] === rate && pc[np - 2] === a) pc[np - 2] = b;
      else pc.push(a, b, rate);
    }
  }
}

/** Adds the sample at tMs: worst margin over the whole contact, volume over the data span. */
function addSample(acc: Accumulator, tMs: number, look: Look, s: LinkSample): void {
  acc.samples++;
  if (s.closureMarginDb < acc.worstMarginDb) {
    acc.worstMarginDb = s.closureMarginDb;
    acc.worstAtMs = tMs;
    acc.worstElevationDeg = look.elevationDeg;
  }
  if (tMs < acc.dataStartMs || tMs > acc.dataEndMs) return;
  const model = acc.model!;
  const q = model.adaptive ? s.esN0Db - model.qOffsetDb : s.marginDb;
  const table = acc.levels;
  if (table !== undefined) {
    let el = look.elevationDeg;
    if (el < table.minElevationDeg) el = table.minElevationDeg;
    if (el > 90) el = 90;
    table.valuesAt(el, levelShiftDb);
    const thr = model.stairs.thresholdsDb;
    const top = thr.length;
    const qs = acc.levelQ;
    const last = acc.lastLevelStep;
    const steps = acc.levelStep;
    for (let k = 0; k < acc.levelCount; k++) {
      const qk = q + (levelShiftDb[k] as number);
      qs[k] = qk;
      // stepAt, walked from the last sample's step (q moves little between samples)
      let st = last[k] as number;
      while (st + 1 < top && (thr[st + 1] as number) <= qk) st++;
      while (st >= 0 && (thr[st] as number) > qk) st--;
      steps[k] = st;
    }
  }
  if (acc.lastMs >= acc.dataStartMs && tMs > acc.lastMs) {
    integrateSegment(acc, acc.lastMs, acc.lastQ, acc.lastElevationDeg, tMs, q, look.elevationDeg);
    if (table !== undefined) integrateLevels(acc, acc.lastMs, acc.lastElevationDeg, tMs, look.elevationDeg);
  }
  if (table !== undefined) {
    const t = acc.lastLevelQ;
    acc.lastLevelQ = acc.levelQ;
    acc.levelQ = t;
    const u = acc.lastLevelStep;
    acc.lastLevelStep = acc.levelStep;
    acc.levelStep = u;
  }
  acc.lastMs = tMs;
  acc.lastQ = q;
  acc.lastElevationDeg = look.elevationDeg;
}

export interface LinkRunStats {
  linkSamples: number;
  propagations: number;
}

/** One contact of a spacecraft: its link context (null: none), data start and whether it keeps its rate pieces. */
interface Pending {
  contact: Contact;
  /** null: no link for the pair (the contact still counts for the overlaps). */
  ctx: LinkContext | null;
  dataStartMs: number;
  keepPieces: boolean;
}

/**
 * Fills `contact.link` for every contact whose spacecraft has a data radio.
 * Contacts are modified in place (they were made by this run).
 */
export function integrateContacts(
  contacts: Contact[],
  geometry: Geometry,
  setup: LinkSetup,
  settings: LinkSettings,
  stepS: number = DEFAULT_LINK_STEP_S,
  /** All contacts of the run when `contacts` is a part of them (which ones overlap is decided over these). */
  overlapContext?: readonly Contact[],
): LinkRunStats {
  const stepMs = stepS * 1000;
  const siteIndex = new Map(geometry.sites.map((s, i) => [s.stationId, i]));
  const state = new Float64Array(6);
  const look = newLook();
  const sample = newLinkSample();
  const sky = geometry.sky;
  const angles = newBodyAngles();
  const stats: LinkRunStats = { linkSamples: 0, propagations: 0 };
  const acqMs = settings.acquisitionTimeS * 1000;

  let modcodStride = 1;
  for (const l of setup.links.values()) modcodStride = Math.max(modcodStride, l.modcodTable.length);
  const levelCapacity = EXPECTED_VOLUME_LEVELS.length;
  const pool: Accumulator[] = [];
  const take = (): Accumulator => pool.pop() ?? new Accumulator(modcodStride, levelCapacity);

  // the links' shared parts, by spacecraft and station (made on a pair's first contact)
  const contexts = new Map<string, Map<string, LinkContext | null>>();
  const contextOf = (c: Contact): LinkContext | null => {
    let bySt = contexts.get(c.spacecraftId);
    if (!bySt) {
      bySt = new Map();
      contexts.set(c.spacecraftId, bySt);
    }
    let ctx = bySt.get(c.stationId);
    if (ctx === undefined) {
      const link = setup.links.get(linkKey(c.spacecraftId, c.stationId));
      const site = link ? geometry.sites[siteIndex.get(c.stationId) ?? -1] : undefined;
      ctx = link && site ? linkContextOf(link, site) : null;
      bySt.set(c.stationId, ctx);
    }
    return ctx;
  };
  const pendingOf = (c: Contact, ctx: LinkContext | null, keepPieces: boolean): Pending => ({
    contact: c,
    ctx,
    dataStartMs: Math.min(c.aosMs + acqMs, c.losMs),
    keepPieces,
  });
  // every contact by spacecraft, in AOS order (stable), then those with a link
  const bySpacecraft = new Map<string, Pending[]>();
  const group = (p: Pending): void => {
    const list = bySpacecraft.get(p.contact.spacecraftId);
    if (list) list.push(p);
    else bySpacecraft.set(p.contact.spacecraftId, [p]);
  };
  if (overlapContext === undefined || overlapContext === contacts) {
    // which contacts overlap another of their spacecraft (they keep their rate pieces):
    // contactsOverlappingOwnSpacecraft's clusters, over the same lists sorted by AOS
    for (const c of contacts) group(pendingOf(c, contextOf(c), false));
    for (const list of bySpacecraft.values()) {
      list.sort((a, b) => a.contact.aosMs - b.contact.aosMs);
      let reachMs = -Infinity;
      let first = 0;
      const close = (end: number) => {
        if (end - first > 1) for (let j = first; j < end; j++) list[j]!.keepPieces = true;
      };
      for (let i = 0; i < list.length; i++) {
        const c = list[i]!.contact;
        if (!(c.aosMs < reachMs)) {
          close(i);
          first = i;
        }
        if (c.losMs > reachMs) reachMs = c.losMs;
      }
      close(list.length);
    }
  } else {
    const overlapIdx = contactsOverlappingOwnSpacecraft(overlapContext);
    const set = new Set<Contact>();
    for (const i of overlapIdx) set.add(overlapContext[i]!);
    for (const c of contacts) group(pendingOf(c, contextOf(c), set.has(c)));
    for (const list of bySpacecraft.values()) list.sort((a, b) => a.contact.aosMs - b.contact.aosMs);
  }

  const evalAt = (acc: Accumulator, interp: StateInterpolator, tMs: number): void => {
    if (!interp.stateAt(tMs, state)) return;
    lookFrom(acc.site!, state, look);
    sky.at(tMs);
    evaluateLink(acc.link!, look, sample, false, sampleBodyTempK(acc, sky, state, look, angles), true);
    stats.linkSamples++;
    addSample(acc, tMs, look, sample);
  };
  const close = (acc: Accumulator): void => {
    finish(acc);
    acc.release();
    pool.push(acc);
  };

  for (const [scId, all] of bySpacecraft) {
    const target = geometry.targets.get(scId);
    if (!target) continue;
    // Events in time order: each contact's AOS, its data start, grid times, its LOS.
    const list = all.filter((p) => p.ctx !== null);
    if (list.length === 0) continue;
    const interp = new StateInterpolator(target, geometry.span.startMs);
    const active: Accumulator[] = [];
    let next = 0;
    // grid index range covering all contacts of this spacecraft
    const t0 = geometry.span.startMs;
    let k = Math.ceil((list[0]!.contact.aosMs - t0) / stepMs);
    let lastLos = -Infinity;
    for (const p of list) lastLos = Math.max(lastLos, p.contact.losMs);
    const kEnd = Math.floor((lastLos - t0) / stepMs);
    for (; k <= kEnd + 1; k++) {
      const tMs = k <= kEnd ? t0 + k * stepMs : Infinity;
      // open contacts whose AOS comes before this grid time
      while (next < list.length && list[next]!.contact.aosMs <= tMs) {
        const p = list[next++]!;
        const acc = take();
        acc.open(p.contact, p.ctx!, p.dataStartMs, p.keepPieces);
        evalAt(acc, interp, acc.aosMs);
        if (acc.dataStartMs > acc.aosMs) evalAt(acc, interp, acc.dataStartMs);
        active.push(acc);
      }
      // close contacts whose LOS comes before this grid time
      for (let i = active.length - 1; i >= 0; i--) {
        const acc = active[i]!;
        if (acc.losMs < tMs) {
          if (acc.lastMs < acc.losMs) evalAt(acc, interp, acc.losMs);
          close(acc);
          active.splice(i, 1);
        }
      }
      if (tMs === Infinity) break;
      if (active.length === 0) {
        if (next >= list.length) break;
        // jump to the grid point just before the next AOS
        k = Math.max(k, Math.ceil((list[next]!.contact.aosMs - t0) / stepMs) - 1);
        continue;
      }
      if (!interp.stateAt(tMs, state)) continue;
      sky.atGrid(t0, stepMs, k, tMs);
      for (let i = 0; i < active.length; i++) {
        const acc = active[i]!;
        if (tMs <= acc.aosMs || tMs >= acc.losMs) continue;
        lookFrom(acc.site!, state, look);
        evaluateLink(acc.link!, look, sample, false, sampleBodyTempK(acc, sky, state, look, angles), true);
        stats.linkSamples++;
        addSample(acc, tMs, look, sample);
      }
    }
    for (const acc of active) {
      if (acc.lastMs < acc.losMs) evalAt(acc, interp, acc.losMs);
      close(acc);
    }
    stats.propagations += interp.propagations;
  }
  return stats;
}
/**
 * Indices of the contacts in a cluster of overlapping windows of one spacecraft (a chain
 * of windows each starting before the ones before it have all ended), size 2 or more.
 */
export function contactsOverlappingOwnSpacecraft(contacts: readonly Contact[]): Set<number> {
  const out = new Set<number>();
  const bySc = new Map<string, number[]>();
  contacts.forEach((c, i) => {
    const l = bySc.get(c.spacecraftId);
    if (l) l.push(i);
    else bySc.set(c.spacecraftId, [i]);
  });
  for (const idx of bySc.values()) {
    idx.sort((a, b) => contacts[a]!.aosMs - contacts[b]!.aosMs);
    let reachMs = -Infinity;
    let cluster: number[] = [];
    const close = () => {
      if (cluster.length > 1) for (const j of cluster) out.add(j);
    };
    for (const i of idx) {
      const c = contacts[i]!;
      if (!(c.aosMs < reachMs)) {
        close();
        cluster = [];
      }
      cluster.push(i);
      if (c.losMs > reachMs) reachMs = c.losMs;
    }
    close();
  }
  return out;
}

/**
 * Fills `contact.otherLinks` for the spacecraft's other radios (setup.otherLinks): each
 * radio's volume over the same windows, by the same engine (one run per radio index).
 */
export function integrateOtherRadios(
  contacts: Contact[],
  geometry: Geometry,
  setup: LinkSetup,
  settings: LinkSettings,
  stepS: number = DEFAULT_LINK_STEP_S,
): LinkRunStats {
  const stats: LinkRunStats = { linkSamples: 0, propagations: 0 };
  for (const links of setup.otherLinks ?? []) {
    const pairs: { original: Contact; copy: Contact }[] = [];
    for (const c of contacts) {
      if (!links.has(linkKey(c.spacecraftId, c.stationId))) continue;
      const { link: _l, otherLinks: _o, ...bare } = c;
      pairs.push({ original: c, copy: bare as Contact });
    }
    if (pairs.length === 0) continue;
    const s = integrateContacts(
      pairs.map((p) => p.copy),
      geometry,
      { links, warnings: [] },
      settings,
      stepS,
    );
    stats.linkSamples += s.linkSamples;
    stats.propagations += s.propagations;
    for (const p of pairs) if (p.copy.link) (p.original.otherLinks ??= []).push(p.copy.link);
  }
  return stats;
}

/** Whole bits per bin by rounding the running sum, so the bins add up exactly to the total. */
export function wholeBitBins(bins: readonly number[]): { bins: number[]; totalBits: number } {
  const out: number[] = [];
  let cum = 0;
  let prevRounded = 0;
  for (const b of bins) {
    cum += b;
    const r = Math.round(cum);
    out.push(r - prevRounded);
    prevRounded = r;
  }
  return { bins: out, totalBits: prevRounded };
}

/** wholeBitBins of bins[0 .. n - 1] (the same running sum and rounding); the total in wholeTotalBits. */
let wholeTotalBits = 0;
function wholeBitBinsOf(bins: Float64Array, n: number): number[] {
  const out: number[] = [];
  let cum = 0;
  let prevRounded = 0;
  for (let i = 0; i < n; i++) {
    cum += bins[i] as number;
    const r = Math.round(cum);
    out.push(r - prevRounded);
    prevRounded = r;
  }
  wholeTotalBits = prevRounded;
  return out;
}

function modcodTimes(acc: Accumulator): Record<string, number> {
  const out: Record<string, number> = {};
  const ctx = acc.ctx!;
  const n = ctx.modcodCount;
  const names = ctx.modcodNames;
  const times = acc.modcodTimeS;
  for (let i = 0; i < n; i++) {
    const seconds = times[i] as number;
    if (seconds > 0) out[names[i] as string] = seconds;
  }
  return out;
}

function finish(acc: Accumulator): void {
  const bins = wholeBitBinsOf(acc.bins, acc.binCount);
  const link: ContactLink = {
    radioId: acc.link!.radioId,
    volumeBits: wholeTotalBits,
    dataStartMs: acc.dataStartMs,
    dataEndMs: acc.dataEndMs,
    closedS: acc.closedS,
    worstMarginDb: acc.worstMarginDb,
    worstMarginAtMs: acc.worstAtMs,
    worstMarginElevationDeg: acc.worstElevationDeg,
    peakRateBps: acc.peakRateBps,
    timeInModcodS: modcodTimes(acc),
    samples: acc.samples,
    binStartMs: acc.binStartMs,
    volumeBinsBits: bins,
  };
  if (acc.pieces !== undefined) link.ratePieces = acc.pieces;
  if (acc.levels !== undefined) {
    const expectedBins = wholeBitBinsOf(acc.expectedBins, acc.expectedBinCount);
    link.expectedVolumeBits = wholeTotalBits;
    link.expectedVolumeBinsBits = expectedBins;
    link.expectedVolumeBoundBits = expectedValueBound(EXPECTED_VOLUME_LEVELS, acc.levelBits);
    if (acc.expectedPieces !== undefined) link.expectedRatePieces = acc.expectedPieces;
  }
  acc.contact!.link = link;
}

/**
 * Largest angular radius of the Sun (perihelion, 0.272 deg) and of the Moon from a station
 * (perigee, 1,737.4 km over 350,000 km: 0.285 deg), rounded up, deg.
 */
const BODY_RADIUS_BOUND_DEG = 0.3;

/** An accumulator's limits for SkyBodies.farFromBoth: beyond them a body's disc noise is 0 (body-noise.ts cut-off). */
function farLimits(link: PreparedLink, site: Site): { cosSunFar: number; cosMoonFar: number } {
  const hpbw = link.rxBeamwidthDeg;
  const onEarth = Math.hypot(site.ecefKm[0], site.ecefKm[1], site.ecefKm[2]) < 7000;
  if (!(hpbw > 0) || !onEarth) return { cosSunFar: -2, cosMoonFar: -2 };
  const reach = BODY_RADIUS_BOUND_DEG + BODY_NOISE_CUTOFF_BEAMWIDTHS * hpbw;
  return { cosSunFar: farCosLimit(reach, FAR_SUN_MARGIN_DEG), cosMoonFar: farCosLimit(reach, FAR_MOON_MARGIN_DEG) };
}

/**
 * bodyTempK of one link sample (sky at the sample's time, look from lookFrom of the same
 * state): 0 at once when both bodies are surely beyond the noise cut-off of the beam
 * (where bodyTempK gives 0 too), else bodyTempK.
 */
function sampleBodyTempK(acc: Accumulator, sky: SkyBodies, state: Float64Array, look: Look, angles: BodyAngles): number {
  const link = acc.link!;
  const hpbw = link.rxBeamwidthDeg;
  if (!(hpbw > 0)) return 0;
  const site = acc.site!;
  const s = site.ecefKm;
  if (sky.farFromBoth(state[0]! - s[0], state[1]! - s[1], state[2]! - s[2], look.rangeKm, acc.cosSunFar, acc.cosMoonFar)) return 0;
  return bodyTempK(link, sky, site, state, angles);
}

/**
 * Antenna temperature the Sun and the Moon add at one sample (link/body-noise.ts), K:
 * sky must have been moved to the sample's time. 0 when the beamwidth is unknown.
 */
export function bodyTempK(link: PreparedLink, sky: SkyBodies, site: Site, stateEcef: Float64Array, angles: BodyAngles): number {
  const hpbw = link.rxBeamwidthDeg;
  if (!(hpbw > 0)) return 0;
  sky.angles(site, stateEcef, angles);
  return beamBodiesTempK(link.sunBrightnessK, link.moonBrightnessK, hpbw, angles);
}
