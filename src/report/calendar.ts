/**
 * Contact windows as an iCalendar file (IETF RFC 5545, "Internet Calendaring
 * and Scheduling Core Object Specification", September 2009), written here
 * rather than through a library so that every byte is ours to fix: no clock
 * in DTSTAMP, stable UIDs, the same inputs give byte-identical files.
 *
 * What the writer follows:
 * - §3.1 content lines end in CRLF and are folded to at most 75 octets (a
 *   continuation line starts with one space); folding never splits a UTF-8
 *   character.
 * - §3.3.11 TEXT values escape backslash, semicolon, comma and newline.
 * - §3.3.5 DATE-TIME in UTC form (19980119T070000Z). It has no fractional
 *   seconds: DTSTART is AOS rounded down and DTEND is LOS rounded up to the
 *   second, so the event always covers the window.
 * - §3.6.1 each VEVENT carries UID and DTSTAMP. DTSTAMP is the start of the
 *   planned span (not the clock). UID = station, spacecraft and AOS second
 *   ("FRV-KESTREL-1-20260305T074331Z@passbudget"), with "-2", "-3" added in
 *   the rare case of two windows of a pair starting in the same second.
 * - §3.7 the calendar carries PRODID and VERSION:2.0; NAME (RFC 7986 §5.1)
 *   and X-WR-CALNAME name it for calendar programs.
 */
import type { Contact, PlanResult } from '../plan/types.js';
import { isoUtc, formatDuration } from '../time/format.js';
import { formatBits } from './table.js';
import { contactTextsOf, FORM, storedText } from './contact-store.js';

const CRLF = '\r\n';
const MAX_LINE_OCTETS = 75;
export const PRODID = '-//passbudget//contact plan//EN';

const NEEDS_ESCAPE = /[\\;,\r\n]/;

/** RFC 5545 §3.3.11 TEXT escaping. */
export function escapeText(text: string): string {
  if (!NEEDS_ESCAPE.test(text)) return text;
  return text.replace(/\\/g, '\\\\').replace(/;/g, '\\;').replace(/,/g, '\\,').replace(/\r\n|\r|\n/g, '\\n');
}

function utf8Octets(codePoint: number): number {
  if (codePoint < 0x80) return 1;
  if (codePoint < 0x800) return 2;
  if (codePoint < 0x10000) return 3;
  return 4;
}

const ASCII = /^[\x00-\x7f]*$/;

/** RFC 5545 §3.1 folding: lines of at most 75 octets, continuations start with a space. */
export function foldLine(line: string): string {
  if (line.length <= MAX_LINE_OCTETS && ASCII.test(line)) return line; // one octet per character
  if (ASCII.test(line)) {
    const pieces = [line.slice(0, MAX_LINE_OCTETS)];
    for (let at = MAX_LINE_OCTETS; at < line.length; at += MAX_LINE_OCTETS - 1) pieces.push(line.slice(at, at + MAX_LINE_OCTETS - 1));
    return pieces.join(`${CRLF} `);
  }
  const pieces: string[] = [];
  let current = '';
  let octets = 0;
  let limit = MAX_LINE_OCTETS;
  for (const ch of line) {
    const n = utf8Octets(ch.codePointAt(0) ?? 0);
    if (octets + n > limit) {
      pieces.push(current);
      current = '';
      octets = 0;
      limit = MAX_LINE_OCTETS - 1; // the leading space counts
    }
    current += ch;
    octets += n;
  }
  pieces.push(current);
  return pieces.join(`${CRLF} `);
}

/** RFC 5545 §3.3.5 UTC DATE-TIME, whole seconds (`round`: how to drop the fraction). */
export function icalUtc(tMs: number, round: 'floor' | 'ceil'): string {
  const s = round === 'floor' ? Math.floor(tMs / 1000) : Math.ceil(tMs / 1000);
  const t = isoUtc(s * 1000, 0); // 2026-03-05T07:43:31Z
  return `${t.slice(0, 4)}${t.slice(5, 7)}${t.slice(8, 13)}${t.slice(14, 16)}${t.slice(17, 19)}Z`;
}

const UID_OTHER = /[^A-Za-z0-9._-]/g;
/** An id as a UID part (every other UTF-16 unit an underscore), memoised: ids repeat in every contact. */
const uidParts = new Map<string, string>();
function uidPart(s: string): string {
  let p = uidParts.get(s);
  if (p === undefined) {
    p = s.replace(UID_OTHER, '_');
    if (uidParts.size < 100_000) uidParts.set(s, p);
  }
  return p;
}

/** Stable UIDs of the plan's contacts, in plan order (index i: plan.contacts[i]). */
export function contactUids(plan: PlanResult): string[] {
  const uids: string[] = [];
  const used = new Set<string>();
  for (const c of plan.contacts) {
    const base = `${uidPart(c.stationId)}-${uidPart(c.spacecraftId)}-${icalUtc(c.aosMs, 'floor')}`;
    let uid = `${base}@passbudget`;
    for (let k = 2; used.has(uid); k++) uid = `${base}-${k}@passbudget`;
    used.add(uid);
    uids.push(uid);
  }
  return uids;
}

/** Names by id and the DTSTAMP line, looked up once per calendar. */
export interface EventContext {
  scName: Map<string, string>;
  stName: Map<string, string>;
  dtstamp: string;
}

export function eventContext(plan: PlanResult): EventContext {
  return {
    scName: new Map(plan.spacecraft.map((s) => [s.id, s.name])),
    stName: new Map(plan.stations.map((s) => [s.id, s.name])),
    dtstamp: `DTSTAMP:${icalUtc(plan.span.startMs, 'floor')}`,
  };
}

export function eventText(ctx: EventContext, c: Contact, uid: string): string {
  const scName = ctx.scName.get(c.spacecraftId) ?? c.spacecraftId;
  const stName = ctx.stName.get(c.stationId) ?? c.stationId;
  const desc = [
    `${scName} over ${stName} (${c.stationId}).`,
    `AOS ${isoUtc(c.aosMs, 1)}${c.aosClipped ? ' (window cut by the start of the span)' : ''}`,
    `LOS ${isoUtc(c.losMs, 1)}${c.losClipped ? ' (window cut by the end of the span)' : ''}`,
    `Duration ${formatDuration(c.durationS)}`,
    `Max elevation ${c.maxElevationDeg.toFixed(1)} deg at ${isoUtc(c.tcaMs, 0)}`,
    `Azimuth ${c.aosAzimuthDeg.toFixed(0)} deg at AOS, ${c.losAzimuthDeg.toFixed(0)} deg at LOS`,
  ];
  if (c.link) {
    desc.push(
      `Volume ${formatBits(c.link.volumeBits)} (${c.link.volumeBits} bit) on ${c.link.radioId} at the link's availability` +
        (c.link.expectedVolumeBits !== undefined ? `; ${formatBits(c.link.expectedVolumeBits)} expected over an average year` : ''),
      `Worst margin ${c.link.worstMarginDb.toFixed(1)} dB at ${c.link.worstMarginElevationDeg.toFixed(1)} deg elevation`,
    );
  }
  const lines = [
    'BEGIN:VEVENT',
    `UID:${uid}`,
    ctx.dtstamp,
    `DTSTART:${icalUtc(c.aosMs, 'floor')}`,
    `DTEND:${icalUtc(c.losMs, 'ceil')}`,
    `SUMMARY:${escapeText(`${c.spacecraftId} over ${c.stationId}${c.link ? ` (${formatBits(c.link.volumeBits)})` : ''}`)}`,
    `LOCATION:${escapeText(`${stName} (${c.stationId})`)}`,
    `DESCRIPTION:${escapeText(desc.join('\n'))}`,
    'TRANSP:OPAQUE',
    'END:VEVENT',
  ];
  let text = '';
  for (const l of lines) text += foldLine(l) + CRLF;
  return text;
}

/**
 * One calendar in pieces (one per event) of the plan's contacts at `indices` (into
 * plan.contacts), taken in the order given: by AOS, then plan order. An event a plan
 * worker rendered (report/batch-text.ts) is copied as it is.
 */
function* calendarPieces(plan: PlanResult, indices: Iterable<number>, name: string, uids: () => readonly string[]): Generator<string | Uint8Array> {
  const head = ['BEGIN:VCALENDAR', 'VERSION:2.0', `PRODID:${PRODID}`, 'CALSCALE:GREGORIAN', 'METHOD:PUBLISH', `NAME:${escapeText(name)}`, `X-WR-CALNAME:${escapeText(name)}`];
  yield head.map(foldLine).join(CRLF) + CRLF;
  const ctx = eventContext(plan);
  const store = contactTextsOf(plan);
  for (const i of indices) yield (store ? storedText(store, FORM.ics, i) : undefined) ?? eventText(ctx, plan.contacts[i]!, uids()[i]!);
  yield 'END:VCALENDAR' + CRLF;
}

/** contactUids made once, when first asked for. */
function lazyUids(plan: PlanResult, made?: readonly string[]): () => readonly string[] {
  let uids = made;
  return () => (uids ??= contactUids(plan));
}

/** Every contact's AOS, read once (a contact's fields may be read through a packed row). */
function aosOf(plan: PlanResult): Float64Array {
  const aos = new Float64Array(plan.contacts.length);
  for (let i = 0; i < aos.length; i++) aos[i] = plan.contacts[i]!.aosMs;
  return aos;
}

/**
 * Indices of the plan's contacts ordered by AOS, then plan order. A list already in that
 * order (a station's contacts in plan order) is left as it is: what sort does with it too
 * (one ascending run), without its comparisons.
 */
function byAos(aos: Float64Array, indices: number[]): number[] {
  const cmp = (a: number, b: number): number => aos[a]! - aos[b]! || a - b;
  for (let k = 1; k < indices.length; k++) if (cmp(indices[k - 1]!, indices[k]!) > 0) return indices.sort(cmp);
  return indices;
}

/** One calendar of the given contacts (ordered by AOS, then station, then spacecraft as in the plan). */
export function renderCalendar(plan: PlanResult, contacts: readonly Contact[], name: string, uids = contactUids(plan)): string {
  const index = new Map(plan.contacts.map((c, i) => [c, i]));
  const indices = contacts.map((c) => {
    const i = index.get(c);
    if (i === undefined) throw new Error('renderCalendar: contact is not part of the plan');
    return i;
  });
  return joinPieces(calendarPieces(plan, byAos(aosOf(plan), indices), name, lazyUids(plan, uids)));
}

/** File-name-safe form of a station id. */
export const stationFileName = (stationId: string) => `${uidPart(stationId)}.ics`;

/**
 * The network calendar and one per station, paths relative to the output folder, each
 * made in pieces while it is written.
 */
export function calendarFiles(plan: PlanResult): { name: string; content: Iterable<string | Uint8Array> }[] {
  const uids = lazyUids(plan);
  const span = `${isoUtc(plan.span.startMs, 0)} .. ${isoUtc(plan.span.endMs, 0)}`;
  const aos = aosOf(plan);
  const all = byAos(
    aos,
    plan.contacts.map((_, i) => i),
  );
  const files = [{ name: 'contacts.ics', content: calendarPieces(plan, all, `Contacts, all stations, ${span}`, uids) }];
  const perStation = new Map<string, number[]>(plan.stations.map((st) => [st.id, []]));
  plan.contacts.forEach((c, i) => perStation.get(c.stationId)?.push(i));
  for (const st of plan.stations) {
    const mine = byAos(aos, perStation.get(st.id) ?? []);
    files.push({ name: `calendar/${stationFileName(st.id)}`, content: calendarPieces(plan, mine, `Contacts at ${st.name} (${st.id}), ${span}`, uids) });
  }
  return files;
}

/** The calendars as whole strings (calendarFiles made in one piece each). */
export function renderCalendars(plan: PlanResult): { name: string; content: string }[] {
  return calendarFiles(plan).map((f) => ({ name: f.name, content: joinPieces(f.content) }));
}

/** Pieces of text or UTF-8 bytes as one string. */
function joinPieces(pieces: Iterable<string | Uint8Array>): string {
  let s = '';
  for (const p of pieces) s += typeof p === 'string' ? p : Buffer.from(p).toString('utf8');
  return s;
}
