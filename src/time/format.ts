/**
 * Time formatting at the edges. Inside the program time is epoch ms; every
 * printed time is ISO 8601 UTC ("2026-03-05T04:12:33.4Z" style, to 0.1 s
 * by default) unless a zone is asked for.
 */
import { DateTime } from 'luxon';

const DAY_MS = 86_400_000;
/** The last day formatted ("2026-03-05T") and its number: contacts come in runs of one day. */
let cachedDay = Number.NaN;
let cachedDayText = '';

const two = (v: number): string => (v < 10 ? `0${v}` : `${v}`);

/** Hours, minutes, seconds and milliseconds of a time of day. */
export interface ClockParts {
  h: number;
  m: number;
  s: number;
  milli: number;
}

const clock: ClockParts = { h: 0, m: 0, s: 0, milli: 0 };

/** Splits `msOfDay` (whole ms since midnight, 0 <= msOfDay < 86,400,000) into out. */
export function clockOfDay(msOfDay: number, out: ClockParts): void {
  let r = msOfDay;
  const h = Math.floor(r / 3_600_000);
  r -= h * 3_600_000;
  const m = Math.floor(r / 60_000);
  r -= m * 60_000;
  const sec = Math.floor(r / 1000);
  out.h = h;
  out.m = m;
  out.s = sec;
  out.milli = r - sec * 1000;
}

/** Date.prototype.toISOString of whole ms, its "YYYY-MM-DDT" part cached per day (years 1970..9999). */
function isoMs(ms: number): string {
  const day = Math.floor(ms / DAY_MS);
  if (!(day >= 0 && day < 2_932_897)) return new Date(ms).toISOString(); // outside 1970..9999
  if (day !== cachedDay) {
    cachedDay = day;
    cachedDayText = new Date(day * DAY_MS).toISOString().slice(0, 11);
  }
  clockOfDay(ms - day * DAY_MS, clock);
  const milli = clock.milli;
  return `${cachedDayText}${two(clock.h)}:${two(clock.m)}:${two(clock.s)}.${milli < 10 ? '00' : milli < 100 ? '0' : ''}${milli}Z`;
}

/** ISO 8601 UTC with `decimals` fractional-second digits (0..3). */
export function isoUtc(tMs: number, decimals = 1): string {
  const scale = 10 ** (3 - decimals);
  const rounded = Math.round(tMs / scale) * scale;
  const s = isoMs(rounded); // 2026-03-05T04:12:33.400Z
  if (decimals === 3) return s;
  return decimals === 0 ? `${s.slice(0, 19)}Z` : `${s.slice(0, 20 + decimals)}Z`;
}

/** ISO 8601 in an IANA zone with its offset, to the second. */
export function isoInZone(tMs: number, zone: string): string {
  return DateTime.fromMillis(Math.round(tMs), { zone }).toISO({ suppressMilliseconds: true }) ?? isoUtc(tMs, 0);
}

/** "1h 02m 03s" style, for tables. */
export function formatDuration(seconds: number): string {
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const r = s % 60;
  if (h > 0) return `${h}h${String(m).padStart(2, '0')}m${String(r).padStart(2, '0')}s`;
  return `${m}m${String(r).padStart(2, '0')}s`;
}
