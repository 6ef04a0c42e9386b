/** Plan stage types: contacts with their link results, and the plan as a whole. */
import type { Pass } from '../geometry/types.js';
import type { Span } from '../scenario/types.js';

/** What the link carried over one contact, for one radio. */
export interface ContactLink {
  radioId: string;
  /** Bits delivered: the rate integrated over the data part of the contact, whole bits. */
  volumeBits: number;
  /** Data flows from AOS + acquisition time, above the minimum data elevation. */
  dataStartMs: number;
  dataEndMs: number;
  /** Seconds during which the link closed (rate > 0). */
  closedS: number;
  /** Lowest closure margin over the contact's samples, dB (LinkSample.closureMarginDb). */
  worstMarginDb: number;
  worstMarginAtMs: number;
  worstMarginElevationDeg: number;
  peakRateBps: number;
  /** Seconds spent in each MODCOD (adaptive) or in the fixed code, closed only. */
  timeInModcodS: Record<string, number>;
  samples: number;
  /**
   * The volume split into 15-minute UTC bins (every time zone's offset is a
   * multiple of 15 min, so any zone's day boundary falls on a bin edge):
   * bin i covers [binStartMs + i * VOLUME_BIN_MS, ...). Whole bits, summing
   * exactly to volumeBits.
   */
  binStartMs: number;
  volumeBinsBits: number[];
  /**
   * The rate as a step function, [startMs, endMs, rateBps] triplets (rate > 0 only), for a
   * contact that overlaps another contact of the same spacecraft (plan/unique-volume.ts
   * counts the radio's data once there); absent otherwise.
   */
  ratePieces?: number[];
  /**
   * Expected volume over an average year's attenuation statistics (link/atmosphere/
   * exceedance-levels.ts), whole bits, with its 15-minute bins (same bins as the volume)
   * and the bound on its quadrature error, bits; absent when not computed.
   */
  expectedVolumeBits?: number;
  expectedVolumeBinsBits?: number[];
  expectedVolumeBoundBits?: number;
  /** The expected rate as [startMs, endMs, rateBps] pieces, kept where ratePieces is (unique-volume.ts). */
  expectedRatePieces?: number[];
}

export const VOLUME_BIN_MS = 15 * 60 * 1000;

export interface Contact extends Pass {
  durationS: number;
  /** When the craft sent what the station receives at AOS and LOS (received time less the light time), epoch ms. */
  aosTransmitMs?: number;
  losTransmitMs?: number;
  /** One-way light time at TCA, s. */
  lightTimeS?: number;
  /** The data downlink's link (radios[0]); absent without a radio or a feed for it. */
  link?: ContactLink;
  /** The spacecraft's other radios, each with its own volume (radios[1..] heard by a feed). */
  otherLinks?: ContactLink[];
}

/** A period of a contact with the Sun near the station's boresight (plan/sun-outages.ts). */
export interface SunOutage {
  stationId: string;
  spacecraftId: string;
  startMs: number;
  endMs: number;
  /** Closest approach of the Sun's centre to boresight, deg, and when. */
  minOffsetDeg: number;
  minAtMs: number;
  /** The station's half-power beamwidth at the data radio's frequency, deg. */
  beamwidthDeg: number;
  /** Antenna temperature the quiet Sun adds at the closest approach (before the atmosphere), K. */
  peakSunNoiseK: number;
}

export interface PlanResult {
  span: Span;
  /** Link sampling step inside contacts, s. */
  linkStepS: number;
  availabilityPercent: number;
  spacecraft: { id: string; name: string; priority: number }[];
  stations: { id: string; name: string; timeZone: string }[];
  /** All contacts, ordered by station (file order) then AOS. */
  contacts: Contact[];
  warnings: string[];
  /**
   * Where each warning comes from, as data (warningOrigins[i] belongs to warnings[i]): the
   * merge of worker batches and shards puts the warnings back in runPlan's order by it.
   */
  warningOrigins?: WarningOrigin[];
  stats: { propagations: number; linkSamples: number };
  /** Sun outages, ordered by station (file order) then start; absent for a geometry-only plan. */
  sunOutages?: SunOutage[];
}

/**
 * The origin of a warning: the contact search's (a spacecraft's element sets or track:
 * spacecraftId only) or the link set-up's (a station, with the spacecraft and radio index
 * that raised it).
 */
export interface WarningOrigin {
  spacecraftId?: string;
  stationId?: string;
  radioIndex?: number;
}
