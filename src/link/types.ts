/**
 * Link stage types: a PreparedLink holds everything constant for one spacecraft radio
 * and one station; a LinkSample is the per-time-step result written by evaluateLink
 * (src/link/budget.ts) without allocation.
 */
import type { AtmosphereResult, AtmosphereTable, ExceedanceLevelsTable } from './atmosphere/types.js';
import type { ModcodEntry, Polarization } from '../scenario/types.js';

/** Everything in the budget that does not change from one time step to the next. */
export interface PreparedLink {
  readonly radioId: string;
  readonly stationId: string;
  readonly frequencyHz: number;

  // --- transmit side
  readonly txPowerDbw: number;
  readonly txLossDb: number;
  /** 'constant' gain, or a 'pattern' looked up at the off-boresight angle. */
  readonly txAntennaKind: 'constant' | 'pattern';
  /** Constant gain, dBi (for a tracking pattern: the boresight gain). */
  readonly txConstantGainDbi: number;
  readonly txPatternOffBoresightDeg: readonly number[];
  readonly txPatternGainDbi: readonly number[];
  /** True when the pattern boresight points to nadir (off-boresight = off-nadir angle). */
  readonly txNadirPointing: boolean;
  /** Geocentric distance of the station, km (needed for nadir pointing only; else NaN). */
  readonly stationGeocentricRadiusKm: number;
  readonly txPolarization: Polarization;

  // --- receive side
  readonly receiverKind: 'chain' | 'gt';
  /** Receive antenna gain, dBi (for a 'gt' receiver without a gain: implied, see budget.ts). */
  readonly rxGainDbi: number;
  /** 3 dB beamwidth of the station antenna, deg (NaN when unknown and not needed). */
  readonly rxBeamwidthDeg: number;
  readonly rxPolarization: Polarization;
  /** Disc brightness of the quiet Sun and of the Moon at the frequency, K (body-brightness.ts). */
  readonly sunBrightnessK: number;
  readonly moonBrightnessK: number;
  /** Chain receiver: noise pieces, referred to the LNA input. */
  readonly antennaNoiseTempK: number;
  readonly feedLossDb: number;
  readonly feedPhysicalTempK: number;
  readonly receiverNoiseTempK: number;
  /**
   * Chain receiver, the same noise as noise.ts systemNoiseTempK written as
   * Tsys = skyNoiseWeight * Tsky + fixedNoiseTempK (1/Lf, and the rest), so a sample
   * needs no power of ten.
   */
  readonly skyNoiseWeight: number;
  readonly fixedNoiseTempK: number;
  /** 'gt' receiver: stated G/T, its elevation, the reference Tsys and reference sky temperature. */
  readonly statedGOverTDbK: number;
  readonly statedAtElevationDeg: number;
  readonly referenceSystemNoiseTempK: number;
  readonly referenceSkyNoiseTempK: number;
  /** How referenceSystemNoiseTempK was obtained, for the printed budget. */
  readonly referenceNoiseNote: string;

  // --- constant losses
  readonly pointingErrorDeg: number;
  readonly pointingLossDb: number;
  readonly polarizationLossDb: number;
  /** Other losses given by the user (e.g. a handbook's receive feeder loss), dB; 0 by default. */
  readonly extraLossDb: number;
  /** G/T given by the user (a handbook's figure), replacing the computed one, dB/K; NaN: computed. */
  readonly gOverTOverrideDbK: number;

  // --- coding
  readonly codingKind: 'fixed' | 'adaptive';
  readonly codingName: string;
  readonly implementationLossDb: number;
  readonly requiredMarginDb: number;
  /** Fixed: information rate and threshold. */
  readonly informationRateBps: number;
  readonly informationRateDbHz: number;
  readonly ebN0ThresholdDb: number;
  /** Information bits per symbol of the fixed code, and 10 log10 of it. */
  readonly spectralEfficiencyBitsPerSymbol: number;
  readonly spectralEfficiencyDb: number;
  /** Symbol rate (fixed: Rb / efficiency; adaptive: as given), baud, and 10 log10 of it. */
  readonly symbolRateBaud: number;
  readonly symbolRateDbHz: number;
  readonly rollOff: number;
  /** Rs (1 + rolloff), Hz. */
  readonly occupiedBandwidthHz: number;
  /** Adaptive: the table, 10 log10 of each entry's efficiency, the fallback entry. */
  readonly modcodTable: readonly ModcodEntry[];
  readonly modcodEfficiencyDb: Float64Array;
  readonly lowestModcodIndex: number;

  // --- geometry / settings
  readonly minDataElevationDeg: number;

  // --- atmosphere
  readonly atmosphere: AtmosphereTable;
  /** Scratch written by atmosphere.at on every sample (not shared between threads). */
  readonly atmosphereScratch: AtmosphereResult;
  /**
   * The absorption at the expected volume's exceedance levels (atmosphere/exceedance-levels.ts),
   * when the plan computes it; absent otherwise.
   */
  readonly exceedanceLevels?: ExceedanceLevelsTable;
}

/** The budget at one time step. Every field is a finite number after evaluateLink. */
export interface LinkSample {
  freeSpaceLossDb: number;
  gasDb: number;
  rainDb: number;
  cloudDb: number;
  scintillationDb: number;
  /** Total atmospheric attenuation (ITU-R P.618-14 sec. 2.5 combination), dB. */
  atmosphereDb: number;
  /** Sky brightness temperature through the atmosphere, K. */
  skyNoiseTempK: number;
  /** Antenna temperature of the Sun and the Moon in the beam, through the atmosphere, K (body-noise.ts). */
  bodyNoiseTempK: number;
  pointingLossDb: number;
  polarizationLossDb: number;
  /** Off-boresight angle used for the transmit pattern, deg (0 for constant/tracking). */
  offBoresightDeg: number;
  /** True when offBoresightDeg was beyond the last pattern point (last gain held). */
  outsidePattern: boolean;
  txGainDbi: number;
  eirpDbw: number;
  rxGainDbi: number;
  systemNoiseTempK: number;
  gOverTDbK: number;
  cN0DbHz: number;
  ebN0Db: number;
  esN0Db: number;
  /** Margin over the entry in use (adaptive) or the fixed code, net of the required margin, dB. */
  marginDb: number;
  /**
   * Closure margin, dB: above the most robust entry's threshold plus the required margin
   * (adaptive coding: how far the link is from not closing at all; fixed coding: marginDb).
   * This is the margin reported everywhere except the trace, where marginDb (over the
   * entry in use, about 0 by construction under adaptive coding) is also given.
   */
  closureMarginDb: number;
  /** Chosen MODCOD (adaptive), -1 when none closes or coding is fixed. */
  modcodIndex: number;
  rateBps: number;
  shannonRateBps: number;
  dopplerHz: number;
}

/** One line of a handbook-style budget. */
export interface BudgetTerm {
  name: string;
  value: number;
  unit: string;
  source: string;
}

/** Options of prepareLink that are not in the scenario. */
export interface PrepareLinkOptions {
  /**
   * Geocentric distance of the station, km (WGS-84 ellipsoid radius at its latitude plus
   * height, from src/geometry/earth.ts). Required when the transmit pattern points to nadir.
   */
  stationGeocentricRadiusKm?: number;
  /**
   * Clear-sky atmosphere (no rain, no cloud) of the station at the radio's frequency,
   * for a receiver stated as G/T in clear sky. Absent: the budget's own atmosphere table
   * is used at the stated elevation (the stated G/T is then taken to include the weather
   * at the budget's availability: less conservative).
   */
  clearSkyAtmosphere?: AtmosphereTable;
  /**
   * Reference system noise temperature assumed for a G/T receiver stated without a gain,
   * K (default DEFAULT_GT_REFERENCE_NOISE_TEMP_K in budget.ts).
   */
  gtReferenceSystemNoiseTempK?: number;
}

/** A fresh LinkSample with every field zeroed (allocate once, reuse per step). */
export function newLinkSample(): LinkSample {
  return {
    freeSpaceLossDb: 0,
    gasDb: 0,
    rainDb: 0,
    cloudDb: 0,
    scintillationDb: 0,
    atmosphereDb: 0,
    skyNoiseTempK: 0,
    bodyNoiseTempK: 0,
    pointingLossDb: 0,
    polarizationLossDb: 0,
    offBoresightDeg: 0,
    outsidePattern: false,
    txGainDbi: 0,
    eirpDbw: 0,
    rxGainDbi: 0,
    systemNoiseTempK: 0,
    gOverTDbK: 0,
    cN0DbHz: 0,
    ebN0Db: 0,
    esN0Db: 0,
    marginDb: 0,
    closureMarginDb: 0,
    modcodIndex: -1,
    rateBps: 0,
    shannonRateBps: 0,
    dopplerHz: 0,
  };
}
