// iCalendar output (src/report/calendar.ts) read back with ical.js 2.2.1 (a
// general-purpose RFC 5545 parser from npm, not ours), checked against the
// plan it was made from, and checked line by line against IETF RFC 5545
// (September 2009):
// - §3.1: every content line ends in CRLF and is at most 75 octets; a folded
//   continuation starts with one space; folding must not split a UTF-8 character.
// - §3.3.11: TEXT escapes backslash, semicolon, comma and newline (round trip exact).
// - §3.3.5: UTC DATE-TIME "YYYYMMDDTHHMMSSZ", whole seconds: DTSTART is AOS
//   rounded down and DTEND LOS rounded up (our rule), so tolerance 1 s, one-sided.
// - §3.6.1 / §3.8.4.7 / §3.8.7.2: each VEVENT has a UID (unique) and a DTSTAMP.
import { describe, it, expect } from 'vitest';
import ICAL from 'ical.js';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { renderCalendars, renderCalendar, foldLine, escapeText } from '../../src/report/calendar.js';
import type { Contact, PlanResult } from '../../src/plan/types.js';

const scenario = loadScenario(demoFiles());
const start = scenario.span!.startMs;
const plan = runPlan(scenario, { startMs: start, endMs: start + 86_400_000 }, { linkStepS: 10 });
const files = renderCalendars(plan);
const network = files.find((f) => f.name === 'contacts.ics')!.content;

interface ParsedEvent {
  uid: string;
  startMs: number;
  endMs: number;
  summary: string;
  location: string;
  description: string;
  dtstampMs: number;
}

function parse(text: string): { name: string; events: ParsedEvent[] } {
  const cal = new ICAL.Component(ICAL.parse(text));
  const events = cal.getAllSubcomponents('vevent').map((v) => {
    const e = new ICAL.Event(v);
    const stamp = v.getFirstPropertyValue('dtstamp') as ICAL.Time;
    return {
      uid: e.uid,
      startMs: e.startDate.toJSDate().getTime(),
      endMs: e.endDate.toJSDate().getTime(),
      summary: e.summary,
      location: e.location,
      description: e.description,
      dtstampMs: stamp.toJSDate().getTime(),
    };
  });
  return { name: String(cal.getFirstPropertyValue('x-wr-calname')), events };
}

/** RFC 5545 §3.1 on raw text: CRLF only, <= 75 octets, no split UTF-8 character. */
function checkLines(text: string): void {
  expect(text.endsWith('\r\n')).toBe(true);
  expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  const bytes = Buffer.from(text, 'utf8');
  let lineStart = 0;
  for (let i = 0; i < bytes.length - 1; i++) {
    if (bytes[i] === 0x0d && bytes[i + 1] === 0x0a) {
      const line = bytes.subarray(lineStart, i);
      expect(line.length).toBeLessThanOrEqual(75);
      // a line cut inside a multi-byte character would not decode cleanly on its own
      expect(line.toString('utf8')).not.toContain('\uFFFD');
      lineStart = i + 2;
    }
  }
}

describe('calendar of the demo plan (first day)', () => {
  it('writes a network calendar and one per station', () => {
    expect(files.map((f) => f.name)).toEqual(['contacts.ics', ...plan.stations.map((s) => `calendar/${s.id}.ics`)]);
    for (const f of files) checkLines(f.content);
  });

  it('reads back as the same windows (one event per contact)', () => {
    const { events } = parse(network);
    expect(plan.contacts.length).toBeGreaterThan(50);
    expect(events.length).toBe(plan.contacts.length);
    expect(new Set(events.map((e) => e.uid)).size).toBe(events.length);
    const byKey = new Map(plan.contacts.map((c) => [`${c.stationId}|${c.spacecraftId}|${Math.floor(c.aosMs / 1000)}`, c]));
    for (const e of events) {
      const stationId = /\(([^)]+)\)$/.exec(e.location)?.[1] ?? '';
      const spacecraftId = e.summary.split(' over ')[0] ?? '';
      const c = byKey.get(`${stationId}|${spacecraftId}|${e.startMs / 1000}`);
      expect(c, `${e.summary} at ${new Date(e.startMs).toISOString()}`).toBeDefined();
      const contact = c as Contact;
      expect(e.startMs).toBeLessThanOrEqual(contact.aosMs);
      expect(contact.aosMs - e.startMs).toBeLessThan(1000);
      expect(e.endMs).toBeGreaterThanOrEqual(contact.losMs);
      expect(e.endMs - contact.losMs).toBeLessThan(1000);
      expect(e.summary).toContain(`${contact.spacecraftId} over ${contact.stationId}`);
      expect(e.location).toBe(`${plan.stations.find((s) => s.id === contact.stationId)!.name} (${contact.stationId})`);
      expect(e.description).toContain(`Max elevation ${contact.maxElevationDeg.toFixed(1)} deg`);
      expect(e.description).toContain(`(${contact.link!.volumeBits} bit)`);
      expect(e.dtstampMs).toBe(plan.span.startMs);
      expect(e.uid).toBe(`${contact.stationId}-${contact.spacecraftId}-${new Date(e.startMs).toISOString().replace(/[-:]|\.\d+/g, '')}@passbudget`);
    }
  });

  it('per-station calendars hold exactly that station\'s contacts, with the network UIDs', () => {
    const networkUids = new Set(parse(network).events.map((e) => e.uid));
    let total = 0;
    for (const st of plan.stations) {
      const { events } = parse(files.find((f) => f.name === `calendar/${st.id}.ics`)!.content);
      expect(events.length).toBe(plan.contacts.filter((c) => c.stationId === st.id).length);
      for (const e of events) {
        expect(e.location.endsWith(`(${st.id})`)).toBe(true);
        expect(networkUids.has(e.uid)).toBe(true);
      }
      total += events.length;
    }
    expect(total).toBe(plan.contacts.length);
  });
});

describe('RFC 5545 text rules on awkward names', () => {
  const awkward = 'Fjellstua; nord, øvre \\ "test"\nline two — ÆØÅ æøå 🛰 ' + 'ø'.repeat(80);
  const c: Contact = {
    spacecraftId: 'SC,1',
    stationId: 'ST;1',
    aosMs: Date.UTC(2026, 2, 5, 10, 0, 0, 400),
    losMs: Date.UTC(2026, 2, 5, 10, 9, 59, 600),
    tcaMs: Date.UTC(2026, 2, 5, 10, 5),
    maxElevationDeg: 42.04,
    aosAzimuthDeg: 10,
    losAzimuthDeg: 190,
    aosClipped: false,
    losClipped: false,
    durationS: 599.2,
  };
  const p: PlanResult = {
    span: { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 6) },
    linkStepS: 1,
    availabilityPercent: 99,
    spacecraft: [{ id: 'SC,1', name: awkward, priority: 1 }],
    stations: [{ id: 'ST;1', name: awkward, timeZone: 'UTC' }],
    contacts: [c],
    warnings: [],
    stats: { propagations: 0, linkSamples: 0 },
  };
  const text = renderCalendar(p, p.contacts, awkward);

  it('folds to 75 octets without splitting characters, and ical.js reads the exact text back', () => {
    checkLines(text);
    const { name, events } = parse(text);
    // ical.js hands an X- property's value over as written (no TEXT unescaping): the RFC 5545 §3.3.11 form, by hand
    expect(name).toBe('Fjellstua\\; nord\\, øvre \\\\ "test"\\nline two — ÆØÅ æøå 🛰 ' + 'ø'.repeat(80));
    expect(events[0]!.location).toBe(`${awkward} (ST;1)`);
    expect(events[0]!.summary).toBe('SC,1 over ST;1');
    expect(events[0]!.description.startsWith(`${awkward} over ${awkward} (ST;1).\nAOS 2026-03-05T10:00:00.4Z`)).toBe(true);
    expect(events[0]!.startMs).toBe(Date.UTC(2026, 2, 5, 10, 0, 0));
    expect(events[0]!.endMs).toBe(Date.UTC(2026, 2, 5, 10, 10, 0));
    expect(events[0]!.uid).toBe('ST_1-SC_1-20260305T100000Z@passbudget');
  });

  it('escapes and folds as RFC 5545 §3.3.11 and §3.1 say', () => {
    expect(escapeText('a\\b;c,d\ne')).toBe('a\\\\b\\;c\\,d\\ne');
    const folded = foldLine('X'.repeat(200));
    expect(folded.split('\r\n ').map((l) => l.length)).toEqual([75, 74, 51]);
  });
});
