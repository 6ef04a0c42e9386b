/**
 * Contract of the atmosphere stage: attenuation and sky noise on an Earth-space
 * path at one elevation, for one station, frequency and exceedance.
 */

export interface AtmosphereInput {
  frequencyHz: number;
  elevationDeg: number;
  /** Percentage of an average year the attenuation is exceeded (100 - availability), 0.001..10. */
  exceedancePercent: number;
  latitudeDeg: number;
  stationHeightKm: number;
  /** Polarisation tilt relative to horizontal, deg: 0 horizontal, 90 vertical, 45 circular. */
  polarizationTiltDeg: number;
  /** Receive antenna diameter and efficiency (scintillation aperture averaging). */
  antennaDiameterM: number;
  apertureEfficiency: number;
  /** Rain rate exceeded 0.01 % (mm/h) and rain height (km); absent: rain not modelled. */
  rainRate001MmH?: number;
  rainHeightKm?: number;
  surfaceWaterVapourDensityGM3: number;
  surfaceTemperatureK: number;
  surfacePressureHpa: number;
  nWetMedian: number;
  cloudLiquidWaterKgM2?: number;
}

export interface AtmosphereResult {
  gasDb: number;
  rainDb: number;
  cloudDb: number;
  scintillationDb: number;
  /** ITU-R P.618-14 §2.5 combination. */
  totalDb: number;
  /** Sky brightness temperature seen through that attenuation, K (P.618-14 §3). */
  skyNoiseTempK: number;
}

/**
 * The atmosphere precomputed for one station, frequency and exceedance on an
 * elevation grid (it depends on nothing else), interpolated on lookup.
 * `at` writes into `out` and allocates nothing.
 */
export interface AtmosphereTable {
  readonly minElevationDeg: number;
  at(elevationDeg: number, out: AtmosphereResult): void;
}

/**
 * One value per exceedance level (the absorptive attenuation gas + rain + cloud, dB, or what
 * the builder made of it) of one station and frequency, precomputed on an elevation grid.
 * `valuesAt` writes one value per level into `out` (length >= levels), allocates nothing.
 */
export interface ExceedanceLevelsTable {
  readonly minElevationDeg: number;
  readonly levels: number;
  valuesAt(elevationDeg: number, out: Float64Array): void;
}
