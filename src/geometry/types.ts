/**
 * Geometry stage types. Time is UTC epoch milliseconds (`tMs`); positions are
 * Earth-centred Earth-fixed (ECEF, WGS-84 axes, polar motion ignored) in km.
 */

/**
 * A thing in the sky whose ECEF state can be asked for at any time.
 * `stateEcefAt` writes position (km) into out[0..2] and velocity (km/s) into
 * out[3..5] and returns true, or returns false when no valid state exists
 * (SGP4 error such as decay). Implementations must not allocate per call.
 */
export interface Target {
  readonly spacecraftId: string;
  /** Coarse scan step the contact search should use for this target, s. */
  readonly scanStepS: number;
  stateEcefAt(tMs: number, out: Float64Array): boolean;
  /** Count of state evaluations so far (benchmarks and fast-path asserts). */
  readonly evaluations: number;
  /** First time at which the state failed (track ends), or undefined. */
  readonly failedAtMs: number | undefined;
  /** Why the track ended, for the one warning. */
  readonly failureReason: string | undefined;
  /**
   * Further condition of sight from a station (ECEF km) at the state last returned by
   * stateEcefAt, deg (> 0: visible): the Moon's limb and a lunar site's own mask,
   * occultation by the Moon. Absent: the station's mask alone decides.
   */
  sightMarginDeg?(stationEcefKm: ArrayLike<number>): number;
  /** Where the target has states (an ephemeris file's usable span); absent: everywhere. */
  readonly coverage?: { startMs: number; endMs: number };
  /** One-way light time of the state last returned, s (light-time corrected targets only). */
  readonly lastLightTimeS?: number;
}

/** A ground site prepared for fast topocentric transforms. */
export interface Site {
  stationId: string;
  latitudeDeg: number;
  longitudeDeg: number;
  heightKm: number;
  /** ECEF position, km. */
  ecefKm: [number, number, number];
  /** Rows of the ECEF->ENU rotation: east, north, up unit vectors. */
  east: [number, number, number];
  north: [number, number, number];
  up: [number, number, number];
}

/** Look angles of a target from a site at one instant. */
export interface Look {
  azimuthDeg: number;
  elevationDeg: number;
  rangeKm: number;
  /** Rate of change of slant range, km/s (positive: receding). */
  rangeRateKmS: number;
}

/** One contact window of one spacecraft over one station. */
export interface Pass {
  spacecraftId: string;
  stationId: string;
  aosMs: number;
  losMs: number;
  tcaMs: number;
  maxElevationDeg: number;
  aosAzimuthDeg: number;
  losAzimuthDeg: number;
  /** Elevation at AOS and LOS, deg (the contact search fills them; the slow reference may not). */
  aosElevationDeg?: number;
  losElevationDeg?: number;
  /** True when the window was cut by the start (AOS) or end (LOS) of the span. */
  aosClipped: boolean;
  losClipped: boolean;
  /** True when LOS is where the target's track ended (SGP4 failure such as decay). */
  losTrackEnded?: boolean;
}

export interface SearchOptions {
  /** Override of the target's derived scan step, s. */
  scanStepS?: number;
  /** AOS/LOS refinement tolerance, s. */
  edgeToleranceS: number;
  /** Iteration limit of each refinement; exceeding it is a bug and throws. */
  maxIterations: number;
  /** Peak (max elevation) time tolerance, s; default DEFAULT_PEAK_TOLERANCE_S. */
  peakToleranceS?: number;
}

/** Default peak-time tolerance, s: elevation is flat at the peak (error ~1e-5 deg at 0.1 s). */
export const DEFAULT_PEAK_TOLERANCE_S = 0.1;

export const DEFAULT_SEARCH: SearchOptions = { edgeToleranceS: 0.01, maxIterations: 200 };
