// Antenna deconfliction (src/plan/schedule.ts).
// Authorities: small schedules solved by hand (each named below with its
// working), and exhaustive enumeration of every subset on random small cases:
// a subset is feasible on k antennas iff at no instant more than k of its
// occupied intervals [AOS, LOS + setup) are in progress (interval graphs are
// perfect: chromatic number = largest clique, Golumbic, "Algorithmic Graph
// Theory and Perfect Graphs", 1980, ch. 8; from memory). Integer weights, so
// the optimum values must agree exactly.
import { describe, expect, it } from 'vitest';
import { maxDepth, scheduleAntennas, scheduleContacts, scheduleOneAntenna, scheduledPlan, type Job } from '../../src/plan/schedule.js';
import type { Contact, PlanResult } from '../../src/plan/types.js';
import type { Station } from '../../src/scenario/types.js';
import { mulberry32 } from '../fixtures/prng.js';

const MIN = 60_000;


function bruteForce(jobs: Job[], k: number, setupMs: number): number {
  let best = 0;
  for (let mask = 0; mask < 1 << jobs.length; mask++) {
    const sub = jobs.filter((_, i) => mask & (1 << i));
    if (maxDepth(sub, setupMs) > k) continue;
    const w = sub.reduce((s, j) => s + j.weight, 0);
    if (w > best) best = w;
  }
  return best;
}

/** Checks that a chosen set with its antennas is feasible; returns its weight. */
function checkFeasible(jobs: Job[], chosen: Map<number, number>, k: number, setupMs: number): number {
  const byAntenna = new Map<number, Job[]>();
  for (const [i, a] of chosen) {
    expect(a).toBeGreaterThanOrEqual(0);
    expect(a).toBeLessThan(k);
    byAntenna.set(a, [...(byAntenna.get(a) ?? []), jobs[i]!]);
  }
  for (const list of byAntenna.values()) {
    list.sort((x, y) => x.startMs - y.startMs);
    for (let i = 1; i < list.length; i++) expect(list[i - 1]!.endMs + setupMs).toBeLessThanOrEqual(list[i]!.startMs);
  }
  return [...chosen.keys()].reduce((s, i) => s + jobs[i]!.weight, 0);
}

describe('exact scheduler against brute force (all subsets)', () => {
  it('300 seeded random cases of <= 10 windows, 1-3 antennas, setup 0-5 min: same optimum', () => {
    const rnd = mulberry32(20260305);
    let nonTrivial = 0;
    for (let c = 0; c < 300; c++) {
      const n = 1 + Math.floor(rnd() * 10);
      const k = 1 + Math.floor(rnd() * 3);
      const setupMs = Math.floor(rnd() * 6) * MIN;
      const jobs: Job[] = [];
      for (let i = 0; i < n; i++) {
        const startMs = Math.floor(rnd() * 120) * MIN;
        jobs.push({ startMs, endMs: startMs + (1 + Math.floor(rnd() * 40)) * MIN, weight: Math.floor(rnd() * 100) });
      }
      const exact = bruteForce(jobs, k, setupMs);
      const chosen = scheduleAntennas(jobs, k, setupMs);
      expect(checkFeasible(jobs, chosen, k, setupMs)).toBe(exact);
      if (k === 1) {
        const dp = scheduleOneAntenna(jobs, setupMs);
        expect(dp.reduce((s, i) => s + jobs[i]!.weight, 0)).toBe(exact);
      }
      if (maxDepth(jobs.filter((j) => j.weight > 0), setupMs) > k) nonTrivial++;
    }
    // the cases must exercise real conflicts, not only the no-conflict path
    expect(nonTrivial).toBeGreaterThan(150);
  });

  it('min-cost flow on two antennas over two copies of a 30-window case = twice the one-antenna DP optimum (100 cases)', () => {
    // By hand: two exact copies of one case on two antennas can do no better than the
    // one-antenna optimum on each antenna, and can reach it (one copy per antenna).
    const rnd = mulberry32(7);
    for (let c = 0; c < 100; c++) {
      const setupMs = Math.floor(rnd() * 4) * MIN;
      const one: Job[] = [];
      for (let i = 0; i < 30; i++) {
        const startMs = Math.floor(rnd() * 600) * MIN;
        one.push({ startMs, endMs: startMs + (5 + Math.floor(rnd() * 60)) * MIN, weight: 1 + Math.floor(rnd() * 1000) });
      }
      const dp = scheduleOneAntenna(one, setupMs).reduce((s, i) => s + one[i]!.weight, 0);
      // two copies overlapping each other exactly: two antennas can serve one copy each
      const two = [...one, ...one.map((j) => ({ ...j }))];
      const chosen = scheduleAntennas(two, 2, setupMs);
      expect(checkFeasible(two, chosen, 2, setupMs)).toBe(2 * dp);
    }
  });
});

describe('schedules solved by hand', () => {
  it('"tie": A [0,10) w5, B [5,15) w10, C [12,20) w5 on one antenna -> optimum 10 ({A, C} or {B})', () => {
    // By hand: A and C are compatible (10 <= 12); B overlaps both. {A,C} = 10, {B} = 10: optimum 10.
    const jobs: Job[] = [
      { startMs: 0, endMs: 10 * MIN, weight: 5 },
      { startMs: 5 * MIN, endMs: 15 * MIN, weight: 10 },
      { startMs: 12 * MIN, endMs: 20 * MIN, weight: 5 },
    ];
    const chosen = scheduleOneAntenna(jobs, 0);
    expect(chosen.reduce((s, i) => s + jobs[i]!.weight, 0)).toBe(10);
  });

  it('"setup decides": A [0,10) w3, B [11,20) w3, C [0,20) w5; setup 0 -> A+B = 6; setup 2 min -> C = 5', () => {
    const jobs: Job[] = [
      { startMs: 0, endMs: 10 * MIN, weight: 3 },
      { startMs: 11 * MIN, endMs: 20 * MIN, weight: 3 },
      { startMs: 0, endMs: 20 * MIN, weight: 5 },
    ];
    expect(scheduleOneAntenna(jobs, 0)).toEqual([0, 1]);
    // with 2 min setup, B cannot follow A (10 + 2 > 11): best single is C (5) > A or B (3)
    expect(scheduleOneAntenna(jobs, 2 * MIN)).toEqual([2]);
    // exactly 1 min setup still fits (10 + 1 <= 11)
    expect(scheduleOneAntenna(jobs, 1 * MIN)).toEqual([0, 1]);
  });

  it('"three on two": three mutually overlapping windows w 4, 5, 6 on two antennas -> drop the 4', () => {
    const jobs: Job[] = [
      { startMs: 0, endMs: 30 * MIN, weight: 4 },
      { startMs: 10 * MIN, endMs: 40 * MIN, weight: 5 },
      { startMs: 20 * MIN, endMs: 50 * MIN, weight: 6 },
    ];
    const chosen = scheduleAntennas(jobs, 2, 0);
    expect([...chosen.keys()].sort()).toEqual([1, 2]);
    expect(new Set(chosen.values()).size).toBe(2);
  });

  it('"long plus chain": two antennas, a long w10 window and two overlapping pairs of w3 windows -> 10 + 3 + 3 = 16 beats 3 x 4 = 12', () => {
    // L [0,60) w10; S1 [0,20) w3, S2 [0,20) w3, S3 [30,50) w3, S4 [30,50) w3.
    // Two antennas: L on one, then S1,S3 on the other = 16 (optimum; all five need 3 antennas at t=0).
    const jobs: Job[] = [
      { startMs: 0, endMs: 60 * MIN, weight: 10 },
      { startMs: 0, endMs: 20 * MIN, weight: 3 },
      { startMs: 0, endMs: 20 * MIN, weight: 3 },
      { startMs: 30 * MIN, endMs: 50 * MIN, weight: 3 },
      { startMs: 30 * MIN, endMs: 50 * MIN, weight: 3 },
    ];
    const chosen = scheduleAntennas(jobs, 2, 0);
    expect(checkFeasible(jobs, chosen, 2, 0)).toBe(16);
    expect(chosen.has(0)).toBe(true);
  });
});

// ------------------------------------------------------------ network level

function station(id: string, antennaCount: number, setupTimeS: number): Station {
  return {
    id,
    name: id,
    latitudeDeg: 0,
    longitudeDeg: 0,
    heightKm: 0,
    mask: { kind: 'constant', elevationDeg: 5 },
    timeZone: 'UTC',
    receiver: { kind: 'gt', gOverTDbK: 20, atElevationDeg: 10 },
    pointingErrorDeg: 0,
    polarization: 'RHCP',
    climate: { surfaceWaterVapourDensityGM3: 7.5, surfaceTemperatureK: 288, surfacePressureHpa: 1013, nWetMedian: 40 },
    antennaCount,
    setupTimeS,
  };
}

function contact(spacecraftId: string, stationId: string, aosMin: number, losMin: number, volumeBits: number): Contact {
  const aosMs = aosMin * MIN;
  const losMs = losMin * MIN;
  return {
    spacecraftId,
    stationId,
    aosMs,
    losMs,
    tcaMs: (aosMs + losMs) / 2,
    maxElevationDeg: 40,
    aosAzimuthDeg: 0,
    losAzimuthDeg: 180,
    aosClipped: false,
    losClipped: false,
    durationS: (losMs - aosMs) / 1000,
    link: {
      radioId: 'R',
      volumeBits,
      dataStartMs: aosMs,
      dataEndMs: losMs,
      closedS: (losMs - aosMs) / 1000,
      worstMarginDb: 1,
      worstMarginAtMs: aosMs,
      worstMarginElevationDeg: 5,
      peakRateBps: 1,
      timeInModcodS: {},
      samples: 2,
      binStartMs: aosMs,
      volumeBinsBits: [volumeBits],
    },
  };
}

function plan(contacts: Contact[], spacecraft: { id: string; priority: number }[]): PlanResult {
  return {
    span: { startMs: 0, endMs: 86_400_000 },
    linkStepS: 1,
    availabilityPercent: 99,
    spacecraft: spacecraft.map((s) => ({ ...s, name: s.id })),
    stations: [],
    contacts,
    warnings: [],
    stats: { propagations: 0, linkSamples: 0 },
  };
}

describe('network schedule: reasons and lost volume (by hand)', () => {
  const sc = [
    { id: 'HI', priority: 3 },
    { id: 'LO', priority: 1 },
  ];

  it('"priority wins the antenna": overlap at one station -> the priority-3 window is taken, the other lost as overlap', () => {
    // weights: HI 3 x 100 = 300, LO 1 x 200 = 200 -> HI taken, LO lost 200 bits.
    const p = plan([contact('HI', 'A', 0, 10, 100), contact('LO', 'A', 5, 15, 200)], sc);
    const s = scheduleContacts(p, [station('A', 1, 0)], sc);
    expect(s.taken.map((t) => t.contactIndex)).toEqual([0]);
    expect(s.taken[0]!.antenna).toBe(0);
    expect(s.lost).toHaveLength(1);
    const reason = s.lost[0]!.reason;
    expect(reason.kind).toBe('overlap');
    if (reason.kind === 'overlap') expect(reason.with.map((r) => r.contactIndex)).toEqual([0]);
    expect(s.spacecraft.find((r) => r.spacecraftId === 'LO')!.lostBits).toBe(200);
    expect(s.spacecraft.find((r) => r.spacecraftId === 'HI')!.lostBits).toBe(0);
    expect(s.stations[0]!.method).toBe('dp-one-antenna');
    expect(scheduledPlan(p, s).contacts).toHaveLength(1);
  });

  it('"setup time only": back-to-back windows 1 min apart at a station with 2 min setup -> one lost for setup', () => {
    const p = plan([contact('HI', 'A', 0, 10, 100), contact('LO', 'A', 11, 20, 100)], sc);
    const s = scheduleContacts(p, [station('A', 1, 120)], sc);
    expect(s.taken.map((t) => t.contactIndex)).toEqual([0]);
    expect(s.lost[0]!.reason.kind).toBe('setup');
    // with a second antenna both fit, no conflict
    const s2 = scheduleContacts(p, [station('A', 2, 120)], sc);
    expect(s2.taken).toHaveLength(2);
    expect(s2.stations[0]!.method).toBe('no-conflict');
  });

  it('"one station at a time": HI seen by A and B at once -> the lighter window is dropped, B then serves LO', () => {
    // HI at A [0,10) 100 bits (w 300); HI at B [2,12) 50 bits (w 150); LO at B [3,9) 100 bits (w 100).
    // Per station: A takes HI (300); B takes HI (150 > 100). Rule: HI keeps A (300), drops B's HI;
    // B rescheduled without it takes LO. Total 400 (here also the joint optimum: 300 + 100).
    const p = plan([contact('HI', 'A', 0, 10, 100), contact('HI', 'B', 2, 12, 50), contact('LO', 'B', 3, 9, 100)], sc);
    const free = scheduleContacts(p, [station('A', 1, 0), station('B', 1, 0)], sc);
    expect(free.taken.map((t) => t.contactIndex)).toEqual([0, 1]);
    const s = scheduleContacts(p, [station('A', 1, 0), station('B', 1, 0)], sc, { oneStationAtATime: true });
    expect(s.taken.map((t) => t.contactIndex)).toEqual([0, 2]);
    const lost = s.lost.find((l) => l.contactIndex === 1)!;
    expect(lost.reason.kind).toBe('one-station');
    if (lost.reason.kind === 'one-station') expect(lost.reason.with.stationId).toBe('A');
    expect(s.rounds).toBe(2);
    expect(s.spacecraft.find((r) => r.spacecraftId === 'HI')!.lostBits).toBe(50);
    expect(s.totalWeight).toBe(400);
  });

  it('a window with no volume is not taken and is not counted as lost to a conflict', () => {
    const p = plan([contact('HI', 'A', 0, 10, 0)], sc);
    const s = scheduleContacts(p, [station('A', 1, 0)], sc);
    expect(s.taken).toHaveLength(0);
    expect(s.lost[0]!.reason.kind).toBe('no-data');
    expect(s.spacecraft.find((r) => r.spacecraftId === 'HI')!.lostBits).toBe(0);
  });
});
