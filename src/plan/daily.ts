/**
 * Daily totals per station, and totals per spacecraft over the span.
 *
 * Days: UTC calendar days, or each station's own local calendar days in its
 * IANA time zone (luxon, used once per day boundary, never per sample). Every
 * day that the span touches is listed, days without contacts too. A local day
 * at a daylight-saving change is 23 or 25 hours long and is flagged; a first
 * or last day only partly inside the span is flagged `partial`.
 *
 * Rules (each sums exactly over the days to the per-contact figures):
 * - volumeBits: the contact's 15-minute UTC volume bins (ContactLink.volumeBinsBits)
 *   whose bin start falls in [dayStartMs, dayEndMs). Every zone offset in use is a
 *   multiple of 15 min, so a day boundary is a bin edge and no bin is split; a
 *   zone whose day boundary is not a bin edge is refused (ModelRangeError).
 *   Whole bits, exact integer sums.
 * - contactCount: a contact counts on the day its AOS falls in (a window cut by
 *   the span start counts on the first day). Each contact is counted once.
 * - contactTimeS: the part of [AOS, LOS] inside [dayStartMs, dayEndMs): a contact
 *   across midnight is split at the day boundary.
 */
import { DateTime } from 'luxon';
import { ModelRangeError } from '../errors.js';
import type { Span } from '../scenario/types.js';
import { VOLUME_BIN_MS, type Contact, type ContactLink, type PlanResult } from './types.js';
import { uniqueBitsIn, uniqueVolumeOf, uniqueVolumes, type UniqueVolume } from './unique-volume.js';

export type DayMode = { kind: 'utc' } | { kind: 'local' };

export interface DailyRow {
  stationId: string;
  /** 'UTC' for UTC days, else the station's IANA zone. */
  timeZone: string;
  /** Calendar date of the day in its zone, YYYY-MM-DD. */
  day: string;
  dayStartMs: number;
  dayEndMs: number;
  /** Length of the day, h: 24, or 23 / 25 at a daylight-saving change. */
  dayHours: number;
  /** True when the day is not 24 h long (daylight-saving change). */
  dstChange: boolean;
  /** True when the span covers only part of the day (first or last day). */
  partial: boolean;
  volumeBits: number;
  /** Expected volume over an average year (ContactLink.expectedVolumeBits; the volume where absent). */
  expectedVolumeBits: number;
  contactCount: number;
  contactTimeS: number;
}

export interface SpacecraftTotal {
  spacecraftId: string;
  contactCount: number;
  /** Length of the union of the spacecraft's windows (time in contact with any station), s. */
  contactTimeS: number;
  /** Sum of contact durations over all stations (overlapping contacts at two stations both count), s. */
  stationSumContactTimeS: number;
  /** The radio's data counted once (unique-volume.ts: the best station at each instant). */
  volumeBits: number;
  /** Plain sum of the contacts' volumes over all stations (simultaneous reception counted at each). */
  stationSumVolumeBits: number;
  /** Expected volume over an average year, counted once (unique-volume.ts), and its station-sum. */
  expectedVolumeBits: number;
  stationSumExpectedVolumeBits: number;
  /** With a recorder simulated: what actually left the recorder (volumeBits is then link capacity). */
  deliveredBits?: number;
  /** The spacecraft's other radios (not the data downlink), each its own volume counted once. */
  otherRadios?: { radioId: string; volumeBits: number; stationSumVolumeBits: number }[];
}

/** One UTC day's total over all stations, the radio's data counted once. */
export interface AllStationsDay {
  day: string;
  dayStartMs: number;
  dayEndMs: number;
  contactCount: number;
  /** Unique volume of every spacecraft received that day (unique-volume.ts). */
  volumeBits: number;
  /** Sum of the stations' day volumes (simultaneous reception counted at each station). */
  stationSumVolumeBits: number;
  /** Expected volume counted once, and its station-sum. */
  expectedVolumeBits: number;
  stationSumExpectedVolumeBits: number;
}

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;

/** Day boundaries [start, end) of the days the span touches, in one zone. */
export function daysOfSpan(span: Span, zone: string): { day: string; startMs: number; endMs: number }[] {
  const days: { day: string; startMs: number; endMs: number }[] = [];
  if (zone === 'UTC') {
    for (let t = Math.floor(span.startMs / DAY_MS) * DAY_MS; t < span.endMs; t += DAY_MS) {
      days.push({ day: new Date(t).toISOString().slice(0, 10), startMs: t, endMs: t + DAY_MS });
    }
    return days;
  }
  let d = DateTime.fromMillis(span.startMs, { zone }).startOf('day');
  // zones were checked when the scenario was loaded: an invalid one here is a bug
  if (!d.isValid) throw new Error(`daily totals: "${zone}" is not an IANA time zone`);
  while (d.toMillis() < span.endMs) {
    const next = d.plus({ days: 1 }).startOf('day');
    days.push({ day: d.toISODate() ?? '', startMs: d.toMillis(), endMs: next.toMillis() });
    d = next;
  }
  return days;
}

/** Index of the day holding tMs (days sorted, contiguous), or -1. */
function dayIndex(days: readonly { startMs: number; endMs: number }[], tMs: number): number {
  let lo = 0;
  let hi = days.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const d = days[mid]!;
    if (tMs < d.startMs) hi = mid - 1;
    else if (tMs >= d.endMs) lo = mid + 1;
    else return mid;
  }
  return -1;
}

/**
 * Daily rows, ordered by station (plan order) then day. Throws when a
 * contact's volume bin falls outside every day (a bug: bins lie inside the span).
 */
export function dailyTotals(plan: PlanResult, mode: DayMode): DailyRow[] {
  const rows: DailyRow[] = [];
  const byStation = new Map<string, Contact[]>();
  for (const c of plan.contacts) {
    const list = byStation.get(c.stationId) ?? [];
    list.push(c);
    byStation.set(c.stationId, list);
  }
  for (const st of plan.stations) {
    const zone = mode.kind === 'utc' ? 'UTC' : st.timeZone;
    const days = daysOfSpan(plan.span, zone);
    for (const d of days) {
      const offBinMs = ((d.startMs % VOLUME_BIN_MS) + VOLUME_BIN_MS) % VOLUME_BIN_MS;
      if (offBinMs !== 0) {
        throw new ModelRangeError(
          'daily totals',
          `${st.id}: start of ${d.day} in ${zone}, minutes past a 15-minute UTC edge`,
          offBinMs / 60_000,
          '0: a zone whose UTC offset is a whole multiple of 15 min',
        );
      }
    }
    const stationRows: DailyRow[] = days.map((d) => {
      const dayHours = (d.endMs - d.startMs) / HOUR_MS;
      return {
        stationId: st.id,
        timeZone: zone,
        day: d.day,
        dayStartMs: d.startMs,
        dayEndMs: d.endMs,
        dayHours,
        dstChange: dayHours !== 24,
        partial: d.startMs < plan.span.startMs || d.endMs > plan.span.endMs,
        volumeBits: 0,
        expectedVolumeBits: 0,
        contactCount: 0,
        contactTimeS: 0,
      };
    });
    for (const c of byStation.get(st.id) ?? []) {
      const ia = dayIndex(days, c.aosMs);
      if (ia < 0) throw new Error(`daily totals: AOS of ${c.spacecraftId} over ${st.id} is outside the span's days`);
      stationRows[ia]!.contactCount++;
      for (let i = ia; i < days.length; i++) {
        const d = days[i]!;
        if (d.startMs > c.losMs) break;
        const overlapMs = Math.min(c.losMs, d.endMs) - Math.max(c.aosMs, d.startMs);
        if (overlapMs > 0) stationRows[i]!.contactTimeS += overlapMs / 1000;
      }
      const link = c.link;
      if (!link) continue;
      let hint = ia;
      link.volumeBinsBits.forEach((bits, k) => {
        if (bits === 0) return;
        const binMs = link.binStartMs + k * VOLUME_BIN_MS;
        const d = days[hint];
        if (!d || binMs < d.startMs || binMs >= d.endMs) hint = dayIndex(days, binMs);
        if (hint < 0) throw new Error(`daily totals: a volume bin of ${c.spacecraftId} over ${st.id} is outside the span's days`);
        stationRows[hint]!.volumeBits += bits;
      });
      hint = ia;
      (link.expectedVolumeBinsBits ?? link.volumeBinsBits).forEach((bits, k) => {
        if (bits === 0) return;
        const binMs = link.binStartMs + k * VOLUME_BIN_MS;
        const d = days[hint];
        if (!d || binMs < d.startMs || binMs >= d.endMs) hint = dayIndex(days, binMs);
        if (hint < 0) throw new Error(`daily totals: an expected-volume bin of ${c.spacecraftId} over ${st.id} is outside the span's days`);
        stationRows[hint]!.expectedVolumeBits += bits;
      });
    }
    rows.push(...stationRows);
  }
  return rows;
}

/**
 * Totals per spacecraft over the whole span, in plan order: volume and contact time
 * counted once (unique-volume.ts), the station-sums beside them. With `delivered`
 * (spacecraft id -> bits that left its recorder) deliveredBits is set.
 */
/**
 * The contact read with another radio's link in place of its data link: its own fields
 * through the prototype chain, so a read-only contact view (plan/contact-pack.ts) serves
 * as well as an object.
 */
function withDataLink(c: Contact, link: ContactLink): Contact {
  return Object.create(c, { link: { value: link, enumerable: true } }) as Contact;
}

export function spacecraftTotals(
  plan: PlanResult,
  delivered?: ReadonlyMap<string, number>,
  unique: readonly UniqueVolume[] = uniqueVolumes(
    plan.spacecraft.map((s) => s.id),
    plan.contacts,
  ),
): SpacecraftTotal[] {
  // each spacecraft's contacts, gathered in one pass (plan order kept)
  const bySc = new Map<string, Contact[]>();
  for (const c of plan.contacts) {
    const l = bySc.get(c.spacecraftId);
    if (l) l.push(c);
    else bySc.set(c.spacecraftId, [c]);
  }
  return unique.map((u) => {
    const own = bySc.get(u.spacecraftId) ?? [];
    const t: SpacecraftTotal = {
      spacecraftId: u.spacecraftId,
      contactCount: own.length,
      contactTimeS: u.contactTimeS,
      stationSumContactTimeS: u.stationSumContactTimeS,
      volumeBits: u.volumeBits,
      stationSumVolumeBits: u.stationSumBits,
      expectedVolumeBits: u.expectedVolumeBits,
      stationSumExpectedVolumeBits: u.stationSumExpectedBits,
    };
    const d = delivered?.get(u.spacecraftId);
    if (d !== undefined) t.deliveredBits = d;
    const mine = own.filter((c) => c.otherLinks);
    const radioIds = [...new Set(mine.flatMap((c) => c.otherLinks!.map((l) => l.radioId)))];
    if (radioIds.length > 0) {
      t.otherRadios = radioIds.map((radioId) => {
        const asData = mine.flatMap((c) => {
          const l = c.otherLinks!.find((x) => x.radioId === radioId);
          return l ? [withDataLink(c, l)] : [];
        });
        const v = uniqueVolumeOf(u.spacecraftId, asData);
        return { radioId, volumeBits: v.volumeBits, stationSumVolumeBits: v.stationSumBits };
      });
    }
    return t;
  });
}

/**
 * Per UTC day over all stations: the unique volume of every spacecraft (bins by their
 * start, as the station rows), the station-sum beside it, and the contacts by AOS day.
 */
export function allStationsDaily(
  plan: PlanResult,
  rows: readonly DailyRow[],
  unique: readonly UniqueVolume[] = uniqueVolumes(
    plan.spacecraft.map((s) => s.id),
    plan.contacts,
  ),
): AllStationsDay[] {
  return daysOfSpan(plan.span, 'UTC').map((d) => {
    let count = 0;
    let sum = 0;
    let expectedSum = 0;
    for (const r of rows) {
      if (r.timeZone !== 'UTC' || r.dayStartMs !== d.startMs) continue;
      count += r.contactCount;
      sum += r.volumeBits;
      expectedSum += r.expectedVolumeBits;
    }
    return {
      day: d.day,
      dayStartMs: d.startMs,
      dayEndMs: d.endMs,
      contactCount: count,
      volumeBits: uniqueBitsIn(unique, d.startMs, d.endMs),
      stationSumVolumeBits: sum,
      expectedVolumeBits: uniqueBitsIn(unique, d.startMs, d.endMs, true),
      stationSumExpectedVolumeBits: expectedSum,
    };
  });
}
