// The unique-volume rule (src/plan/unique-volume.ts): a spacecraft radio sends one
// stream, so per-spacecraft totals count its data once (the best station in contact at
// each instant) and its contact time is the union of its windows. Checks: the demo week's
// invariants, a hand-computed step-function case, and two co-located stations seeing one
// spacecraft at once (the better station's volume, not the sum).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { contactsOverlappingOwnSpacecraft } from '../../src/plan/link.js';
import { uniqueVolumeOf, uniqueVolumes } from '../../src/plan/unique-volume.js';
import { allStationsDaily, dailyTotals, spacecraftTotals } from '../../src/plan/daily.js';
import { VOLUME_BIN_MS, type Contact } from '../../src/plan/types.js';
import type { Station } from '../../src/scenario/types.js';

const demo = loadScenario(demoFiles());
const span = demo.span!;
const plan = runPlan(demo, span);

describe('unique volume on the demo week', () => {
  const totals = spacecraftTotals(plan);

  it('contact time per spacecraft <= span length; unique volume <= station-sum', () => {
    const spanS = (span.endMs - span.startMs) / 1000;
    for (const t of totals) {
      expect(t.contactTimeS, t.spacecraftId).toBeLessThanOrEqual(spanS + 1e-6);
      expect(t.contactTimeS).toBeLessThanOrEqual(t.stationSumContactTimeS + 1e-6);
      expect(t.volumeBits, t.spacecraftId).toBeLessThanOrEqual(t.stationSumVolumeBits);
    }
    // the geostationary craft, seen by three stations the whole week: one week of contact
    const geo = totals.find((t) => t.spacecraftId === 'ANCHOR-G')!;
    expect(geo.contactTimeS).toBeCloseTo(spanS, 6);
    expect(geo.stationSumContactTimeS).toBeCloseTo(3 * spanS, 6);
    // and at least the best single station's volume
    const best = Math.max(...plan.contacts.filter((c) => c.spacecraftId === 'ANCHOR-G').map((c) => c.link!.volumeBits));
    expect(geo.volumeBits).toBeGreaterThanOrEqual(best);
  });

  it('equal to the station-sum for every window that overlaps no other of its spacecraft', () => {
    const overlapping = contactsOverlappingOwnSpacecraft(plan.contacts);
    for (const sc of plan.spacecraft) {
      const alone = plan.contacts.filter((c, i) => c.spacecraftId === sc.id && !overlapping.has(i));
      const together = plan.contacts.filter((c, i) => c.spacecraftId === sc.id && overlapping.has(i));
      const u = uniqueVolumeOf(sc.id, plan.contacts);
      const uTogether = uniqueVolumeOf(sc.id, together);
      const aloneBits = alone.reduce((s, c) => s + c.link!.volumeBits, 0);
      expect(u.volumeBits, sc.id).toBe(aloneBits + uTogether.volumeBits);
      if (together.length === 0) expect(u.volumeBits).toBe(u.stationSumBits);
    }
    // HERON-2's windows never overlap on the demo; the others do
    expect(totals.find((t) => t.spacecraftId === 'HERON-2')!.volumeBits).toBe(totals.find((t) => t.spacecraftId === 'HERON-2')!.stationSumVolumeBits);
  });

  it('the expected volume counted once: <= its station-sum, >= the best single contact, days add up', () => {
    for (const t of totals) {
      expect(t.expectedVolumeBits, t.spacecraftId).toBeLessThanOrEqual(t.stationSumExpectedVolumeBits);
      const best = Math.max(...plan.contacts.filter((c) => c.spacecraftId === t.spacecraftId).map((c) => c.link?.expectedVolumeBits ?? 0));
      expect(t.expectedVolumeBits, t.spacecraftId).toBeGreaterThanOrEqual(best);
    }
    const sumExpected = plan.contacts.reduce((s, c) => s + (c.link?.expectedVolumeBits ?? 0), 0);
    expect(totals.reduce((s, t) => s + t.stationSumExpectedVolumeBits, 0)).toBe(sumExpected);
    const days = allStationsDaily(plan, dailyTotals(plan, { kind: 'utc' }));
    expect(days.reduce((s, d) => s + d.expectedVolumeBits, 0)).toBe(totals.reduce((s, t) => s + t.expectedVolumeBits, 0));
    expect(days.reduce((s, d) => s + d.stationSumExpectedVolumeBits, 0)).toBe(sumExpected);
  });

  it('the daily all-stations totals add up to the unique totals, whole bits', () => {
    const days = allStationsDaily(plan, dailyTotals(plan, { kind: 'utc' }));
    const onceSum = days.reduce((s, d) => s + d.volumeBits, 0);
    expect(onceSum).toBe(totals.reduce((s, t) => s + t.volumeBits, 0));
    for (const d of days) expect(d.volumeBits).toBeLessThanOrEqual(d.stationSumVolumeBits);
    const stationSum = days.reduce((s, d) => s + d.stationSumVolumeBits, 0);
    expect(stationSum).toBe(plan.contacts.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0));
  });
});

describe('a hand-computed case of two stations at once', () => {
  // Station A receives 10 bit/s over [0, 100] s, station B 20 bit/s over [50, 150] s.
  // Best station at each instant: A alone 0..50 s (500 bits), B 50..150 s (2000 bits).
  const base = 0; // bin-aligned epoch
  const contact = (stationId: string, a: number, b: number, rate: number): Contact => ({
    spacecraftId: 'X',
    stationId,
    aosMs: base + a * 1000,
    losMs: base + b * 1000,
    tcaMs: base + a * 1000,
    maxElevationDeg: 10,
    aosAzimuthDeg: 0,
    losAzimuthDeg: 0,
    aosClipped: false,
    losClipped: false,
    durationS: b - a,
    link: {
      radioId: 'R',
      volumeBits: rate * (b - a),
      dataStartMs: base + a * 1000,
      dataEndMs: base + b * 1000,
      closedS: b - a,
      worstMarginDb: 1,
      worstMarginAtMs: base,
      worstMarginElevationDeg: 10,
      peakRateBps: rate,
      timeInModcodS: {},
      samples: 2,
      binStartMs: Math.floor((base + a * 1000) / VOLUME_BIN_MS) * VOLUME_BIN_MS,
      volumeBinsBits: [rate * (b - a)],
      ratePieces: [base + a * 1000, base + b * 1000, rate],
    },
  });

  it('gives 2500 bits (the better station at each instant), not the 3000-bit sum; contact time 150 s', () => {
    const u = uniqueVolumeOf('X', [contact('A', 0, 100, 10), contact('B', 50, 150, 20)]);
    expect(u.volumeBits).toBe(2500);
    expect(u.stationSumBits).toBe(3000);
    expect(u.contactTimeS).toBe(150);
    expect(u.stationSumContactTimeS).toBe(200);
  });

  it('one window inside a better one counts nothing extra', () => {
    const u = uniqueVolumes(['X'], [contact('A', 0, 150, 20), contact('B', 50, 100, 10)])[0]!;
    expect(u.volumeBits).toBe(3000);
    expect(u.contactTimeS).toBe(150);
  });
});

describe('two co-located stations seeing one spacecraft at once (link engine)', () => {
  it('give the better station\'s volume, not the sum', () => {
    // ANCHOR-G over Sierra Alta's site for one day, received by its 13 m dish and by a
    // 1.2 m dish beside it: the 13 m link supports the higher rate at every instant.
    const sal = demo.stations.find((s) => s.id === 'SAL')!;
    const small: Station = { ...sal, id: 'SAL-B', receiver: { ...sal.receiver, dishDiameterM: 1.2 } as Station['receiver'] };
    const sc = { ...demo, spacecraft: demo.spacecraft.filter((s) => s.id === 'ANCHOR-G'), stations: [sal, small] };
    const p = runPlan(sc, { startMs: span.startMs, endMs: span.startMs + 86_400_000 });
    const [big, little] = ['SAL', 'SAL-B'].map((id) => p.contacts.find((c) => c.stationId === id)!.link!.volumeBits);
    expect(big!).toBeGreaterThan(little!);
    const t = spacecraftTotals(p)[0]!;
    // the same integral summed in another order (rate pieces vs 15-minute bins): equal to
    // float rounding (the Sun outage at 11:24 cuts the day into many pieces)
    expect(Math.abs(t.volumeBits - big!)).toBeLessThanOrEqual(1e-12 * big!);
    expect(t.stationSumVolumeBits).toBe(big! + little!);
  });
});
