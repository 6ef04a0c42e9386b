/**
 * Booking stage types: the rules a network books by (parsed from the booking
 * file by scenario/booking.ts) and what the booking solver returns.
 * Times are epoch ms (UTC); durations in s unless the name says otherwise.
 */

/** Mount of the antennas of a station (every antenna of a station is alike). */
export type MountType = 'el-az' | 'x-y';

/** Antenna mechanics of a station: axis limits and rates (see mechanics.ts). */
export interface AntennaMechanics {
  mount: MountType;
  /** First axis (azimuth for El/Az, X for X/Y) rate and acceleration limits. */
  axis1RateDegS: number;
  axis1AccelDegS2: number;
  /** Second axis (elevation for El/Az, Y for X/Y). */
  axis2RateDegS: number;
  axis2AccelDegS2: number;
  elevationMinDeg: number;
  elevationMaxDeg: number;
  /** El/Az: azimuth cable-wrap range, deg (e.g. [-270, 270]). */
  cableWrapDeg: [number, number];
  /** X/Y: each axis within +-this, deg. */
  xyLimitDeg: number;
  /** Pointing error above which the antenna is off track, deg. */
  trackingToleranceDeg: number;
}

export type DayZone = string; // 'UTC' or an IANA zone

export type RequirementKind = 'tracksPerDay' | 'minutesPerDay' | 'volumePerDayGbit' | 'maxGapH';

export interface Requirement {
  /** Index in the spacecraft's list, for names. */
  index: number;
  kind: RequirementKind;
  /** Threshold: tracks, minutes, Gbit (per day) or hours (gap). */
  value: number;
  hard: boolean;
  /** Soft only: value units lost per missing unit (track, minute, Gbit, uncovered gap window). */
  penalty: number;
  dayZone: DayZone;
}

export interface SpacecraftRules {
  /** Track length limits, s; null: the whole window is the only track. */
  minTrackS: number | null;
  maxTrackS: number | null;
  allowStations: string[] | null;
  denyStations: string[];
  requirements: Requirement[];
}

export interface MaintenancePeriod {
  stationId: string;
  /** 0-based antenna index; null: the whole station. */
  antenna: number | null;
  startMs: number;
  endMs: number;
  label: string;
}

export interface FixedBooking {
  stationId: string;
  antenna: number;
  startMs: number;
  endMs: number;
  label: string;
}

export interface BookingRules {
  /** Track grid, s (starts and ends fall on span start + k * gridS, or on the window edges). */
  gridS: number;
  /** Most candidate tracks a window gets on the full grid before the grid is coarsened for it. */
  maxCandidatesPerWindow: number;
  /** A spacecraft downlinks to one station at a time. */
  oneStationAtATime: boolean;
  /** Value a track by what it can take off the recorder (spacecraft with a recorder). */
  recorderAware: boolean;
  /** MIP limits. */
  timeLimitS: number;
  mipRelGap: number;
  /** Components with more binary variables than this go to the greedy solver. */
  mipMaxVariables: number;
  spacecraft: Map<string, SpacecraftRules>;
  mechanics: Map<string, AntennaMechanics>;
  maintenance: MaintenancePeriod[];
  fixed: FixedBooking[];
}

export const DEFAULT_RULES: Omit<BookingRules, 'spacecraft' | 'mechanics' | 'maintenance' | 'fixed'> = {
  gridS: 60,
  maxCandidatesPerWindow: 120,
  oneStationAtATime: false,
  recorderAware: true,
  timeLimitS: 10,
  mipRelGap: 1e-4,
  mipMaxVariables: 6000,
};

/** Pointing of an antenna at one instant. */
export interface Pointing {
  azimuthDeg: number;
  elevationDeg: number;
}

/** One candidate track: a period [startMs, endMs] inside a contact window. */
export interface Candidate {
  id: number;
  contactIndex: number;
  spacecraftId: string;
  stationId: string;
  startMs: number;
  endMs: number;
  /** Bits the link can carry over the period, lost tracking time taken off. */
  bits: number;
  /** Bits the mechanics took off (tracking lost inside the period). */
  mechanicsLostBits: number;
  /** Tracking time lost inside the period, s. */
  mechanicsLostS: number;
  /** Value without the recorder: priority x bits / 1e9. */
  value: number;
  priority: number;
  startPointing: Pointing | null;
  endPointing: Pointing | null;
  /** Antennas this candidate may use (maintenance and fixed bookings taken out). */
  antennas: number[];
}

export type SolverName = 'whole-window exact (existing)' | 'highs-mip' | 'greedy';

export interface ComponentRun {
  solver: SolverName;
  stations: string[];
  spacecraft: string[];
  candidates: number;
  variables: number;
  /** Objective found and best bound (value units); gap = (bound - objective) / |bound|. */
  objective: number;
  bound: number;
  gap: number;
  status: string;
  timeMs: number;
}

export interface BookedTrack {
  candidate: Candidate;
  antenna: number;
  /** Set-up before the track: the station's set-up plus the slew from the antenna's previous track, s. */
  setupBeforeS: number;
  slewBeforeS: number;
  /** Recorder-aware model estimate of the bits delivered (the recorder simulation gives the exact figure). */
  modelDeliveredBits: number;
}

export interface RequirementOutcome {
  spacecraftId: string;
  requirement: Requirement;
  /** Day (YYYY-MM-DD in the requirement's zone) or the gap window start (ISO), or 'span'. */
  period: string;
  needed: number;
  achieved: number;
  met: boolean;
  shortfall: number;
  penaltyApplied: number;
  /** Why a missed requirement could not be met. */
  reason: string | null;
}
