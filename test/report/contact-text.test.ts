// The hand-built contact texts (src/report/contact-text.ts) against their definitions,
// made by independent means: Node's own JSON.stringify of the contact's record object
// (contactJson, pretty with 2 spaces and re-indented to its place in plan.json, and
// compact for contacts.jsonl), and csv-stringify 6.9.0 (an RFC 4180 writer from npm) of
// its CONTACT_COLUMNS cells. Exact equality on a demo day (every kind of target, link
// and light time) and on 3,000 seeded random contacts with awkward values (NaN, -0,
// halves at the rounding digit, huge and tiny numbers, ids with commas, quotes and
// non-ASCII letters, other radios, absent links). The plan workers' byte renderer
// (src/report/batch-text.ts: report/contact-bytes.ts and report/event-bytes.ts) is held to
// the same references, and its iCalendar events to report/calendar.ts eventText (itself
// checked against RFC 5545 and ical.js in test/report/calendar.test.ts).
import { describe, it, expect } from 'vitest';
import { stringify } from 'csv-stringify/sync';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { contactJson } from '../../src/report/plan.js';
import { CONTACT_COLUMNS, contactRecord } from '../../src/report/contact-columns.js';
import { CONTACT_JSON_PAD, contactTexts, csvLayout, roundedText } from '../../src/report/contact-text.js';
import type { Contact, ContactLink, PlanResult } from '../../src/plan/types.js';
import { mulberry32 } from '../fixtures/prng.js';
import { renderBatchTexts } from '../../src/report/batch-text.js';
import { FORM } from '../../src/report/contact-store.js';
import { contactUids, eventContext, eventText } from '../../src/report/calendar.js';

/** The definitions: JSON.stringify and csv-stringify of the generic records. */
function reference(c: Contact, contacts: Contact[]): { json: string; line: string; csv: string } {
  const layout = csvLayout(contacts);
  const keys = CONTACT_COLUMNS.filter((_, i) => layout.mask[i]).map((col) => col.key);
  const rec = contactRecord(c);
  const row = keys.map((k) => {
    const v = rec[k];
    return v === null || v === undefined ? '' : typeof v === 'boolean' ? (v ? 'true' : 'false') : v;
  });
  return {
    json: JSON.stringify(contactJson(c), null, 2).replace(/\n/g, `\n${CONTACT_JSON_PAD}`),
    line: `${JSON.stringify(contactJson(c))}\n`,
    csv: stringify([row], { cast: { number: (n) => String(n) } }),
  };
}

function expectSame(contacts: Contact[]): void {
  const layout = csvLayout(contacts);
  // the same contacts as a worker's batch, rendered as bytes
  const ids = (key: 'spacecraftId' | 'stationId') => [...new Set(contacts.map((c) => c[key]))];
  const plan = {
    span: { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 12) },
    spacecraft: ids('spacecraftId').map((id, i) => ({ id, name: i % 2 ? `Craft ${id}` : `Ørn; ${id}\\`, priority: 1 })),
    stations: ids('stationId').map((id) => ({ id, name: `Site, ${id} ✓`, timeZone: 'UTC' })),
    contacts,
  } as unknown as PlanResult;
  const batch = renderBatchTexts(plan);
  expect(batch.csvHeader).toBe(layout.header);
  const bytes = (form: number, i: number): string => {
    const f = batch.forms[form]!;
    return Buffer.from(f.bytes!.subarray(f.offsets[i]!, f.offsets[i + 1]!)).toString('utf8');
  };
  const uids = contactUids(plan);
  const ctx = eventContext(plan);
  contacts.forEach((c, i) => {
    const got = contactTexts(c, layout);
    const want = reference(c, contacts);
    expect(got.json).toBe(want.json);
    expect(got.line).toBe(want.line);
    expect(got.csv).toBe(want.csv);
    expect(bytes(FORM.json, i)).toBe(want.json);
    expect(bytes(FORM.line, i)).toBe(want.line);
    expect(bytes(FORM.csv, i)).toBe(want.csv);
    expect(bytes(FORM.ics, i)).toBe(eventText(ctx, c, uids[i]!));
  });
}

describe('contact texts', () => {
  it('match JSON.stringify and csv-stringify on a demo day (every target kind)', () => {
    const scenario = loadScenario(demoFiles());
    const start = scenario.span!.startMs;
    const plan = runPlan(scenario, { startMs: start, endMs: start + 86_400_000 }, { linkStepS: 30 });
    expect(plan.contacts.length).toBeGreaterThan(50);
    expectSame(plan.contacts);
  });

  it('match them on 3,000 seeded awkward contacts', () => {
    const rnd = mulberry32(1810);
    const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
    const awkward = [Number.NaN, -0, 0, 0.005, 0.015, 1.005, 2.675, -1.125, 1e-7, 123456789.125, 1e15 + 0.5, 9.995, -9.995, 1e21, Infinity];
    const num = (scale: number): number => (rnd() < 0.2 ? pick(awkward) : (rnd() - 0.3) * scale);
    const ids = ['A', 'B,1', 'q"uote', 'Ünïcode', 'line\nbreak', 'X-DATA', 'tab\tid'];
    const t0 = Date.UTC(2026, 2, 5);
    const link = (): ContactLink => ({
      radioId: pick(ids),
      volumeBits: Math.round(rnd() * 1e11),
      dataStartMs: t0 + Math.floor(rnd() * 6e8),
      dataEndMs: t0 + Math.floor(rnd() * 6e8),
      closedS: num(1000),
      worstMarginDb: num(30),
      worstMarginAtMs: t0 + rnd() * 6e8,
      worstMarginElevationDeg: num(90),
      peakRateBps: num(1e8),
      timeInModcodS: rnd() < 0.2 ? {} : { [pick(ids)]: num(500), 'QPSK 1/2': num(500), '8PSK 3/5': 0 },
      samples: 10,
      binStartMs: t0,
      volumeBinsBits: [],
      ...(rnd() < 0.6 ? { expectedVolumeBits: Math.round(rnd() * 1e11), expectedVolumeBoundBits: rnd() * 1e5 } : {}),
    });
    const contacts: Contact[] = [];
    for (let i = 0; i < 3000; i++) {
      const light = rnd() < 0.3;
      contacts.push({
        stationId: pick(ids),
        spacecraftId: pick(ids),
        aosMs: t0 + Math.floor(rnd() * 6e8),
        tcaMs: t0 + rnd() * 6e8,
        losMs: t0 + Math.floor(rnd() * 6e8),
        maxElevationDeg: num(90),
        aosAzimuthDeg: num(360),
        losAzimuthDeg: num(360),
        aosClipped: rnd() < 0.1,
        losClipped: rnd() < 0.1,
        durationS: num(3000),
        ...(light ? { lightTimeS: num(2000), aosTransmitMs: t0 + rnd() * 6e8, losTransmitMs: t0 + rnd() * 6e8 } : {}),
        ...(rnd() < 0.8 ? { link: link() } : {}),
        ...(rnd() < 0.15 ? { otherLinks: rnd() < 0.1 ? [] : [link(), link()] } : {}),
      });
    }
    expectSame(contacts);
    expectSame(contacts.filter((c) => c.link === undefined)); // a geometry-only layout
  });

  it('rounded numbers read as String(Number(v.toFixed(d))) on 100,000 seeded values', () => {
    const rnd = mulberry32(77);
    for (let i = 0; i < 100_000; i++) {
      const d = Math.floor(rnd() * 7);
      const v = (rnd() - 0.5) * 10 ** Math.floor(rnd() * 24 - 8);
      expect(roundedText(v, d)).toBe(String(Number(v.toFixed(d))));
    }
  });
});
