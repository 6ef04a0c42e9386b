/**
 * The per-sample downlink budget: prepare everything constant once per (radio,
 * station), then evaluate each time step into a reused LinkSample without allocating.
 *
 * Chain (each term from its own model file, sources there):
 *   EIRP      = P_tx - L_tx + G_tx(off-boresight)                       antenna.ts
 *   losses    = L_fs (P.525) + A_atm (P.618 sec. 2.5) + L_point + L_pol  free-space.ts, atmosphere/, antenna.ts, polarization.ts
 *   G/T       = chain: G - L_feed - 10 log10 Tsys(LNA input)             noise.ts
 *               stated: G/T_ref - 10 log10(1 + (Tsky - Tsky_ref)/Tsys_ref)
 *   C/N0      = EIRP - losses + G/T - 10 log10 k (exact k)              link-equation.ts
 *   fixed:    Eb/N0 = C/N0 - 10 log10 Rb; Es/N0 = Eb/N0 + 10 log10 eta;
 *             margin = Eb/N0 - L_impl - threshold - required margin; rate = Rb if margin >= 0
 *   adaptive: Es/N0 = C/N0 - 10 log10 Rs; entry = bestModcod(Es/N0 - L_impl, required);
 *             margin = Es/N0 - L_impl - threshold(entry or lowest) - required (over the entry in use);
 *             closure margin = Es/N0 - L_impl - threshold(most robust entry) - required;
 *             rate = eta(entry) Rs, 0 when none closes                  modcod/acm.ts
 *   Shannon   = B log2(1 + (C/N0)/B), B = Rs (1 + rolloff)             modcod/shannon.ts
 *   Doppler   = -f v_r / c                                             doppler.ts
 *   Sun, Moon = T_body (the caller's, body-noise.ts) x 10^(-A/10), added to Tsky at every
 *               sample (the caller passes 0 where no body is near the beam)
 * Below LinkSettings.minDataElevationDeg the rate is 0 (the budget is still computed).
 * The atmosphere is looked up at max(elevation, table.minElevationDeg): below the table
 * the atmosphere of its lowest elevation is used (such samples carry no data anyway).
 * Valid for rangeKm > 0; every output is finite for elevations -90..90.
 */
import { ScenarioError } from '../errors.js';
import type { Look } from '../geometry/types.js';
import type { LinkSettings, Radio, Station } from '../scenario/types.js';
import type { AtmosphereResult, AtmosphereTable } from './atmosphere/types.js';
import {
  beamwidthFromGainDeg,
  checkPattern,
  DEFAULT_APERTURE_EFFICIENCY,
  halfPowerBeamwidthDeg,
  offNadirAngleDeg,
  parabolicGainDbi,
  patternGainDbi,
  pointingLossDb,
} from './antenna.js';
import { dopplerShiftHz } from './doppler.js';
import { MOON_BRIGHTNESS_K, quietSunBrightnessK } from './body-brightness.js';
import { freeSpaceLossDb, fluxDensityDbwM2 } from './free-space.js';
import { carrierToNoiseDensityDbHz } from './link-equation.js';
import { bestModcod, lowestThresholdModcod } from './modcod/acm.js';
import { occupiedBandwidthHz, shannonCapacityBps } from './modcod/shannon.js';
import { gOverTAtSkyDbK, gOverTDbK, impliedSystemNoiseTempK, systemNoiseTempK } from './noise.js';
import { polarizationMismatchLossDb } from './polarization.js';
import type { BudgetTerm, LinkSample, PrepareLinkOptions, PreparedLink } from './types.js';
import { newLinkSample } from './types.js';
import { amplitudeToDb, BOLTZMANN_EXACT_DBW_PER_K_HZ, linearToDb, SPEED_OF_LIGHT_M_S } from './units.js';
import { skyNoiseTemperatureK } from './atmosphere/sky-noise.js';

/**
 * Reference system noise temperature assumed for a station stated as G/T without a
 * gain, K. An assumption (no published figure): a mid value for S/X-band stations with
 * cooled or good uncooled LNAs (Tsys 100-300 K). A lower value gives a larger (more
 * conservative) noise rise at low elevation. Override with
 * PrepareLinkOptions.gtReferenceSystemNoiseTempK.
 */
export const DEFAULT_GT_REFERENCE_NOISE_TEMP_K = 150;

function problem(stationOrRadio: string, path: string, message: string): ScenarioError {
  return new ScenarioError([{ file: stationOrRadio, path, message }]);
}

function emptyAtmosphere(): AtmosphereResult {
  return { gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 };
}

/** Prepare the constant part of the budget of `radio` (spacecraft) received at `station`. */
export function prepareLink(
  radio: Radio,
  station: Station,
  settings: LinkSettings,
  atmosphere: AtmosphereTable,
  opts: PrepareLinkOptions = {},
): PreparedLink {
  const radioWhere = `radio ${radio.id}`;
  const stationWhere = `station ${station.id}`;
  const f = radio.frequencyHz;

  // --- transmit antenna
  let txAntennaKind: 'constant' | 'pattern' = 'constant';
  let txConstantGainDbi: number;
  let txPatternOffBoresightDeg: readonly number[] = [];
  let txPatternGainDbi: readonly number[] = [];
  let txNadirPointing = false;
  let stationGeocentricRadiusKm = NaN;
  const ant = radio.antenna;
  if (ant.kind === 'constant') {
    txConstantGainDbi = ant.gainDbi;
  } else {
    checkPattern(ant.offBoresightDeg, ant.gainDbi);
    txAntennaKind = 'pattern';
    txPatternOffBoresightDeg = ant.offBoresightDeg.slice();
    txPatternGainDbi = ant.gainDbi.slice();
    txConstantGainDbi = ant.gainDbi[0] as number;
    txNadirPointing = ant.pointing === 'nadir';
    if (txNadirPointing) {
      const r = opts.stationGeocentricRadiusKm;
      if (r === undefined || !(r > 0)) {
        throw new Error('prepareLink: a nadir-pointing pattern needs opts.stationGeocentricRadiusKm (> 0)');
      }
      stationGeocentricRadiusKm = r;
    }
  }

  // --- receive antenna gain and beamwidth
  const rx = station.receiver;
  if (!rx) throw new Error(`prepareLink: station ${station.id} has no receiver (callers check radioHeardAt first)`);
  let rxGainDbi: number;
  let rxBeamwidthDeg = NaN;
  let antennaNoiseTempK = 0;
  let feedLossDb = 0;
  let feedPhysicalTempK = 0;
  let receiverNoiseTempK = 0;
  let statedGOverTDbK = NaN;
  let statedAtElevationDeg = NaN;
  let referenceSystemNoiseTempK = NaN;
  let referenceSkyNoiseTempK = NaN;
  let referenceNoiseNote = '';
  if (rx.kind === 'chain') {
    const eta = rx.apertureEfficiency ?? DEFAULT_APERTURE_EFFICIENCY;
    if (rx.gainDbi !== undefined) rxGainDbi = rx.gainDbi;
    else if (rx.dishDiameterM !== undefined) rxGainDbi = parabolicGainDbi(rx.dishDiameterM, f, eta);
    else throw problem(stationWhere, 'receiver.gainDbi', 'needs dishDiameterM (with apertureEfficiency) or gainDbi');
    rxBeamwidthDeg =
      rx.dishDiameterM !== undefined ? halfPowerBeamwidthDeg(rx.dishDiameterM, f) : beamwidthFromGainDeg(rxGainDbi, eta);
    antennaNoiseTempK = rx.antennaNoiseTempK;
    feedLossDb = rx.feedLossDb;
    feedPhysicalTempK = rx.feedPhysicalTempK;
    receiverNoiseTempK = rx.receiverNoiseTempK;
    if (!(feedLossDb >= 0)) throw problem(stationWhere, 'receiver.feedLossDb', `${feedLossDb} must be >= 0`);
    const tMin = systemNoiseTempK(0, antennaNoiseTempK, feedLossDb, feedPhysicalTempK, receiverNoiseTempK);
    if (!(tMin > 0)) throw problem(stationWhere, 'receiver.receiverNoiseTempK', 'the receive chain must have a positive noise temperature');
  } else {
    statedGOverTDbK = rx.gOverTDbK;
    statedAtElevationDeg = rx.atElevationDeg;
    const ref = emptyAtmosphere();
    const refTable = opts.clearSkyAtmosphere ?? atmosphere;
    refTable.at(Math.max(rx.atElevationDeg, refTable.minElevationDeg), ref);
    referenceSkyNoiseTempK = ref.skyNoiseTempK;
    const eta = rx.apertureEfficiency ?? DEFAULT_APERTURE_EFFICIENCY;
    let statedGainDbi: number | undefined = rx.gainDbi;
    if (statedGainDbi === undefined && rx.dishDiameterM !== undefined) {
      statedGainDbi = parabolicGainDbi(rx.dishDiameterM, f, eta);
    }
    if (statedGainDbi !== undefined) {
      rxGainDbi = statedGainDbi;
      rxBeamwidthDeg =
        rx.dishDiameterM !== undefined ? halfPowerBeamwidthDeg(rx.dishDiameterM, f) : beamwidthFromGainDeg(statedGainDbi, eta);
      referenceSystemNoiseTempK = impliedSystemNoiseTempK(statedGainDbi, rx.gOverTDbK);
      referenceNoiseNote = 'Tsys at the stated elevation implied by gain and G/T';
    } else {
      referenceSystemNoiseTempK = opts.gtReferenceSystemNoiseTempK ?? DEFAULT_GT_REFERENCE_NOISE_TEMP_K;
      rxGainDbi = rx.gOverTDbK + linearToDb(referenceSystemNoiseTempK);
      referenceNoiseNote = `assumed Tsys ${referenceSystemNoiseTempK} K at the stated elevation (no gain given); gain implied`;
    }
    if (!(referenceSystemNoiseTempK > referenceSkyNoiseTempK)) {
      throw problem(
        stationWhere,
        'receiver.gOverTDbK',
        `G/T ${rx.gOverTDbK} dB/K with gain ${rxGainDbi.toFixed(2)} dBi implies Tsys ${referenceSystemNoiseTempK.toFixed(1)} K, ` +
          `not above the sky noise ${referenceSkyNoiseTempK.toFixed(1)} K at ${rx.atElevationDeg} deg`,
      );
    }
  }

  // --- pointing and polarisation
  let pLossDb = 0;
  if (station.pointingErrorDeg > 0) {
    if (!Number.isFinite(rxBeamwidthDeg)) {
      throw problem(stationWhere, 'antenna.gainDbi', 'a gain or dish diameter is needed when pointingErrorDeg > 0');
    }
    pLossDb = pointingLossDb(station.pointingErrorDeg, rxBeamwidthDeg);
  }
  const polLossDb = polarizationMismatchLossDb(radio.polarization, station.polarization);

  // --- coding
  const coding = radio.coding;
  let informationRateBps = NaN;
  let ebN0ThresholdDb = NaN;
  let spectralEfficiencyBitsPerSymbol = NaN;
  let symbolRateBaud: number;
  let modcodTable: PreparedLink['modcodTable'] = [];
  let modcodEfficiencyDb = new Float64Array(0);
  let lowestModcodIndex = -1;
  let codingName: string;
  if (coding.kind === 'fixed') {
    if (!(coding.informationRateBps > 0)) throw problem(radioWhere, 'coding.informationRateBps', 'must be > 0');
    if (!(coding.spectralEfficiencyBitsPerSymbol > 0)) {
      throw problem(radioWhere, 'coding.spectralEfficiencyBitsPerSymbol', 'must be > 0');
    }
    informationRateBps = coding.informationRateBps;
    ebN0ThresholdDb = coding.ebN0ThresholdDb;
    spectralEfficiencyBitsPerSymbol = coding.spectralEfficiencyBitsPerSymbol;
    symbolRateBaud = informationRateBps / spectralEfficiencyBitsPerSymbol;
    codingName = coding.name;
  } else {
    if (coding.table.length === 0) throw problem(radioWhere, 'coding.table', `table "${coding.tableName}" is empty`);
    if (!(coding.symbolRateBaud > 0)) throw problem(radioWhere, 'coding.symbolRateBaud', 'must be > 0');
    modcodTable = coding.table.slice();
    modcodEfficiencyDb = new Float64Array(modcodTable.length);
    for (let i = 0; i < modcodTable.length; i++) {
      const eff = modcodTable[i]!.spectralEfficiencyBitsPerSymbol;
      if (!(eff > 0)) throw problem(radioWhere, `coding.table[${i}].spectralEfficiencyBitsPerSymbol`, 'must be > 0');
      modcodEfficiencyDb[i] = linearToDb(eff);
    }
    lowestModcodIndex = lowestThresholdModcod(modcodTable);
    symbolRateBaud = coding.symbolRateBaud;
    codingName = coding.tableName;
  }
  if (!(coding.rollOff >= 0)) throw problem(radioWhere, 'coding.rollOff', 'must be >= 0');

  return {
    radioId: radio.id,
    stationId: station.id,
    frequencyHz: f,
    txPowerDbw: radio.txPowerDbw,
    txLossDb: radio.txLossDb,
    txAntennaKind,
    txConstantGainDbi,
    txPatternOffBoresightDeg,
    txPatternGainDbi,
    txNadirPointing,
    stationGeocentricRadiusKm,
    txPolarization: radio.polarization,
    receiverKind: rx.kind,
    rxGainDbi,
    rxBeamwidthDeg,
    rxPolarization: station.polarization,
    sunBrightnessK: quietSunBrightnessK(f),
    moonBrightnessK: MOON_BRIGHTNESS_K,
    antennaNoiseTempK,
    feedLossDb,
    feedPhysicalTempK,
    receiverNoiseTempK,
    statedGOverTDbK,
    statedAtElevationDeg,
    referenceSystemNoiseTempK,
    referenceSkyNoiseTempK,
    referenceNoiseNote,
    pointingErrorDeg: station.pointingErrorDeg,
    pointingLossDb: pLossDb,
    polarizationLossDb: polLossDb,
    extraLossDb: 0,
    gOverTOverrideDbK: NaN,
    // Tsys is linear in Tsky: its slope and intercept, from the same function as the printout
    skyNoiseWeight: rx.kind === 'chain' ? systemNoiseTempK(1, 0, feedLossDb, 0, 0) : 0,
    fixedNoiseTempK: rx.kind === 'chain' ? systemNoiseTempK(0, antennaNoiseTempK, feedLossDb, feedPhysicalTempK, receiverNoiseTempK) : 0,
    codingKind: coding.kind,
    codingName,
    implementationLossDb: radio.implementationLossDb,
    requiredMarginDb: radio.requiredMarginDb,
    informationRateBps,
    informationRateDbHz: coding.kind === 'fixed' ? linearToDb(informationRateBps) : NaN,
    ebN0ThresholdDb,
    spectralEfficiencyBitsPerSymbol,
    spectralEfficiencyDb: coding.kind === 'fixed' ? linearToDb(spectralEfficiencyBitsPerSymbol) : NaN,
    symbolRateBaud,
    symbolRateDbHz: linearToDb(symbolRateBaud),
    rollOff: coding.rollOff,
    occupiedBandwidthHz: occupiedBandwidthHz(symbolRateBaud, coding.rollOff),
    modcodTable,
    modcodEfficiencyDb,
    lowestModcodIndex,
    minDataElevationDeg: settings.minDataElevationDeg,
    atmosphere,
    atmosphereScratch: emptyAtmosphere(),
  };
}

/** Free-space loss's constant part (free-space.ts: 20 log10(4 pi / c) + 20 log10(1000), added in its order). */
const FREE_SPACE_CONSTANT_DB = amplitudeToDb((4 * Math.PI) / SPEED_OF_LIGHT_M_S) + amplitudeToDb(1000);
/** 20 log10 of the last frequency seen (links of one band share it), dB. */
let lastFreqHz = Number.NaN;
let lastFreqDb = Number.NaN;

/**
 * freeSpaceLossDb(rangeKm, freqHz) with the frequency's term kept from the last call: the
 * same terms added in the same order, so the same number.
 */
function freeSpaceLossSameDb(rangeKm: number, freqHz: number): number {
  if (!(rangeKm > 0) || !(freqHz > 0)) return freeSpaceLossDb(rangeKm, freqHz); // its ModelRangeError
  if (freqHz !== lastFreqHz) {
    lastFreqDb = amplitudeToDb(freqHz);
    lastFreqHz = freqHz;
  }
  return FREE_SPACE_CONSTANT_DB + amplitudeToDb(rangeKm) + lastFreqDb;
}

/**
 * Evaluate the budget at one look (elevation, range, range rate) into `out`. Allocates
 * nothing. With `full` false the reference columns (Shannon capacity, Doppler) are left
 * as they were: the volume integration needs neither. With `volumeOnly` (the volume
 * integration, plan/link.ts) an adaptive link's entry in use is not chosen: out.ebN0Db,
 * out.marginDb, out.modcodIndex and out.rateBps are left as they were (the integration
 * takes its steps from Es/N0 itself); every other field is as without it.
 */
export function evaluateLink(p: PreparedLink, look: Look, out: LinkSample, full = true, bodyTempK = 0, volumeOnly = false): void {
  const f = p.frequencyHz;
  out.freeSpaceLossDb = freeSpaceLossSameDb(look.rangeKm, f);

  // Atmosphere, clamped into the table's elevation range.
  let atmElevationDeg = look.elevationDeg;
  if (atmElevationDeg < p.atmosphere.minElevationDeg) atmElevationDeg = p.atmosphere.minElevationDeg;
  if (atmElevationDeg > 90) atmElevationDeg = 90;
  const a = p.atmosphereScratch;
  p.atmosphere.at(atmElevationDeg, a);
  out.gasDb = a.gasDb;
  out.rainDb = a.rainDb;
  out.cloudDb = a.cloudDb;
  out.scintillationDb = a.scintillationDb;
  out.atmosphereDb = a.totalDb;
  out.skyNoiseTempK = a.skyNoiseTempK;
  // the Sun and the Moon in the beam, seen through the same atmosphere
  const bodyK = bodyTempK > 0 ? bodyTempK * 10 ** (-a.totalDb / 10) : 0;
  out.bodyNoiseTempK = bodyK;

  // Transmit side.
  let offDeg = 0;
  let outside = false;
  let txGainDbi = p.txConstantGainDbi;
  if (p.txAntennaKind === 'pattern' && p.txNadirPointing) {
    offDeg = offNadirAngleDeg(look.rangeKm, look.elevationDeg, p.stationGeocentricRadiusKm);
    txGainDbi = patternGainDbi(p.txPatternOffBoresightDeg, p.txPatternGainDbi, offDeg);
    outside = offDeg > (p.txPatternOffBoresightDeg[p.txPatternOffBoresightDeg.length - 1] as number);
  }
  out.offBoresightDeg = offDeg;
  out.outsidePattern = outside;
  out.txGainDbi = txGainDbi;
  out.eirpDbw = p.txPowerDbw - p.txLossDb + txGainDbi;

  // Receive side.
  out.rxGainDbi = p.rxGainDbi;
  if (p.receiverKind === 'chain') {
    const tsysK = p.skyNoiseWeight * (a.skyNoiseTempK + bodyK) + p.fixedNoiseTempK;
    out.systemNoiseTempK = tsysK;
    out.gOverTDbK = gOverTDbK(p.rxGainDbi, p.feedLossDb, tsysK);
  } else {
    out.systemNoiseTempK = p.referenceSystemNoiseTempK + (a.skyNoiseTempK + bodyK - p.referenceSkyNoiseTempK);
    out.gOverTDbK = gOverTAtSkyDbK(p.statedGOverTDbK, p.referenceSystemNoiseTempK, p.referenceSkyNoiseTempK, a.skyNoiseTempK + bodyK);
  }
  if (p.gOverTOverrideDbK === p.gOverTOverrideDbK) out.gOverTDbK = p.gOverTOverrideDbK; // given (not NaN)
  out.pointingLossDb = p.pointingLossDb;
  out.polarizationLossDb = p.polarizationLossDb;

  const lossesDb = out.freeSpaceLossDb + out.atmosphereDb + p.pointingLossDb + p.polarizationLossDb + p.extraLossDb;
  const cN0DbHz = carrierToNoiseDensityDbHz(out.eirpDbw, lossesDb, out.gOverTDbK);
  out.cN0DbHz = cN0DbHz;

  // Coding.
  let rateBps: number;
  if (p.codingKind === 'fixed') {
    const ebN0Db = cN0DbHz - p.informationRateDbHz;
    out.ebN0Db = ebN0Db;
    out.esN0Db = ebN0Db + p.spectralEfficiencyDb;
    out.marginDb = ebN0Db - p.implementationLossDb - p.ebN0ThresholdDb - p.requiredMarginDb;
    out.modcodIndex = -1;
    out.closureMarginDb = out.marginDb;
    rateBps = out.marginDb >= 0 ? p.informationRateBps : 0;
  } else {
    const esN0Db = cN0DbHz - p.symbolRateDbHz;
    out.esN0Db = esN0Db;
    if (volumeOnly) {
      out.closureMarginDb =
        esN0Db - p.implementationLossDb - p.modcodTable[p.lowestModcodIndex]!.esN0ThresholdDb - p.requiredMarginDb;
      return;
    }
    const idx = bestModcod(p.modcodTable, esN0Db - p.implementationLossDb, p.requiredMarginDb);
    const k = idx >= 0 ? idx : p.lowestModcodIndex;
    const entry = p.modcodTable[k]!;
    out.ebN0Db = esN0Db - (p.modcodEfficiencyDb[k] as number);
    out.marginDb = esN0Db - p.implementationLossDb - entry.esN0ThresholdDb - p.requiredMarginDb;
    out.modcodIndex = idx;
    out.closureMarginDb =
      esN0Db - p.implementationLossDb - p.modcodTable[p.lowestModcodIndex]!.esN0ThresholdDb - p.requiredMarginDb;
    rateBps = idx >= 0 ? entry.spectralEfficiencyBitsPerSymbol * p.symbolRateBaud : 0;
  }
  out.rateBps = look.elevationDeg >= p.minDataElevationDeg ? rateBps : 0;
  if (full) {
    out.shannonRateBps = shannonCapacityBps(p.occupiedBandwidthHz, cN0DbHz);
    out.dopplerHz = dopplerShiftHz(f, look.rangeRateKmS);
  }
}

/**
 * How much the sample's Es/N0 (and Eb/N0, and the margin) changes when its atmosphere is
 * replaced by an absorptive attenuation absorptionDb without scintillation (the expected
 * volume's levels): the loss difference plus the G/T change of the sky noise that
 * attenuation emits (ITU-R P.618-14 §3), through the same receiver model as evaluateLink;
 * the Sun's and the Moon's noise in the beam is seen through the new attenuation too.
 * A G/T given by the user stays. Allocates nothing.
 */
export function esN0ShiftDb(p: PreparedLink, s: LinkSample, absorptionDb: number): number {
  let gt = s.gOverTDbK;
  if (p.gOverTOverrideDbK !== p.gOverTOverrideDbK) {
    const bodyK = s.bodyNoiseTempK > 0 ? s.bodyNoiseTempK * 10 ** ((s.atmosphereDb - absorptionDb) / 10) : 0;
    const tskyK = skyNoiseTemperatureK(absorptionDb) + bodyK;
    gt =
      p.receiverKind === 'chain'
        ? gOverTDbK(p.rxGainDbi, p.feedLossDb, p.skyNoiseWeight * tskyK + p.fixedNoiseTempK)
        : gOverTAtSkyDbK(p.statedGOverTDbK, p.referenceSystemNoiseTempK, p.referenceSkyNoiseTempK, tskyK);
  }
  return s.atmosphereDb - absorptionDb + (gt - s.gOverTDbK);
}

/**
 * The budget at one look, term by term, for a handbook-style printout (allocates).
 * bodyTempK: the Sun's and the Moon's antenna temperature in the beam (body-noise.ts), K.
 */
export function budgetTerms(p: PreparedLink, look: Look, bodyTempK = 0): BudgetTerm[] {
  const s = newLinkSample();
  evaluateLink(p, look, s, true, bodyTempK);
  const t: BudgetTerm[] = [];
  const add = (name: string, value: number, unit: string, source: string): void => {
    t.push({ name, value, unit, source });
  };
  add('Frequency', p.frequencyHz / 1e6, 'MHz', 'radio');
  add('Elevation', look.elevationDeg, 'deg', 'geometry');
  add('Slant range', look.rangeKm, 'km', 'geometry');
  add('Transmit power', p.txPowerDbw, 'dBW', 'radio');
  add('Transmit losses', -p.txLossDb, 'dB', 'radio');
  if (p.txAntennaKind === 'pattern' && p.txNadirPointing) {
    add('Off-boresight angle (nadir pointing)', s.offBoresightDeg, 'deg', 'spherical-Earth geometry (law of cosines)');
  }
  add(
    'Transmit antenna gain',
    s.txGainDbi,
    'dBi',
    p.txAntennaKind === 'pattern' ? (s.outsidePattern ? 'pattern (beyond last point: last gain held)' : 'pattern, linear interpolation') : 'radio',
  );
  add('EIRP', s.eirpDbw, 'dBW', 'P_tx - L_tx + G_tx');
  add('Free-space loss', -s.freeSpaceLossDb, 'dB', 'ITU-R P.525 sec. 2.2');
  add('Gaseous absorption', -s.gasDb, 'dB', 'ITU-R P.676-13 Annex 2 (surface conditions)');
  add('Rain attenuation', -s.rainDb, 'dB', 'ITU-R P.618-14 sec. 2.2.1.1');
  add('Cloud attenuation', -s.cloudDb, 'dB', 'ITU-R P.840-9');
  add('Scintillation', -s.scintillationDb, 'dB', 'ITU-R P.618-14 sec. 2.4.1');
  add('Atmosphere total', -s.atmosphereDb, 'dB', 'ITU-R P.618 sec. 2.5 combination');
  add('Pointing loss', -s.pointingLossDb, 'dB', `12 (${p.pointingErrorDeg} / ${p.rxBeamwidthDeg.toPrecision(3)} deg)^2, common practice`);
  add('Polarisation mismatch', -s.polarizationLossDb, 'dB', `${p.txPolarization} -> ${p.rxPolarization}, ideal antennas; 25 dB cross-polar isolation (common practice)`);
  if (p.extraLossDb !== 0) add('Other losses', -p.extraLossDb, 'dB', 'given by the user');
  add('Power flux density at the station (free space)', fluxDensityDbwM2(s.eirpDbw, look.rangeKm), 'dBW/m2', 'EIRP / (4 pi d^2)');
  add('Receive antenna gain', s.rxGainDbi, 'dBi', p.receiverKind === 'chain' ? 'eta (pi D / lambda)^2 or stated' : p.referenceNoiseNote);
  add('Sky noise temperature', s.skyNoiseTempK, 'K', 'ITU-R P.618 sec. 3');
  if (bodyTempK > 0) add('Moon in the beam (disc centred, through the atmosphere)', s.bodyNoiseTempK, 'K', `${p.moonBrightnessK} K lunar disc (Krotikov & Troitskii 1964) in a Gaussian main lobe`);
  if (p.receiverKind === 'chain') {
    add('Feed loss', -p.feedLossDb, 'dB', 'station');
    add('System noise temperature (LNA input)', s.systemNoiseTempK, 'K', '(Tsky + Tant)/Lf + Tf (1 - 1/Lf) + Trx');
  } else {
    add('Stated G/T', p.statedGOverTDbK, 'dB/K', `station, clear sky at ${p.statedAtElevationDeg} deg`);
    add('System noise temperature', s.systemNoiseTempK, 'K', 'Tsys_ref + (Tsky - Tsky_ref), sky noise by ITU-R P.618-14 sec. 3');
  }
  add(
    'Received carrier power',
    s.eirpDbw - s.freeSpaceLossDb - s.atmosphereDb - s.pointingLossDb - s.polarizationLossDb - p.extraLossDb + s.rxGainDbi,
    'dBW',
    'EIRP - losses + G_rx (Friis)',
  );
  add('G/T', s.gOverTDbK, 'dB/K', Number.isNaN(p.gOverTOverrideDbK) ? 'G_rx - 10 log10 Tsys' : 'given by the user (replaces the computed G/T)');
  add("Boltzmann's constant", BOLTZMANN_EXACT_DBW_PER_K_HZ, 'dBW/(K.Hz)', 'BIPM SI 9th ed. (2019), exact k');
  add('C/N0', s.cN0DbHz, 'dB-Hz', 'EIRP - losses + G/T - 10 log10 k');
  if (p.codingKind === 'fixed') {
    add('Information rate', p.informationRateBps, 'bit/s', 'radio');
    add('Eb/N0', s.ebN0Db, 'dB', 'C/N0 - 10 log10 Rb');
    add('Es/N0', s.esN0Db, 'dB', 'Eb/N0 + 10 log10 eta');
    add('Implementation loss', -p.implementationLossDb, 'dB', 'radio');
    add(`Required Eb/N0 (${p.codingName})`, -p.ebN0ThresholdDb, 'dB', 'coding');
  } else {
    const robust = p.modcodTable[p.lowestModcodIndex]!;
    add('Symbol rate', p.symbolRateBaud, 'baud', 'radio');
    add('Es/N0', s.esN0Db, 'dB', 'C/N0 - 10 log10 Rs');
    add('Eb/N0', s.ebN0Db, 'dB', 'Es/N0 - 10 log10 eta');
    add('Implementation loss', -p.implementationLossDb, 'dB', 'radio');
    add(`Required Es/N0 (${robust.name}, the most robust entry)`, -robust.esN0ThresholdDb, 'dB', robust.source);
  }
  add('Required margin', -p.requiredMarginDb, 'dB', 'radio');
  add('Margin', s.closureMarginDb, 'dB', p.codingKind === 'fixed' ? 'sum of the above' : 'sum of the above: closure margin (adaptive coding)');
  if (p.codingKind === 'adaptive') {
    if (s.modcodIndex >= 0) {
      const e = p.modcodTable[s.modcodIndex]!;
      add(`Entry in use: required Es/N0 (${e.name})`, -e.esN0ThresholdDb, 'dB', e.source);
      add('Margin over the entry in use', s.marginDb, 'dB', 'Es/N0 - L_impl - threshold in use - required margin');
    } else {
      add('Entry in use: none closes', 0, 'dB', 'no entry of the table closes with the required margin');
    }
  }
  add('Data rate', s.rateBps, 'bit/s', look.elevationDeg >= p.minDataElevationDeg ? 'coding' : 'below minimum data elevation: 0');
  add('Shannon capacity of occupied band', s.shannonRateBps, 'bit/s', `B log2(1 + C/(N0 B)), B = ${p.occupiedBandwidthHz.toPrecision(4)} Hz`);
  add('Doppler shift', s.dopplerHz, 'Hz', '-f v_r / c');
  return t;
}
