/**
 * Helpers shared by the element-set readers (tle.ts, omm.ts): strict number
 * parsing, the UTC calendar arithmetic for epochs, and the value ranges both
 * formats must respect. No I/O.
 *
 * Ranges: CCSDS 502.0-B-2 (Orbit Data Messages), OMM chapter (mean elements:
 * inclination 0..180 deg, angles 0..360 deg, eccentricity of a closed orbit
 * below 1, mean motion in rev/day) and the TLE column layout as published with
 * Spacetrack Report #3 (Hoots & Roehrich, 1980) and kept in Vallado et al.,
 * "Revisiting Spacetrack Report #3", AIAA 2006-6753. Ephemeris-type meanings
 * are from memory (0 = SGP4/SDP4 as distributed, 4 = SGP4-XP).
 */

import { WGS84_EQUATORIAL_RADIUS_KM, WGS84_GM_KM3_S2 } from '../geometry/earth.js';
import type { ElementSet } from './types.js';

export const MS_PER_DAY = 86_400_000;
export const US_PER_DAY = 86_400_000_000;

/**
 * A plain decimal number as both formats write it: optional sign, digits with an
 * optional point (".5" and "5." allowed), optional exponent. No NaN, Infinity,
 * hex or blanks inside. Returns undefined when the text is not such a number.
 */
export function parseDecimal(text: string): number | undefined {
  const t = text.trim();
  if (!/^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(t)) return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : undefined;
}

/** A non-negative integer written in digits only ("007" allowed). */
export function parseCount(text: string): number | undefined {
  const t = text.trim();
  if (!/^\+?\d+$/.test(t)) return undefined;
  const v = Number(t);
  return Number.isSafeInteger(v) ? v : undefined;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInYear(year: number): number {
  return isLeapYear(year) ? 366 : 365;
}

export function daysInMonth(year: number, month1: number): number {
  return new Date(Date.UTC(year, month1, 0)).getUTCDate();
}

/** UTC epoch milliseconds of 00:00 on day-of-year `dayOfYear` (1-based) of `year`. */
export function dayOfYearStartMs(year: number, dayOfYear: number): number {
  // Date.UTC maps years 0..99 to 1900..1999; setUTCFullYear does not.
  const d = new Date(0);
  d.setUTCFullYear(year, 0, dayOfYear);
  d.setUTCHours(0, 0, 0, 0);
  return d.getTime();
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, '0');
}

/**
 * "YYYY-MM-DDTHH:MM:SS.ffffff" (UTC, no zone suffix) for the day starting at
 * `dayStartMs` (a whole UTC day) plus `microsOfDay` (integer, may reach one day
 * or more after rounding; it carries into the date).
 */
export function isoFromDayMicros(dayStartMs: number, microsOfDay: number): string {
  const extraDays = Math.floor(microsOfDay / US_PER_DAY);
  const us = microsOfDay - extraDays * US_PER_DAY;
  const d = new Date(dayStartMs + extraDays * MS_PER_DAY);
  const secondsOfDay = Math.floor(us / 1_000_000);
  const micro = us - secondsOfDay * 1_000_000;
  const hh = Math.floor(secondsOfDay / 3600);
  const mm = Math.floor((secondsOfDay % 3600) / 60);
  const ss = secondsOfDay % 60;
  return (
    `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1, 2)}-${pad(d.getUTCDate(), 2)}` +
    `T${pad(hh, 2)}:${pad(mm, 2)}:${pad(ss, 2)}.${pad(micro, 6)}`
  );
}

/** Quote a value for a message: shows blanks and empty text plainly. */
export function quote(value: string): string {
  return JSON.stringify(value);
}

export interface RangeRule {
  min: number;
  max: number;
  minInclusive: boolean;
  maxInclusive: boolean;
  /** What is valid, for messages, e.g. "0 <= i <= 180 deg". */
  valid: string;
}

export function inRange(v: number, r: RangeRule): boolean {
  const lowOk = r.minInclusive ? v >= r.min : v > r.min;
  const highOk = r.maxInclusive ? v <= r.max : v < r.max;
  return lowOk && highOk;
}

export const INCLINATION_RANGE: RangeRule = {
  min: 0, max: 180, minInclusive: true, maxInclusive: true, valid: '0 to 180 deg',
};
export const ANGLE_360_RANGE: RangeRule = {
  min: 0, max: 360, minInclusive: true, maxInclusive: true, valid: '0 to 360 deg',
};
export const ECCENTRICITY_RANGE: RangeRule = {
  min: 0, max: 1, minInclusive: true, maxInclusive: false,
  valid: '0 <= e < 1 (a closed orbit)',
};
export const MEAN_MOTION_RANGE: RangeRule = {
  min: 0, max: Number.POSITIVE_INFINITY, minInclusive: false, maxInclusive: false,
  valid: 'greater than 0 rev/day',
};

/**
 * Ephemeris type as SGP4 users meet it: 0 (or blank) is what element sets are
 * distributed with; 1..3 are the old SGP/SGP4/SDP4 codes and mean the same
 * theory family; 4 marks SGP4-XP elements, which plain SGP4 must not use.
 * Returns a message when the type is not usable, else undefined.
 */
export function ephemerisTypeProblem(type: number): string | undefined {
  if (type >= 0 && type <= 3) return undefined;
  if (type === 4) {
    return 'ephemeris type 4 marks SGP4-XP elements, which this program cannot propagate; only SGP4 mean elements (type 0) are supported';
  }
  return 'valid ephemeris types are 0 (SGP4 mean elements; blank in a TLE counts as 0) or the legacy codes 1..3';
}

/** Security classification letters of the TLE/OMM (U unclassified, C, S). */
export const CLASSIFICATIONS = ['U', 'C', 'S'] as const;

/**
 * Lowest perigee height accepted, km above the WGS-84 equatorial radius. An orbit
 * whose perigee is lower (a sub-orbital set, e close to 1, a perigee inside the
 * Earth) cannot be flown for even a day: refused at reading, not planned empty.
 * 100 km is the usual edge of space (common practice); decaying sets near
 * re-entry still have perigees of 120 km and more.
 */
export const MIN_PERIGEE_HEIGHT_KM = 100;

/**
 * Perigee height, km above the equatorial radius, of mean elements: semi-major axis
 * from Kepler's third law with the mean motion (a = (GM / n^2)^(1/3)), times (1 - e).
 * The Kozai / Brouwer difference of the mean motion (a few km) does not matter here.
 */
export function perigeeHeightKm(meanMotionRevPerDay: number, eccentricity: number): number {
  const nRadS = (meanMotionRevPerDay * 2 * Math.PI) / 86_400;
  const aKm = Math.cbrt(WGS84_GM_KM3_S2 / (nRadS * nRadS));
  return aKm * (1 - eccentricity) - WGS84_EQUATORIAL_RADIUS_KM;
}

/** Mean motion (rev/day) and eccentricity of a parsed set (TLE columns 53-63 and 27-33, or the OMM's). */
export function meanMotionAndEccentricity(set: ElementSet): { meanMotionRevPerDay: number; eccentricity: number } | undefined {
  if (set.omm) return { meanMotionRevPerDay: set.omm.meanMotionRevPerDay, eccentricity: set.omm.eccentricity };
  if (set.tle) return { meanMotionRevPerDay: Number(set.tle.line2.slice(52, 63)), eccentricity: Number(`0.${set.tle.line2.slice(26, 33)}`) };
  return undefined;
}

/**
 * A message about a perigee below the floor, or undefined. Checked where a set
 * becomes a spacecraft's orbit (scenario/load.ts), not by the format readers: the
 * SGP4 verification file deliberately holds decaying orbits.
 */
export function perigeeProblem(meanMotionRevPerDay: number, eccentricity: number): string | undefined {
  const h = perigeeHeightKm(meanMotionRevPerDay, eccentricity);
  if (h >= MIN_PERIGEE_HEIGHT_KM) return undefined;
  return (
    `mean motion ${meanMotionRevPerDay} rev/day with eccentricity ${eccentricity} puts the perigee at ${h.toFixed(0)} km ` +
    `(${h < 0 ? 'inside the Earth' : 'below the floor'}); valid: a perigee at least ${MIN_PERIGEE_HEIGHT_KM} km above the WGS-84 equatorial radius`
  );
}

/** Epoch years accepted for element sets (the first satellite .. the end of the program's date range). */
export const EPOCH_YEAR_MIN = 1957;
export const EPOCH_YEAR_MAX = 2099;

/** Characters of a foreign line quoted in a message. */
export const QUOTED_LINE_CHARS = 80;

/** A line for a message: quoted, cut to QUOTED_LINE_CHARS characters. */
export function quoteLine(text: string): string {
  return quote(text.length > QUOTED_LINE_CHARS ? `${text.slice(0, QUOTED_LINE_CHARS)}...` : text);
}

/**
 * Quotes only the first offending line of a text: later calls return undefined.
 * A file that is not what it should be (a path to some other file) is then not
 * echoed line by line into the messages.
 */
export function firstLineQuoter(): (text: string) => string | undefined {
  let used = false;
  return (text) => {
    if (used) return undefined;
    used = true;
    return quoteLine(text);
  };
}
