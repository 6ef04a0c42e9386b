// Daily totals per station (src/plan/daily.ts).
//
// External references:
// - IANA time zone database, file "northamerica", US rules since 2007 (Energy
//   Policy Act of 2005): daylight time starts on the second Sunday of March at
//   02:00 local standard time. 2026-03-08 is that Sunday, so the local day
//   2026-03-08 is 23 hours long in America/Denver (UTC-7 -> UTC-6) and in
//   America/Anchorage (UTC-9 -> UTC-8); daylight time ends on the first Sunday
//   of November (2026-11-01), a 25-hour day. Exact, to the millisecond.
// - Same database, file "europe": the EU change is on the last Sunday of March
//   (2026-03-29), and Pacific/Auckland's on the first Sunday of April, so the
//   other demo stations have only 24-hour days in the demo window (from memory
//   of the EU and NZ rules; the dates are outside the window by weeks).
// - Same database, file "africa": Africa/Monrovia kept UTC-00:44:30 until
//   1972 (from memory; Node's own ICU zone data agrees): its days do not start
//   on a 15-minute UTC edge.
// The sums are invariants: daily rows must add up, to the bit, to the contacts.
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { dailyTotals, spacecraftTotals, type DailyRow } from '../../src/plan/daily.js';
import { VOLUME_BIN_MS, type Contact, type PlanResult } from '../../src/plan/types.js';
import { ModelRangeError } from '../../src/errors.js';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
const t = (iso: string) => Date.parse(iso);
const microsecondS = 1e-6; // float sums of contact seconds

// The demo over 2026-03-07T00Z .. 2026-03-09T00Z (contains the US change), coarse 10 s link step.
const scenario = loadScenario(demoFiles());
const span = { startMs: t('2026-03-07T00:00:00Z'), endMs: t('2026-03-09T00:00:00Z') };
const plan = runPlan(scenario, span, { linkStepS: 10 });

function sumBy<T>(items: readonly T[], f: (x: T) => number): number {
  return items.reduce((s, x) => s + f(x), 0);
}

function checkSums(rows: readonly DailyRow[], p: PlanResult): void {
  for (const st of p.stations) {
    const mine = rows.filter((r) => r.stationId === st.id);
    const contacts = p.contacts.filter((c) => c.stationId === st.id);
    const volume = sumBy(mine, (r) => r.volumeBits);
    expect(Number.isSafeInteger(volume)).toBe(true);
    expect(volume).toBe(sumBy(contacts, (c) => c.link?.volumeBits ?? 0));
    expect(sumBy(mine, (r) => r.contactCount)).toBe(contacts.length);
    expect(Math.abs(sumBy(mine, (r) => r.contactTimeS) - sumBy(contacts, (c) => c.durationS))).toBeLessThan(microsecondS * contacts.length + microsecondS);
    for (const r of mine) {
      expect(Number.isInteger(r.volumeBits)).toBe(true);
      expect(r.contactTimeS).toBeLessThanOrEqual((r.dayEndMs - r.dayStartMs) / 1000 * Math.max(1, p.spacecraft.length));
    }
  }
}

function checkDaysCoverSpan(rows: readonly DailyRow[], p: PlanResult): void {
  for (const st of p.stations) {
    const mine = rows.filter((r) => r.stationId === st.id);
    expect(mine.length).toBeGreaterThan(0);
    expect(mine[0]!.dayStartMs).toBeLessThanOrEqual(p.span.startMs);
    expect(mine[0]!.dayEndMs).toBeGreaterThan(p.span.startMs);
    expect(mine[mine.length - 1]!.dayEndMs).toBeGreaterThanOrEqual(p.span.endMs);
    expect(mine[mine.length - 1]!.dayStartMs).toBeLessThan(p.span.endMs);
    for (let i = 1; i < mine.length; i++) {
      expect(mine[i]!.dayStartMs).toBe(mine[i - 1]!.dayEndMs); // contiguous, none missing
      expect(mine[i]!.day > mine[i - 1]!.day).toBe(true);
    }
  }
}

describe('daily totals on the demo (2026-03-07 .. 09 UTC)', () => {
  it('has contacts with volume at every station (else the sums below prove little)', () => {
    for (const st of plan.stations) {
      expect(plan.contacts.filter((c) => c.stationId === st.id && (c.link?.volumeBits ?? 0) > 0).length).toBeGreaterThan(2);
    }
    // some contact crosses a UTC midnight (so the split is exercised)
    expect(plan.contacts.some((c) => Math.floor(c.aosMs / DAY_MS) !== Math.floor(c.losMs / DAY_MS) && c.losMs < span.endMs)).toBe(true);
  });

  it('UTC days: every day present, sums equal to the bit', () => {
    const rows = dailyTotals(plan, { kind: 'utc' });
    expect(rows.length).toBe(plan.stations.length * 2);
    for (const r of rows) {
      expect(r.timeZone).toBe('UTC');
      expect(r.dayHours).toBe(24);
      expect(r.dstChange).toBe(false);
      expect(r.partial).toBe(false);
      expect(['2026-03-07', '2026-03-08']).toContain(r.day);
    }
    checkDaysCoverSpan(rows, plan);
    checkSums(rows, plan);
  });

  it('local days: every day present, sums equal to the bit', () => {
    const rows = dailyTotals(plan, { kind: 'local' });
    checkDaysCoverSpan(rows, plan);
    checkSums(rows, plan);
    // Denver: the span 2026-03-06T17:00-07:00 .. 2026-03-08T18:00-06:00 touches three local days
    expect(rows.filter((r) => r.stationId === 'MDL').map((r) => r.day)).toEqual(['2026-03-06', '2026-03-07', '2026-03-08']);
  });

  it('local days: 2026-03-08 is a 23-hour day in America/Denver and America/Anchorage, flagged (IANA tz, US rule)', () => {
    const rows = dailyTotals(plan, { kind: 'local' });
    const mdl = rows.find((r) => r.stationId === 'MDL' && r.day === '2026-03-08')!;
    expect(mdl.timeZone).toBe('America/Denver');
    expect(mdl.dayStartMs).toBe(t('2026-03-08T07:00:00Z')); // 00:00 MST (UTC-7)
    expect(mdl.dayEndMs).toBe(t('2026-03-09T06:00:00Z')); // 00:00 MDT (UTC-6)
    expect(mdl.dayHours).toBe(23);
    expect(mdl.dstChange).toBe(true);
    expect(mdl.partial).toBe(true); // the span ends at 18:00 MDT
    const alk = rows.find((r) => r.stationId === 'ALK' && r.day === '2026-03-08')!;
    expect(alk.dayStartMs).toBe(t('2026-03-08T09:00:00Z')); // UTC-9
    expect(alk.dayEndMs).toBe(t('2026-03-09T08:00:00Z')); // UTC-8
    expect(alk.dayHours).toBe(23);
    expect(alk.dstChange).toBe(true);
    // no other demo station changes its clocks in March before the 29th
    for (const r of rows.filter((x) => x.stationId !== 'MDL' && x.stationId !== 'ALK')) expect(r.dayHours).toBe(24);
    for (const r of rows.filter((x) => x.day !== '2026-03-08')) expect(r.dstChange).toBe(false);
  });

  it('per-spacecraft station-sums equal the sum over that spacecraft\'s contacts (the counted-once totals: unique-volume.test.ts)', () => {
    const totals = spacecraftTotals(plan);
    expect(totals.map((x) => x.spacecraftId)).toEqual(plan.spacecraft.map((s) => s.id));
    for (const tot of totals) {
      const mine = plan.contacts.filter((c) => c.spacecraftId === tot.spacecraftId);
      expect(tot.contactCount).toBe(mine.length);
      expect(tot.stationSumVolumeBits).toBe(sumBy(mine, (c) => c.link?.volumeBits ?? 0));
      expect(tot.volumeBits).toBeLessThanOrEqual(tot.stationSumVolumeBits);
      expect(Math.abs(tot.stationSumContactTimeS - sumBy(mine, (c) => c.durationS))).toBeLessThan(microsecondS * (mine.length + 1));
    }
    expect(sumBy(totals, (x) => x.stationSumVolumeBits)).toBe(sumBy(plan.contacts, (c) => c.link?.volumeBits ?? 0));
  });
});

// A hand-made plan: the rules checked on figures worked out by hand.
function contact(stationId: string, aosIso: string, losIso: string, bins?: { startIso: string; bits: number[] }): Contact {
  const aosMs = t(aosIso);
  const losMs = t(losIso);
  const c: Contact = {
    spacecraftId: 'SC-A',
    stationId,
    aosMs,
    losMs,
    tcaMs: (aosMs + losMs) / 2,
    maxElevationDeg: 30,
    aosAzimuthDeg: 10,
    losAzimuthDeg: 200,
    aosClipped: false,
    losClipped: false,
    durationS: (losMs - aosMs) / 1000,
  };
  if (bins) {
    c.link = {
      radioId: 'R',
      volumeBits: sumBy(bins.bits, (b) => b),
      dataStartMs: aosMs,
      dataEndMs: losMs,
      closedS: c.durationS,
      worstMarginDb: 1,
      worstMarginAtMs: aosMs,
      worstMarginElevationDeg: 5,
      peakRateBps: 1e6,
      timeInModcodS: {},
      samples: 10,
      binStartMs: t(bins.startIso),
      volumeBinsBits: bins.bits,
    };
  }
  return c;
}

function handPlan(startIso: string, endIso: string, zone: string, contacts: Contact[]): PlanResult {
  return {
    span: { startMs: t(startIso), endMs: t(endIso) },
    linkStepS: 1,
    availabilityPercent: 99,
    spacecraft: [{ id: 'SC-A', name: 'A', priority: 1 }],
    stations: [{ id: 'ST', name: 'Station', timeZone: zone }],
    contacts,
    warnings: [],
    stats: { propagations: 0, linkSamples: 0 },
  };
}

describe('daily rules on a hand-made plan', () => {
  // Denver, 2026-11-01: daylight time ends (first Sunday of November), a 25-hour local day
  // from 2026-11-01T06:00Z (00:00 MDT) to 2026-11-02T07:00Z (00:00 MST).
  const c1 = contact('ST', '2026-11-01T05:50:00Z', '2026-11-01T06:20:00Z', { startIso: '2026-11-01T05:45:00Z', bits: [300, 700, 0] });
  const c2 = contact('ST', '2026-11-02T06:55:00Z', '2026-11-02T07:05:00Z', { startIso: '2026-11-02T06:45:00Z', bits: [11, 13] });
  const p = handPlan('2026-10-31T06:00:00Z', '2026-11-03T07:00:00Z', 'America/Denver', [c1, c2]);

  it('a contact across local midnight: time split at the boundary, volume by bin, counted on its AOS day', () => {
    const rows = dailyTotals(p, { kind: 'local' });
    expect(rows.map((r) => r.day)).toEqual(['2026-10-31', '2026-11-01', '2026-11-02']);
    const [oct31, nov1, nov2] = rows as [DailyRow, DailyRow, DailyRow];
    expect(nov1.dayHours).toBe(25);
    expect(nov1.dstChange).toBe(true);
    expect(oct31.dayHours).toBe(24);
    expect(nov2.dayStartMs).toBe(t('2026-11-02T07:00:00Z'));
    // c1: AOS 23:50 MDT on Oct 31, LOS 00:20 MDT on Nov 1 -> 600 s and 1200 s
    expect(oct31.contactCount).toBe(1);
    expect(oct31.contactTimeS).toBeCloseTo(600, 9);
    expect(oct31.volumeBits).toBe(300); // bin 05:45Z..06:00Z
    // c2: AOS 23:55 MST on Nov 1 (the 25-hour day), LOS 00:05 MST on Nov 2
    expect(nov1.contactCount).toBe(1);
    expect(nov1.contactTimeS).toBeCloseTo(1200 + 300, 9);
    expect(nov1.volumeBits).toBe(700 + 11);
    expect(nov2.contactCount).toBe(0);
    expect(nov2.contactTimeS).toBeCloseTo(300, 9);
    expect(nov2.volumeBits).toBe(13);
    expect(rows.every((r) => !r.partial)).toBe(true);
  });

  it('UTC days of an unaligned span: first and last days partial, zero rows kept', () => {
    const q = handPlan('2026-11-01T05:30:00Z', '2026-11-04T01:00:00Z', 'America/Denver', [c1]);
    const rows = dailyTotals(q, { kind: 'utc' });
    expect(rows.map((r) => [r.day, r.partial, r.volumeBits, r.contactCount])).toEqual([
      ['2026-11-01', true, 1000, 1],
      ['2026-11-02', false, 0, 0],
      ['2026-11-03', false, 0, 0],
      ['2026-11-04', true, 0, 0],
    ]);
  });

  it('a contact without a link result counts and takes time but adds no volume', () => {
    const q = handPlan('2026-11-01T00:00:00Z', '2026-11-02T00:00:00Z', 'UTC', [contact('ST', '2026-11-01T10:00:00Z', '2026-11-01T10:10:00Z')]);
    const [r] = dailyTotals(q, { kind: 'local' });
    expect(r).toMatchObject({ day: '2026-11-01', contactCount: 1, volumeBits: 0, dayHours: 24 });
    expect(r!.contactTimeS).toBeCloseTo(600, 9);
  });

  it('refuses a zone whose day does not start on a 15-minute UTC edge (Monrovia, UTC-00:44:30, 1970)', () => {
    const q = handPlan('1970-06-01T00:00:00Z', '1970-06-02T00:00:00Z', 'Africa/Monrovia', []);
    expect(() => dailyTotals(q, { kind: 'local' })).toThrow(ModelRangeError);
    expect(VOLUME_BIN_MS).toBe(15 * 60 * 1000);
  });
});
