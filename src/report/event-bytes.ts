/**
 * One contact's iCalendar VEVENT (report/calendar.ts eventText) written as UTF-8 straight
 * into a byte buffer (report/byte-writer.ts), for the plan workers (report/batch-text.ts).
 * The same bytes as eventText: the same lines with the same numbers, each content line
 * folded in place after it is written (ByteWriter.fold, RFC 5545 §3.1). TEXT escaping
 * (§3.3.11) is applied piece by piece: the ids and names on their own (escaped and encoded
 * once each), the fixed words already escaped. That is escapeText of the whole text because
 * no piece of ours ends in CR or starts with LF (the one escape spanning two characters,
 * CRLF, cannot form across a boundary), and none holds a character to escape that is not
 * written escaped here. Checked against eventText in test/report/contact-text.test.ts.
 */
import type { Contact, PlanResult } from '../plan/types.js';
import { escapeText, eventContext } from './calendar.js';
import type { ByteWriter } from './byte-writer.js';

const enc = (s: string): Uint8Array => Buffer.from(s, 'utf8');

const BEGIN_UID = enc('BEGIN:VEVENT\r\nUID:');
const CRLF = enc('\r\n');
const DTSTART = enc('DTSTART:');
const DTEND = enc('\r\nDTEND:');
const SUMMARY = enc('\r\nSUMMARY:');
const OVER = enc(' over ');
const OPEN = enc(' (');
const CLOSE = enc(')');
const LOCATION = enc('LOCATION:');
const DESCRIPTION = enc('DESCRIPTION:');
const CLOSE_DOT = enc(').');
const AOS = enc('\\nAOS ');
const AOS_CUT = enc(' (window cut by the start of the span)');
const LOS = enc('\\nLOS ');
const LOS_CUT = enc(' (window cut by the end of the span)');
const DURATION = enc('\\nDuration ');
const MAX_ELEVATION = enc('\\nMax elevation ');
const DEG_AT = enc(' deg at ');
const AZIMUTH = enc('\\nAzimuth ');
const DEG_AT_AOS = enc(' deg at AOS\\, ');
const DEG_AT_LOS = enc(' deg at LOS');
const VOLUME = enc('\\nVolume ');
const BIT_ON = enc(' bit) on ');
const AVAILABILITY = enc(" at the link's availability");
const EXPECTED_SEP = enc('\\; ');
const EXPECTED = enc(' expected over an average year');
const WORST = enc('\\nWorst margin ');
const DB_AT = enc(' dB at ');
const DEG_ELEVATION = enc(' deg elevation');
const END = enc('\r\nTRANSP:OPAQUE\r\nEND:VEVENT\r\n');

/** eventContext's names, and every id and name escaped (RFC 5545 TEXT) and encoded once. */
export interface EventBytesContext {
  scName: Map<string, string>;
  stName: Map<string, string>;
  dtstamp: Uint8Array;
  escaped: Map<string, Uint8Array>;
}

export function eventBytesContext(plan: PlanResult): EventBytesContext {
  const ctx = eventContext(plan);
  return { scName: ctx.scName, stName: ctx.stName, dtstamp: enc(`${ctx.dtstamp}`), escaped: new Map() };
}

function escapedOf(ctx: EventBytesContext, s: string): Uint8Array {
  let e = ctx.escaped.get(s);
  if (e === undefined) {
    e = enc(escapeText(s));
    ctx.escaped.set(s, e);
  }
  return e;
}

/** eventText(ctx, c, uid) written into `w`. */
export function writeEvent(w: ByteWriter, ctx: EventBytesContext, c: Contact, uid: string): void {
  const scName = escapedOf(ctx, ctx.scName.get(c.spacecraftId) ?? c.spacecraftId);
  const stName = escapedOf(ctx, ctx.stName.get(c.stationId) ?? c.stationId);
  const scId = escapedOf(ctx, c.spacecraftId);
  const stId = escapedOf(ctx, c.stationId);
  w.bytes(BEGIN_UID);
  let at = w.pos - 4;
  w.text(uid);
  w.fold(at);
  w.bytes(CRLF);
  at = w.pos;
  w.bytes(ctx.dtstamp);
  w.fold(at);
  w.bytes(CRLF);
  w.bytes(DTSTART);
  w.icalUtc(c.aosMs, false);
  w.bytes(DTEND);
  w.icalUtc(c.losMs, true);
  w.bytes(SUMMARY);
  at = w.pos - 8;
  w.bytes(scId);
  w.bytes(OVER);
  w.bytes(stId);
  if (c.link) {
    w.bytes(OPEN);
    w.bits(c.link.volumeBits);
    w.bytes(CLOSE);
  }
  w.fold(at);
  w.bytes(CRLF);
  at = w.pos;
  w.bytes(LOCATION);
  w.bytes(stName);
  w.bytes(OPEN);
  w.bytes(stId);
  w.bytes(CLOSE);
  w.fold(at);
  w.bytes(CRLF);
  at = w.pos;
  w.bytes(DESCRIPTION);
  w.bytes(scName);
  w.bytes(OVER);
  w.bytes(stName);
  w.bytes(OPEN);
  w.bytes(stId);
  w.bytes(CLOSE_DOT);
  w.bytes(AOS);
  w.iso(c.aosMs, 1);
  if (c.aosClipped) w.bytes(AOS_CUT);
  w.bytes(LOS);
  w.iso(c.losMs, 1);
  if (c.losClipped) w.bytes(LOS_CUT);
  w.bytes(DURATION);
  w.duration(c.durationS);
  w.bytes(MAX_ELEVATION);
  w.fixed(c.maxElevationDeg, 1);
  w.bytes(DEG_AT);
  w.iso(c.tcaMs, 0);
  w.bytes(AZIMUTH);
  w.fixed(c.aosAzimuthDeg, 0);
  w.bytes(DEG_AT_AOS);
  w.fixed(c.losAzimuthDeg, 0);
  w.bytes(DEG_AT_LOS);
  const link = c.link;
  if (link) {
    w.bytes(VOLUME);
    w.bits(link.volumeBits);
    w.bytes(OPEN);
    w.number(link.volumeBits);
    w.bytes(BIT_ON);
    w.bytes(escapedOf(ctx, link.radioId));
    w.bytes(AVAILABILITY);
    if (link.expectedVolumeBits !== undefined) {
      w.bytes(EXPECTED_SEP);
      w.bits(link.expectedVolumeBits);
      w.bytes(EXPECTED);
    }
    w.bytes(WORST);
    w.fixed(link.worstMarginDb, 1);
    w.bytes(DB_AT);
    w.fixed(link.worstMarginElevationDeg, 1);
    w.bytes(DEG_ELEVATION);
  }
  w.fold(at);
  w.bytes(END);
}
