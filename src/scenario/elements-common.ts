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
