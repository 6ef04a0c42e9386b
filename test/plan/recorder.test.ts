// Onboard recorder (src/plan/recorder.ts).
// Authorities: cases solved by hand (working in each test), and conservation of
// data: initial fill + generated = downlinked + stored + lost, exactly in whole
// bits, on the demo and on seeded random cases.
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { scheduleContacts } from '../../src/plan/schedule.js';
import { cumulativeDrainBits, drainProfile, simulateRecorder, simulateRecorders, type RecorderTrack } from '../../src/plan/recorder.js';
import { VOLUME_BIN_MS, type Contact } from '../../src/plan/types.js';
import { spacecraftSchema } from '../../src/scenario/schema.js';
import { mulberry32 } from '../fixtures/prng.js';

const S = 1000;
const HOUR = { startMs: 0, endMs: 3600 * S };

/** A contact whose link sends volumeBinsBits from dataStart to dataEnd (bins of 15 min from binStartMs). */
function contact(aosS: number, losS: number, bins: number[], binStartMs = Math.floor((aosS * S) / VOLUME_BIN_MS) * VOLUME_BIN_MS): Contact {
  const volumeBits = bins.reduce((s, b) => s + b, 0);
  return {
    spacecraftId: 'SC',
    stationId: 'ST',
    aosMs: aosS * S,
    losMs: losS * S,
    tcaMs: ((aosS + losS) / 2) * S,
    maxElevationDeg: 30,
    aosAzimuthDeg: 0,
    losAzimuthDeg: 180,
    aosClipped: false,
    losClipped: false,
    durationS: losS - aosS,
    link: {
      radioId: 'R',
      volumeBits,
      dataStartMs: aosS * S,
      dataEndMs: losS * S,
      closedS: losS - aosS,
      worstMarginDb: 1,
      worstMarginAtMs: aosS * S,
      worstMarginElevationDeg: 5,
      peakRateBps: 1,
      timeInModcodS: {},
      samples: 2,
      binStartMs,
      volumeBinsBits: bins,
    },
  };
}

const balance = (t: RecorderTrack) => t.initialBits + t.generatedBits - (t.downlinkedBits + t.finalBits + t.lostBits);

describe('recorder duty cycle in the spacecraft file', () => {
  it('accepts recorder.duty {onS > 0, offS >= 0} and names the field when it is wrong', () => {
    const base = { id: 'SC', orbit: { moon: true }, recorder: { capacityGbit: 1, generationMbps: 1 } };
    expect(spacecraftSchema.safeParse({ ...base, recorder: { ...base.recorder, duty: { onS: 600, offS: 5400 } } }).success).toBe(true);
    const bad = spacecraftSchema.safeParse({ ...base, recorder: { ...base.recorder, duty: { onS: 0, offS: 10 } } });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.path).toEqual(['recorder', 'duty', 'onS']);
  });
});

describe('recorder solved by hand', () => {
  it('"one pass": 1 kbit/s, 1 Mbit recorder, one 10 kbit/s contact 600..900 s, one hour', () => {
    // By hand: at 600 s the store holds 600,000 bits (oldest generated at 0 s: age 600 s).
    // The contact sends 10,000 bit/s against 1,000 bit/s coming in: empty at 666.7 s, then it
    // sends what is generated: downlinked = 600,000 + 300 x 1,000 = 900,000 bits.
    // After 900 s: 2,700 s x 1,000 = 2,700,000 bits arrive into 1,000,000 bits of room:
    // stored 1,000,000, lost 1,700,000 (full at 1,900 s). Generated 3,600,000.
    const c = contact(600, 900, [3_000_000]);
    const t = simulateRecorder('SC', { capacityBits: 1e6, generationBps: 1000, initialFillBits: 0 }, [{ contactIndex: 0, contact: c }], HOUR);
    expect(t.generatedBits).toBe(3_600_000);
    expect(t.downlinkedBits).toBe(900_000);
    expect(t.finalBits).toBe(1_000_000);
    expect(t.lostBits).toBe(1_700_000);
    expect(t.firstOverflowMs).toBe(1900 * S);
    expect(t.passes[0]!.oldestAgeAtStartS).toBe(600);
    expect(t.passes[0]!.backlogAtStartBits).toBe(600_000);
    expect(t.passes[0]!.downlinkedBits).toBe(900_000);
    expect(t.passes[0]!.backlogAtEndBits).toBe(0);
    expect(balance(t)).toBe(0);
  });

  it('"duty cycle": on 60 s / off 240 s at 1 kbit/s for an hour, no contact, initial fill 5,000 bits', () => {
    // By hand: 12 cycles x 60 s x 1,000 bit/s = 720,000 bits generated; nothing sent or lost.
    const t = simulateRecorder('SC', { capacityBits: 1e7, generationBps: 1000, initialFillBits: 5000, duty: { onS: 60, offS: 240 } }, [], HOUR);
    expect(t.generatedBits).toBe(720_000);
    expect(t.finalBits).toBe(725_000);
    expect(t.lostBits).toBe(0);
    // the oldest data (initial fill) is as old as the span at the end
    expect(t.series.oldestAgeS.at(-1)).toBe(3600);
  });

  it('"FIFO age": the second pass sends data generated after the first pass ended', () => {
    // 100 bit/s; pass 1 at 300..400 s empties the store (capacity 1e6 bit/s); pass 2 at 1000 s:
    // oldest stored bit was generated at 400 s (all earlier data went in pass 1): age 600 s.
    const p1 = contact(300, 400, [1e8]);
    const p2 = contact(1000, 1100, [1e8]);
    const t = simulateRecorder('SC', { capacityBits: 1e9, generationBps: 100, initialFillBits: 0 }, [{ contactIndex: 0, contact: p1 }, { contactIndex: 1, contact: p2 }], HOUR);
    expect(t.passes[0]!.oldestAgeAtStartS).toBe(300);
    expect(t.passes[1]!.oldestAgeAtStartS).toBe(600);
    expect(t.passes[1]!.backlogAtStartBits).toBe(60_000);
  });

  it('drain profile: each 15-min bin spreads uniformly over its part of the data span; floors reach the total exactly', () => {
    // data 800..1000 s: bin 0 (0..900 s) holds 1,000 bits over 100 s, bin 1 (900..1800 s) 3 bits over 100 s
    const c = contact(800, 1000, [1000, 3], 0);
    const prof = drainProfile(c.link!);
    expect(prof).toEqual([
      { startMs: 800 * S, endMs: 900 * S, bits: 1000 },
      { startMs: 900 * S, endMs: 1000 * S, bits: 3 },
    ]);
    expect(cumulativeDrainBits(prof, 850 * S)).toBe(500);
    expect(cumulativeDrainBits(prof, 950 * S)).toBe(1001); // 1000 + floor(1.5)
    expect(cumulativeDrainBits(prof, 1000 * S)).toBe(1003);
  });
});


describe('mass balance to the bit', () => {
  it('holds on 100 seeded random cases (odd rates, duty cycles, overlapping contacts, odd steps)', () => {
    const rnd = mulberry32(42);
    let overflowed = 0;
    for (let n = 0; n < 100; n++) {
      const span = { startMs: 0, endMs: Math.floor((2 + rnd() * 10) * 3600) * S + Math.floor(rnd() * 1000) };
      const contacts = [];
      for (let i = 0; i < 1 + Math.floor(rnd() * 8); i++) {
        const aos = Math.floor(rnd() * (span.endMs / S - 1200));
        const los = aos + 60 + Math.floor(rnd() * 1100);
        const nBins = Math.floor((los * S) / VOLUME_BIN_MS) - Math.floor((aos * S) / VOLUME_BIN_MS) + 1;
        contacts.push({ contactIndex: i, contact: contact(aos, los, Array.from({ length: nBins }, () => Math.floor(rnd() * 5e7))) });
      }
      const rec = {
        capacityBits: 1e6 + rnd() * 5e8,
        generationBps: rnd() * 3e4 + 0.37,
        initialFillBits: rnd() < 0.3 ? rnd() * 6e8 : 0,
        ...(rnd() < 0.5 ? { duty: { onS: 1 + rnd() * 900, offS: rnd() * 2000 } } : {}),
      };
      const t = simulateRecorder('SC', rec, contacts, span, { stepS: [1, 7, 10, 60][Math.floor(rnd() * 4)]! });
      expect(balance(t)).toBe(0);
      expect(t.finalBits).toBeLessThanOrEqual(t.capacityBits);
      expect(t.downlinkedBits).toBeLessThanOrEqual(t.offeredBits);
      for (const v of [t.generatedBits, t.downlinkedBits, t.lostBits, t.finalBits]) expect(Number.isInteger(v)).toBe(true);
      if (t.lostBits > 0) overflowed++;
    }
    expect(overflowed).toBeGreaterThan(10);
  });

  it('holds on the demo (first day, scheduled contacts)', () => {
    const scenario = loadScenario(demoFiles());
    const span = { startMs: scenario.span!.startMs, endMs: scenario.span!.startMs + 86_400_000 };
    const plan = runPlan(scenario, span, { linkStepS: 10 });
    const schedule = scheduleContacts(plan, scenario.stations, scenario.spacecraft);
    const res = simulateRecorders(plan, scenario.spacecraft, schedule);
    expect(res.tracks.map((t) => t.spacecraftId)).toEqual(scenario.spacecraft.filter((s) => s.recorder).map((s) => s.id));
    for (const t of res.tracks) {
      expect(balance(t)).toBe(0);
      expect(t.generatedBits).toBe(Math.floor(t.generationBps * 86_400));
      // the series ends at the span end with the final state
      expect(t.series.tMs.at(-1)).toBe(span.endMs);
      expect(t.series.storedBits.at(-1)).toBe(t.finalBits);
      expect(t.downlinkedBits).toBeGreaterThan(0);
    }
  });
});
