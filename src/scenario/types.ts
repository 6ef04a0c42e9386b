/**
 * The validated scenario: what flies, where it lands, and the span to walk.
 * Everything here is plain data in the units its names carry. Nothing after
 * scenario/ reads a file; every later stage takes these types.
 */

/** One mean element set, parsed and checked, ready for SGP4. */
export interface ElementSet {
  /** Where it came from, for messages: "ephemerides/demo.json: spacecraft[0].orbit.tle". */
  origin: string;
  /** Catalogue number as written (string: alpha-5 allowed). */
  catalogNumber: string;
  /** Epoch, UTC epoch milliseconds (fractional ms kept). */
  epochMs: number;
  /** Two TLE lines (columns 1..69) when the source was a TLE. */
  tle?: { line1: string; line2: string };
  /** OMM mean elements (SGP4 theory) when the source was an OMM. */
  omm?: OmmElements;
}

/** CCSDS 502.0-B OMM mean elements for SGP4/SDP4, in the units the standard uses. */
export interface OmmElements {
  objectName: string;
  objectId: string;
  /** Epoch as an ISO 8601 UTC calendar string with no zone suffix, microseconds kept. */
  epochIso: string;
  meanMotionRevPerDay: number;
  eccentricity: number;
  inclinationDeg: number;
  raanDeg: number;
  argPericenterDeg: number;
  meanAnomalyDeg: number;
  bstarPerEarthRadii: number;
  meanMotionDotRevPerDay2: number;
  meanMotionDdotRevPerDay3: number;
  noradCatId: number;
  elementSetNo: number;
  revAtEpoch: number;
  classification: string;
  ephemerisType: number;
}

export type OrbitSource =
  | { kind: 'elements'; sets: ElementSet[] }
  | { kind: 'moon' }
  | { kind: 'fixedSky'; rightAscensionDeg: number; declinationDeg: number; rangeKm: number }
  | { kind: 'ephemeris'; ephemeris: Ephemeris; grazingMarginKm: number }
  | { kind: 'lunarSite'; site: LunarSite }
  | { kind: 'lunarOrbit'; elements: LunarElements };

/** A CCSDS OEM read and checked (scenario/oem.ts): segments ordered by usable start. */
export interface Ephemeris {
  origin: string;
  objectName: string;
  segments: EphemerisSegment[];
}

export interface EphemerisSegment {
  objectName: string;
  /** Centre of the states; axes EME2000 (ICRF and GCRF taken as the same axes). */
  centre: 'EARTH' | 'MOON' | 'SUN' | 'EARTH-MOON BARYCENTER';
  interpolation: 'LAGRANGE' | 'HERMITE';
  degree: number;
  /** Usable span, UTC epoch ms. */
  useableStartMs: number;
  useableStopMs: number;
  /** Node epochs, UTC epoch ms, strictly increasing. */
  tMs: Float64Array;
  /** Per node x y z (km) vx vy vz (km/s). */
  states: Float64Array;
}

/** A transmitter on the lunar surface (selenographic, mean Earth / polar axis frame). */
export interface LunarSite {
  latitudeDeg: number;
  longitudeDeg: number;
  /** Height above the mean lunar radius, km. */
  heightKm: number;
  /** The site's own horizon mask on the Moon (elevation of the Earth needed, by azimuth). */
  mask: Mask;
}

/** Mean Keplerian elements of a lunar orbiter, Moon-centred, referred to the lunar equator at the epoch. */
export interface LunarElements {
  epochMs: number;
  semiMajorAxisKm: number;
  eccentricity: number;
  inclinationDeg: number;
  raanDeg: number;
  argPericenterDeg: number;
  meanAnomalyDeg: number;
  /** Height above the mean lunar radius at which a line of sight counts as grazing (occulted), km. */
  grazingMarginKm: number;
}

/** Transmit antenna: a constant gain, or a pattern versus off-boresight angle. */
export type TxAntenna =
  | { kind: 'constant'; gainDbi: number }
  | {
      kind: 'pattern';
      /** Off-boresight angles (deg, ascending from 0) and gains (dBi), linearly interpolated. */
      offBoresightDeg: number[];
      gainDbi: number[];
      /** Boresight nadir-pointing, or tracking the station (off-boresight 0). */
      pointing: 'nadir' | 'tracking';
    };

/** One row of a modulation-and-coding table. */
export interface ModcodEntry {
  name: string;
  /** Information bits per transmitted symbol. */
  spectralEfficiencyBitsPerSymbol: number;
  /** Threshold Es/N0 for the table's error criterion, dB. */
  esN0ThresholdDb: number;
  source: string;
}

export type Coding =
  | {
      kind: 'fixed';
      /** Name of the table entry or code, for reports. */
      name: string;
      /** Required Eb/N0 per information bit, dB. */
      ebN0ThresholdDb: number;
      informationRateBps: number;
      /** Information bits per symbol (sets the symbol rate, for Es/N0 and Shannon). */
      spectralEfficiencyBitsPerSymbol: number;
      rollOff: number;
    }
  | {
      kind: 'adaptive';
      tableName: string;
      table: ModcodEntry[];
      symbolRateBaud: number;
      rollOff: number;
    };

export interface Radio {
  id: string;
  frequencyHz: number;
  txPowerDbw: number;
  /** Losses between amplifier and antenna (circuit, cable, diplexer), dB >= 0. */
  txLossDb: number;
  antenna: TxAntenna;
  polarization: Polarization;
  coding: Coding;
  implementationLossDb: number;
  requiredMarginDb: number;
}

export type Polarization = 'RHCP' | 'LHCP' | 'linear-h' | 'linear-v';

export interface Spacecraft {
  id: string;
  name: string;
  priority: number;
  orbit: OrbitSource;
  /** The data downlink (totals, recorder, sizing) first (the file's dataRadio, default its first), then the others. */
  radios: Radio[];
  /** Onboard recorder (network planning). */
  recorder?: {
    capacityBits: number;
    generationBps: number;
    initialFillBits: number;
    /** Generation on for onS, then off for offS, repeating from the span start; absent: always on. */
    duty?: { onS: number; offS: number };
  };
}

/** Horizon mask: a constant elevation, or a profile of (azimuth, elevation) points. */
export type Mask =
  | { kind: 'constant'; elevationDeg: number }
  | { kind: 'profile'; azimuthDeg: number[]; elevationDeg: number[] };

/** Receive side: either a dish and a noise chain, or a stated G/T. */
export type Receiver =
  | {
      kind: 'chain';
      /** Dish diameter and aperture efficiency, or a stated gain. */
      gainDbi?: number;
      dishDiameterM?: number;
      apertureEfficiency?: number;
      /** Receiver (LNA onwards) noise temperature, K. */
      receiverNoiseTempK: number;
      /** Loss between feed and LNA, dB, at a physical temperature. */
      feedLossDb: number;
      feedPhysicalTempK: number;
      /** Antenna noise excluding the sky (spillover, ground), K. */
      antennaNoiseTempK: number;
    }
  | {
      kind: 'gt';
      gOverTDbK: number;
      /** Elevation at which the G/T was stated (clear sky). */
      atElevationDeg: number;
      /** Gain or dish, needed for pointing loss and beamwidth, optional. */
      gainDbi?: number;
      dishDiameterM?: number;
      apertureEfficiency?: number;
    };

/**
 * The climate values the network file gives for a station; each one left out is read from
 * the ITU-R maps for the station's site (src/link/climate/station.ts).
 */
export interface Climate {
  /** Rain rate exceeded 0.01 % of an average year, mm/h (ITU-R P.837). */
  rainRate001MmH?: number;
  /** Rain height, km (ITU-R P.839: 0 °C isotherm + 0.36 km). */
  rainHeightKm?: number;
  surfaceWaterVapourDensityGM3?: number;
  surfaceTemperatureK?: number;
  surfacePressureHpa?: number;
  /** Wet term of surface refractivity, median, N-units (ITU-R P.453). */
  nWetMedian?: number;
  /** Integrated cloud liquid water exceeded at the availability, kg/m² (ITU-R P.840), optional. */
  cloudLiquidWaterKgM2?: number;
}

export interface Station {
  id: string;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  heightKm: number;
  mask: Mask;
  timeZone: string;
  /** Absent: the station has no antenna or receiver in its file; its windows carry no link. */
  receiver?: Receiver;
  pointingErrorDeg: number;
  polarization: Polarization;
  climate: Climate;
  antennaCount: number;
  setupTimeS: number;
  /**
   * What the station can hear: each feed covers [minHz, maxHz] with its own receiver
   * (gain or dish and a receive chain or G/T). Absent: one feed, the station's receiver,
   * covering every frequency (scenario/feeds.ts feedFor). With feeds, `receiver` is the first feed's.
   */
  feeds?: Feed[];
}

export interface Feed {
  id: string;
  minHz: number;
  maxHz: number;
  receiver: Receiver;
}

/** A span to walk: [startMs, endMs). */
export interface Span {
  startMs: number;
  endMs: number;
}

export interface LinkSettings {
  /** Availability the budget is computed for, percent of time (90..99.999). */
  availabilityPercent: number;
  /** Time at AOS before data flows, s. */
  acquisitionTimeS: number;
  /** Minimum elevation for data, deg (in addition to the mask). */
  minDataElevationDeg: number;
}

export interface Scenario {
  spacecraft: Spacecraft[];
  stations: Station[];
  /** The span the files propose (demo week); the CLI may override. */
  span?: Span;
  link: LinkSettings;
  sources: { spacecraftFile: string; networkFile: string };
  /** Every file read (spacecraft file, network file, element-set files they name), for provenance. */
  inputFiles: InputFile[];
  /** Defaults taken and inputs accepted with a caveat, for the CLI to print before the work. */
  notices: Notice[];
}

export interface InputFile {
  path: string;
  sha256: string;
  bytes: number;
}

/** Something the user should know about the files that is not an error. */
export interface Notice {
  level: 'note' | 'warning';
  /** "file: field: what was taken or assumed". */
  message: string;
}
