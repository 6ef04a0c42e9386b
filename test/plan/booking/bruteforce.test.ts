// The booking MIP (src/plan/booking/mip.ts) against exhaustive enumeration on
// small random cases: a few windows, 1-3 antennas, track periods on a 1-min
// grid, requirements (hard and soft), set-up, slews and a recorder model on.
// Authority: brute force over every assignment of every candidate track to
// "not booked" or one of its antennas, keeping those that obey the stated
// rules (conflicts.ts) and scoring them by the stated objective
// (objective.ts); the MIP optimum (relative gap 0) must equal the best score
// to 1e-6. Also: the candidate periods equal an independent enumeration of
// the grid periods (every pair of grid points or window edges whose distance
// lies in [minTrack, maxTrack]).
import { describe, expect, it } from 'vitest';
import { buildCandidates, type WindowInput } from '../../../src/plan/booking/candidates.js';
import { antennaCompatible, spacecraftConflict, type ConflictContext } from '../../../src/plan/booking/conflicts.js';
import { solveMip } from '../../../src/plan/booking/mip.js';
import { evaluateObjective, hardWeight, recorderModel, requirementRows } from '../../../src/plan/booking/objective.js';
import { solveGreedy } from '../../../src/plan/booking/greedy.js';
import { DEFAULT_RULES, type AntennaMechanics, type BookingRules, type Candidate, type SpacecraftRules } from '../../../src/plan/booking/types.js';
import { mulberry32 } from '../../fixtures/prng.js';
import { contact, HOUR, MIN, T0 } from './helpers.js';

const span = { startMs: T0, endMs: T0 + 24 * HOUR };

function bruteForce(cands: readonly Candidate[], ctx: ConflictContext, score: (chosen: Set<number>) => number): number {
  let best = -Infinity;
  const chosen: { t: number; a: number }[] = [];
  const rec = (t: number) => {
    if (t === cands.length) {
      best = Math.max(best, score(new Set(chosen.map((c) => c.t))));
      return;
    }
    rec(t + 1);
    const c = cands[t]!;
    if (chosen.some((o) => spacecraftConflict(c, cands[o.t]!, ctx))) return;
    for (const a of c.antennas) {
      if (chosen.some((o) => o.a === a && cands[o.t]!.stationId === c.stationId && !antennaCompatible(c, cands[o.t]!, ctx))) continue;
      chosen.push({ t, a });
      rec(t + 1);
      chosen.pop();
    }
  };
  rec(0);
  return best;
}

/** Grid periods of a window by plain enumeration (the rule in candidates.ts). */
function gridPeriods(aos: number, los: number, minS: number, maxS: number, gridS: number): number {
  const pts = [aos];
  for (let t = span.startMs + Math.ceil((aos - span.startMs) / (gridS * 1000) + 1e-9) * gridS * 1000; t < los; t += gridS * 1000) if (t > aos) pts.push(t);
  pts.push(los);
  let n = 0;
  for (const a of pts) for (const b of pts) if (b - a >= minS * 1000 && b - a <= maxS * 1000) n++;
  return n;
}

interface Case {
  cands: Candidate[];
  ctx: ConflictContext;
  rules: Map<string, SpacecraftRules>;
  recorder: { id: string; capacityBits: number; generationBps: number; initialFillBits: number } | null;
}

function randomCase(seed: number): Case | null {
  const rnd = mulberry32(seed);
  const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const stations = ['A', 'B'].slice(0, 1 + Math.floor(rnd() * 2));
  const antennaCount = new Map(stations.map((s) => [s, 1 + Math.floor(rnd() * 3)]));
  const setupS = new Map(stations.map((s) => [s, pick([0, 60, 120])]));
  const mech: AntennaMechanics = { mount: 'el-az', axis1RateDegS: 2, axis2RateDegS: 1, axis1AccelDegS2: 1, axis2AccelDegS2: 1, elevationMinDeg: 0, elevationMaxDeg: 90, cableWrapDeg: [-270, 270], xyLimitDeg: 90, trackingToleranceDeg: 0.1 };
  const mechanics = new Map(stations.filter(() => rnd() < 0.6).map((s) => [s, mech]));
  const sc = ['X', 'Y', 'Z'].slice(0, 2 + Math.floor(rnd() * 2));
  const priority = new Map(sc.map((s) => [s, 1 + Math.floor(rnd() * 3)]));
  const rules = new Map<string, SpacecraftRules>();
  for (const s of sc) {
    const tracks = rnd() < 0.7;
    const reqs: SpacecraftRules['requirements'] = [];
    if (rnd() < 0.6) {
      const kind = pick(['tracksPerDay', 'minutesPerDay', 'volumePerDayGbit', 'maxGapH'] as const);
      const value = kind === 'tracksPerDay' ? 2 : kind === 'minutesPerDay' ? 6 : kind === 'volumePerDayGbit' ? 0.5 : 23.5;
      reqs.push({ index: 0, kind, value, hard: rnd() < 0.4, penalty: pick([0.05, 0.5, 3]), dayZone: 'UTC' });
    }
    rules.set(s, { minTrackS: tracks ? 120 : null, maxTrackS: tracks ? 240 : null, allowStations: null, denyStations: [], requirements: reqs });
  }
  const windows: WindowInput[] = [];
  const nWin = 3 + Math.floor(rnd() * 3);
  for (let i = 0; i < nWin; i++) {
    const st = pick(stations);
    const aos = T0 + Math.floor(rnd() * 30) * 30_000 + 10 * MIN;
    const los = aos + (3 + Math.floor(rnd() * 3)) * MIN + Math.floor(rnd() * 4) * 15_000;
    const s = pick(sc);
    windows.push({
      contactIndex: i,
      contact: contact(s, st, aos, los, 1_000_000 + Math.floor(rnd() * 3_000_000)),
      priority: priority.get(s)!,
      rules: rules.get(s),
      antennaCount: antennaCount.get(st)!,
      setupS: setupS.get(st)!,
      lost: [],
      pointing: null,
      stationEvents: [],
      blocked: rnd() < 0.3 ? [aos, aos + 2 * MIN, 0] : [],
    });
  }
  const bookingRules: BookingRules = { ...DEFAULT_RULES, spacecraft: rules, mechanics, maintenance: [], fixed: [] };
  const { candidates } = buildCandidates(windows, bookingRules, span.startMs);
  if (candidates.length > 11 || candidates.length < 2) return null;
  for (const w of windows) {
    const r = w.rules!;
    const got = candidates.filter((c) => c.contactIndex === w.contactIndex).length;
    const want = r.minTrackS === null ? 1 : gridPeriods(w.contact.aosMs, w.contact.losMs, r.minTrackS, r.maxTrackS!, 60);
    const blockedAll = w.blocked.length > 0 && w.antennaCount === 1;
    if (!blockedAll) expect(got, `window ${w.contactIndex} candidates`).toBe(want);
  }
  for (const c of candidates) {
    if (!mechanics.has(c.stationId)) continue;
    c.startPointing = { azimuthDeg: rnd() * 360, elevationDeg: rnd() * 80 };
    c.endPointing = { azimuthDeg: rnd() * 360, elevationDeg: rnd() * 80 };
  }
  const recorder = rnd() < 0.5 ? { id: pick(sc), capacityBits: 2e8 + rnd() * 4e8, generationBps: 5e4 + rnd() * 2e5, initialFillBits: rnd() * 3e8 } : null;
  return { cands: candidates, ctx: { setupMs: new Map([...setupS].map(([k, v]) => [k, v * 1000])), mechanics, oneStationAtATime: rnd() < 0.3 }, rules, recorder };
}

describe('booking MIP = brute force on small random cases', () => {
  it('60 cases: same optimum, feasible solution; greedy never above it', async () => {
    let checked = 0;
    let withRows = 0;
    for (let seed = 1; checked < 60 && seed < 2000; seed++) {
      const cs = randomCase(seed);
      if (!cs) continue;
      const { cands, ctx, rules } = cs;
      const scIds = [...new Set(cands.map((c) => c.spacecraftId))];
      const rows = requirementRows(cands, rules, span, scIds);
      const recs = cs.recorder && scIds.includes(cs.recorder.id)
        ? [recorderModel(cands, cands.map((_, i) => i).filter((i) => cands[i]!.spacecraftId === cs.recorder!.id), { ...cs.recorder }, span, cands.find((c) => c.spacecraftId === cs.recorder!.id)!.priority, cs.recorder.id)]
        : [];
      const hard = hardWeight(cands);
      const score = (set: Set<number>) => evaluateObjective(cands, set, rows, recs, hard).objective;
      const best = bruteForce(cands, ctx, score);
      const mip = await solveMip({ cands, rows, recorders: recs, hard, ctx, timeLimitS: 30, mipRelGap: 0 });
      expect(mip.status).toBe('optimal');
      // the MIP's choice obeys every rule
      const chosen = [...mip.chosen];
      for (let i = 0; i < chosen.length; i++) {
        for (let j = i + 1; j < chosen.length; j++) {
          const [ti, ai] = chosen[i]!;
          const [tj, aj] = chosen[j]!;
          expect(spacecraftConflict(cands[ti]!, cands[tj]!, ctx)).toBe(false);
          if (ai === aj && cands[ti]!.stationId === cands[tj]!.stationId) expect(antennaCompatible(cands[ti]!, cands[tj]!, ctx)).toBe(true);
        }
      }
      const got = score(new Set(mip.chosen.keys()));
      expect(Math.abs(got - best), `seed ${seed}`).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(best)));
      expect(Math.abs(mip.objective - best)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(best)));
      const greedy = score(new Set(solveGreedy(cands, rows, hard, ctx).keys()));
      expect(greedy).toBeLessThanOrEqual(best + 1e-9);
      if (rows.length > 0) withRows++;
      checked++;
    }
    expect(checked).toBe(60);
    expect(withRows).toBeGreaterThan(20);
  }, 120_000);
});

describe('fast cumulative drain', () => {
  // CumulativeDrain.at (binary search) against recorder.ts cumulativeDrainBits (a plain sum) at many times
  it('equals the plain sum everywhere', async () => {
    const { CumulativeDrain } = await import('../../../src/plan/booking/candidates.js');
    const { cumulativeDrainBits, drainProfile } = await import('../../../src/plan/recorder.js');
    const rnd = mulberry32(7);
    for (let k = 0; k < 20; k++) {
      const aos = T0 + Math.floor(rnd() * 3600) * 1000;
      const c = contact('X', 'A', aos, aos + Math.floor(600 + rnd() * 7200) * 1000, Math.floor(1e5 + rnd() * 1e7));
      const prof = drainProfile(c.link!);
      const fast = new CumulativeDrain(prof);
      for (let t = aos - 5000; t < c.losMs + 5000; t += 7919) expect(fast.at(t)).toBe(cumulativeDrainBits(prof, t));
      expect(fast.at(c.losMs)).toBe(c.link!.volumeBits);
    }
  });
});
