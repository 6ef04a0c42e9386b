/**
 * Renders a plan: the terminal table per station, and the JSON, JSON Lines and CSV forms
 * written under out/, each in pieces (report/write.ts writes them as they are made).
 * Rounding is fixed (times to 0.1 s, angles to 0.01 deg, margins to 0.01 dB,
 * volumes to the bit) so the same inputs give byte-identical files.
 */
import type { PlanResult, Contact } from '../plan/types.js';
import { isoUtc, isoInZone, formatDuration } from '../time/format.js';
import { renderTable, fixed, formatBits, type Column } from './table.js';
import { uniqueVolumes } from '../plan/unique-volume.js';
import { jsonLinesPieces, jsonPieces, LazyList } from './json-stream.js';

const round = (v: number, d: number) => (Number.isFinite(v) ? Number(v.toFixed(d)) : null);

function timeText(tMs: number, zone: string | undefined): string {
  return zone ? isoInZone(tMs, zone) : isoUtc(tMs, 1);
}

/** The terminal table in pieces, one station's table at a time (each piece ends its line). */
export function* planTablePieces(plan: PlanResult, zone?: string): Generator<string> {
  const hasLink = plan.contacts.some((c) => c.link !== undefined);
  const hasExpected = plan.contacts.some((c) => c.link?.expectedVolumeBits !== undefined);
  yield* lines(
    `Contact plan ${isoUtc(plan.span.startMs, 0)} .. ${isoUtc(plan.span.endMs, 0)}` +
      (hasLink ? `, link at ${plan.availabilityPercent} % availability, sampled every ${plan.linkStepS} s` : ''),
  );
  for (const st of plan.stations) {
    const rows = plan.contacts.filter((c) => c.stationId === st.id);
    yield* lines('');
    yield* lines(`${st.id}  ${st.name}  (${st.timeZone})`);
    if (rows.length === 0) {
      yield* lines('  no contacts in the window');
      continue;
    }
    const cols: Column[] = [
      { header: 'spacecraft' },
      { header: zone ? `AOS (${zone})` : 'AOS (UTC)' },
      { header: 'TCA' },
      { header: 'LOS' },
      { header: 'duration', align: 'right' },
      { header: 'max el deg', align: 'right' },
      { header: 'az AOS', align: 'right' },
      { header: 'az LOS', align: 'right' },
    ];
    if (hasLink) cols.push({ header: 'volume', align: 'right' });
    if (hasExpected) cols.push({ header: 'expected', align: 'right' });
    if (hasLink) cols.push({ header: 'worst margin dB', align: 'right' });
    const body = rows.map((c) => {
      const r = [
        c.spacecraftId,
        timeText(c.aosMs, zone) + (c.aosClipped ? '<' : ''),
        timeText(c.tcaMs, zone),
        timeText(c.losMs, zone) + (c.losClipped ? '>' : ''),
        formatDuration(c.durationS),
        fixed(c.maxElevationDeg, 1),
        fixed(c.aosAzimuthDeg, 0),
        fixed(c.losAzimuthDeg, 0),
      ];
      if (hasLink) r.push(c.link ? formatBits(c.link.volumeBits) : '-');
      if (hasExpected) r.push(c.link?.expectedVolumeBits !== undefined ? formatBits(c.link.expectedVolumeBits) : '-');
      if (hasLink) r.push(c.link ? fixed(c.link.worstMarginDb, 1) : '-');
      return r;
    });
    yield* lines(indent(renderTable(cols, body)));
    yield* lines(`  ${summaryLine(rows, hasLink, hasExpected)}`);
  }
  const clipped = plan.contacts.some((c) => c.aosClipped || c.losClipped);
  yield* lines('');
  yield* lines(`All stations (station sum): ${summaryLine(plan.contacts, hasLink, hasExpected)}`);
  const once = uniqueVolumes(
    plan.spacecraft.map((s) => s.id),
    plan.contacts,
  );
  yield* lines(
    `Counted once per spacecraft radio (best station at each instant, union of windows): contact time ${formatDuration(once.reduce((s, u) => s + u.contactTimeS, 0))}` +
      (hasLink ? `, volume ${formatBits(once.reduce((s, u) => s + u.volumeBits, 0))}` : '') +
      (hasExpected ? `, expected ${formatBits(once.reduce((s, u) => s + u.expectedVolumeBits, 0))}` : ''),
  );
  if (hasExpected) {
    yield* lines(
      `"volume": at ${plan.availabilityPercent} % availability (the atmosphere exceeded ${Number((100 - plan.availabilityPercent).toPrecision(12))} % of an average year); ` +
        '"expected": the mean over an average year\'s attenuation statistics (README, "Expected volume").',
    );
  }
  if (clipped) yield* lines('"<" / ">": window cut by the start / end of the span.');
}

const lines = (...text: string[]): string[] => text.map((l) => `${l}\n`);

function summaryLine(rows: Contact[], hasLink: boolean, hasExpected: boolean): string {
  const totalS = rows.reduce((s, c) => s + c.durationS, 0);
  let line = `${rows.length} window${rows.length === 1 ? '' : 's'}, contact time ${formatDuration(totalS)}`;
  if (hasLink) line += `, volume ${formatBits(rows.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0))}`;
  if (hasExpected) line += `, expected ${formatBits(rows.reduce((s, c) => s + (c.link?.expectedVolumeBits ?? c.link?.volumeBits ?? 0), 0))}`;
  return line;
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((l) => `  ${l}`)
    .join('\n');
}

type Cell = string | number | boolean | null;

/**
 * One column of the contact outputs (contacts.csv, plan.json, contacts.jsonl): its key
 * and its value with fixed rounding; a column a contact lacks (a link's, without a link) is
 * left out of its record.
 * This list is the one place that says which columns there are and in which order.
 */
export interface ContactColumn {
  key: string;
  /** Whether the contact has this column (every contact, one with a link, ...). */
  present: (c: Contact) => boolean;
  value: (c: Contact) => Cell;
}

type Link = NonNullable<Contact['link']>;
const always = (): boolean => true;
const base = (key: string, value: (c: Contact) => Cell): ContactColumn => ({ key, present: always, value });
const linked = (key: string, value: (l: Link) => Cell, when: (l: Link) => boolean = always): ContactColumn => ({
  key,
  present: (c) => c.link !== undefined && when(c.link),
  value: (c) => value(c.link!),
});

export const CONTACT_COLUMNS: readonly ContactColumn[] = [
  base('station', (c) => c.stationId),
  base('spacecraft', (c) => c.spacecraftId),
  base('aos_utc', (c) => isoUtc(c.aosMs, 3)),
  base('tca_utc', (c) => isoUtc(c.tcaMs, 3)),
  base('los_utc', (c) => isoUtc(c.losMs, 3)),
  base('duration_s', (c) => round(c.durationS, 1)),
  base('max_elevation_deg', (c) => round(c.maxElevationDeg, 2)),
  base('aos_azimuth_deg', (c) => round(c.aosAzimuthDeg, 2)),
  base('los_azimuth_deg', (c) => round(c.losAzimuthDeg, 2)),
  base('aos_clipped', (c) => c.aosClipped),
  base('los_clipped', (c) => c.losClipped),
  linked('radio', (l) => l.radioId),
  linked('volume_bits', (l) => Math.round(l.volumeBits)),
  linked(
    'expected_volume_bits',
    (l) => l.expectedVolumeBits ?? null,
    (l) => l.expectedVolumeBits !== undefined,
  ),
  linked('closed_s', (l) => round(l.closedS, 1)),
  linked('worst_margin_db', (l) => round(l.worstMarginDb, 2)),
  linked('worst_margin_utc', (l) => isoUtc(l.worstMarginAtMs, 3)),
  linked('worst_margin_elevation_deg', (l) => round(l.worstMarginElevationDeg, 2)),
  linked('peak_rate_bps', (l) => Math.round(l.peakRateBps)),
];

/** One contact as a plain record with fixed rounding (JSON and CSV share it). */
export function contactRecord(c: Contact): Record<string, Cell> {
  const rec: Record<string, Cell> = {};
  for (const col of CONTACT_COLUMNS) if (col.present(c)) rec[col.key] = col.value(c);
  return rec;
}

/** One contact as plan.json and contacts.jsonl hold it: its record, time per MODCOD and other radios. */
export function contactJson(c: Contact): Record<string, unknown> {
  return {
    ...contactRecord(c),
    ...(c.link?.expectedVolumeBoundBits !== undefined ? { expected_volume_bound_bits: Math.ceil(c.link.expectedVolumeBoundBits) } : {}),
    ...(c.link ? { time_in_modcod_s: roundRecord(c.link.timeInModcodS, 1) } : {}),
    ...(c.otherLinks
      ? {
          other_radios: c.otherLinks.map((l) => ({
            radio: l.radioId,
            volume_bits: l.volumeBits,
            ...(l.expectedVolumeBits !== undefined ? { expected_volume_bits: l.expectedVolumeBits } : {}),
            worst_margin_db: round(l.worstMarginDb, 2),
            peak_rate_bps: Math.round(l.peakRateBps),
          })),
        }
      : {}),
  };
}

/** The contacts of the plan, made one at a time while written. */
export const contactList = (plan: PlanResult): LazyList<Record<string, unknown>> => new LazyList(plan.contacts.length, (i) => contactJson(plan.contacts[i]!));

/** plan.json in pieces (report/json-stream.ts): the same bytes as one JSON.stringify of it. */
export function planJsonPieces(plan: PlanResult, extra: Record<string, unknown> = {}): Iterable<string> {
  const doc = {
    span: { from_utc: isoUtc(plan.span.startMs, 3), to_utc: isoUtc(plan.span.endMs, 3) },
    availability_percent: plan.availabilityPercent,
    link_step_s: plan.linkStepS,
    spacecraft: plan.spacecraft,
    stations: plan.stations,
    contacts: contactList(plan),
    ...extra,
    warnings: plan.warnings,
  };
  return jsonPieces(doc);
}

/** contacts.jsonl: one contact per line, the same record as in plan.json. */
export function contactsJsonLinesPieces(plan: PlanResult): Iterable<string> {
  return jsonLinesPieces(contactList(plan));
}

function roundRecord(r: Record<string, number>, d: number): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const k of Object.keys(r).sort()) out[k] = round(r[k] ?? 0, d);
  return out;
}

/** A CSV field (RFC 4180): quoted when it holds a comma, a quote or a line break. */
function csvField(v: Cell | undefined): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (typeof v === 'number') return String(v);
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

const EMPTY_CSV = 'station,spacecraft,aos_utc,tca_utc,los_utc,duration_s,max_elevation_deg\n';

/**
 * The CSV columns: every column some contact has, in first-seen order (the first contact's
 * columns, then any column a later contact adds, at the end), found over the few distinct
 * sets of columns the contacts have.
 */
function csvColumns(contacts: readonly Contact[]): ContactColumn[] {
  const seenSets = new Set<bigint>();
  const columns: ContactColumn[] = [];
  for (const c of contacts) {
    let set = 0n;
    for (let j = 0; j < CONTACT_COLUMNS.length; j++) if (CONTACT_COLUMNS[j]!.present(c)) set |= 1n << BigInt(j);
    if (seenSets.has(set)) continue;
    seenSets.add(set);
    CONTACT_COLUMNS.forEach((col, j) => {
      if (set & (1n << BigInt(j)) && !columns.includes(col)) columns.push(col);
    });
  }
  return columns;
}

/** contacts.csv in pieces, row by row. */
export function* planCsvPieces(plan: PlanResult): Generator<string> {
  if (plan.contacts.length === 0) {
    yield EMPTY_CSV;
    return;
  }
  const columns = csvColumns(plan.contacts);
  yield `${columns.map((col) => col.key).join(',')}\n`;
  for (const c of plan.contacts) {
    let row = '';
    for (let j = 0; j < columns.length; j++) {
      const col = columns[j]!;
      if (j > 0) row += ',';
      if (col.present(c)) row += csvField(col.value(c));
    }
    yield `${row}\n`;
  }
}
