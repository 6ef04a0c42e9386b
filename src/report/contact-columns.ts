/**
 * The one definition of a contact record's columns, in order (contacts.csv's header and
 * plan.json's key order), shared by the renderers of report/plan.ts and report/contact-text.ts.
 */
import type { Contact } from '../plan/types.js';
import { isoUtc } from '../time/format.js';

const round = (v: number, d: number) => (Number.isFinite(v) ? Number(v.toFixed(d)) : null);

export type Cell = string | number | boolean | null;

/** Seconds per MODCOD (or code), largest first, as "name=seconds;..." for one CSV cell. */
export function modcodCell(timeInModcodS: Record<string, number>): string {
  return Object.entries(timeInModcodS)
    .filter(([, t]) => t > 0)
    .sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))
    .map(([name, t]) => `${name}=${t.toFixed(1)}`)
    .join(';');
}

/** Light-time targets (ephemeris, lunar site and orbiter) carry the one-way light time and transmit times. */
export const hasLightTime = (c: Contact): boolean => c.lightTimeS !== undefined && Number.isFinite(c.lightTimeS);

export interface ContactColumn {
  key: string;
  /** Needs the contact's link. */
  link?: true;
  /** Present only when this holds (JSON: the key left out; CSV: the column when any contact has it). */
  when?: (c: Contact) => boolean;
  /** In plan.json only. */
  jsonOnly?: true;
  value: (c: Contact) => Cell;
  /** A number rounded to this many decimals: `value` is round(num(c), digits) (report/contact-text.ts formats it once). */
  digits?: number;
  num?: (c: Contact) => number;
  /** `value` is an ISO time (no character JSON or CSV would escape): isoUtc(ms(c), 3). */
  iso?: true;
  ms?: (c: Contact) => number;
}

/** A column of a number rounded to `digits` decimals (null when not finite). */
function rounded(key: string, digits: number, num: (c: Contact) => number, more: Partial<ContactColumn> = {}): ContactColumn {
  return { key, ...more, digits, num, value: (c) => round(num(c), digits) };
}

/** A column of an ISO 8601 UTC time to the millisecond. */
function isoColumn(key: string, ms: (c: Contact) => number, more: Partial<ContactColumn> = {}): ContactColumn {
  return { key, ...more, iso: true, ms, value: (c) => isoUtc(ms(c), 3) };
}

/**
 * The one definition of a contact record's columns, in order (contacts.csv's header and
 * plan.json's key order): who, then what the link gives (data start and end, volume,
 * closure margin, time per MODCOD), then the geometry as a trailing group. Link columns are
 * empty (CSV) or absent (JSON) for a contact without a link.
 */
export const CONTACT_COLUMNS: readonly ContactColumn[] = [
  { key: 'station', value: (c) => c.stationId },
  { key: 'spacecraft', value: (c) => c.spacecraftId },
  { key: 'radio', link: true, value: (c) => c.link!.radioId },
  isoColumn('data_start_utc', (c) => c.link!.dataStartMs, { link: true }),
  isoColumn('data_end_utc', (c) => c.link!.dataEndMs, { link: true }),
  { key: 'volume_bits', link: true, value: (c) => Math.round(c.link!.volumeBits) },
  { key: 'expected_volume_bits', link: true, when: (c) => c.link?.expectedVolumeBits !== undefined, value: (c) => c.link!.expectedVolumeBits! },
  {
    key: 'expected_volume_bound_bits',
    link: true,
    jsonOnly: true,
    when: (c) => c.link?.expectedVolumeBoundBits !== undefined,
    value: (c) => Math.ceil(c.link!.expectedVolumeBoundBits!),
  },
  rounded('closure_margin_db', 2, (c) => c.link!.worstMarginDb, { link: true }),
  { key: 'time_in_modcod_s', link: true, value: (c) => modcodCell(c.link!.timeInModcodS) },
  rounded('closed_s', 1, (c) => c.link!.closedS, { link: true }),
  { key: 'peak_rate_bps', link: true, value: (c) => Math.round(c.link!.peakRateBps) },
  isoColumn('closure_margin_at_utc', (c) => c.link!.worstMarginAtMs, { link: true }),
  rounded('closure_margin_at_elevation_deg', 2, (c) => c.link!.worstMarginElevationDeg, { link: true }),
  isoColumn('aos_utc', (c) => c.aosMs),
  isoColumn('tca_utc', (c) => c.tcaMs),
  isoColumn('los_utc', (c) => c.losMs),
  rounded('duration_s', 1, (c) => c.durationS),
  rounded('max_elevation_deg', 2, (c) => c.maxElevationDeg),
  rounded('aos_azimuth_deg', 2, (c) => c.aosAzimuthDeg),
  rounded('los_azimuth_deg', 2, (c) => c.losAzimuthDeg),
  { key: 'aos_clipped', value: (c) => c.aosClipped },
  { key: 'los_clipped', value: (c) => c.losClipped },
  rounded('light_time_s', 6, (c) => c.lightTimeS!, { when: hasLightTime }),
  isoColumn('aos_transmit_utc', (c) => c.aosTransmitMs ?? Number.NaN, { when: hasLightTime }),
  isoColumn('los_transmit_utc', (c) => c.losTransmitMs ?? Number.NaN, { when: hasLightTime }),
];

/** One contact as a plain record in CONTACT_COLUMNS order, fixed rounding (JSON and CSV share it). */
export function contactRecord(c: Contact, forJson = false): Record<string, Cell> {
  const rec: Record<string, Cell> = {};
  for (const col of CONTACT_COLUMNS) {
    if ((col.link && !c.link) || (col.when && !col.when(c)) || (col.jsonOnly && !forJson)) continue;
    rec[col.key] = col.value(c);
  }
  return rec;
}

