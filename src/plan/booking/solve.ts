/**
 * Network booking: track periods inside the contact windows, chosen to
 * maximise the objective of objective.ts under the rules of conflicts.ts.
 *
 * Decomposition: windows are joined into components when they can interact:
 * windows at one station whose [AOS - reach, LOS + reach] overlap (reach =
 * set-up + the largest slew), all windows of a spacecraft with requirements
 * or a recorder model, and (oneStationAtATime) overlapping windows of one
 * spacecraft. Components share nothing, so solving each one to optimality
 * solves the whole problem to optimality. Per component:
 *  - 'whole-window exact (existing)': whole windows, one station, no
 *    mechanics, no rows, no blocked antenna: plan/schedule.ts
 *    scheduleAntennas (no conflict / one-antenna DP / min-cost flow), exact;
 *  - 'highs-mip': up to mipMaxVariables binaries: the MIP of mip.ts within
 *    the time limit and relative gap;
 *  - 'greedy': larger components (greedy.ts), with the gap against an upper
 *    bound: the smaller of (A) the sum over stations of the smaller of two
 *    relaxations, the exact optimum of the candidates on its antennas with
 *    set-up but without slews, spacecraft rules, requirements or blocked
 *    antennas, and the sum over its windows of each window's best set of
 *    non-overlapping tracks alone; and (B) the sum over spacecraft of those
 *    window bests, capped for a spacecraft with a recorder model at priority
 *    x (fill + data generated over the span); and (C) the first relaxation of
 *    (A) over the spacecraft without a recorder model alone plus the caps of
 *    (B) for the others. Every feasible booking is
 *    feasible in each relaxation; recorder-aware value is at most the link
 *    value and penalties only lower the objective.
 * Deterministic: windows, candidates and components are built in plan order
 * and HiGHS runs single-threaded with a fixed seed.
 */
import { makeSite } from '../../geometry/earth.js';
import type { Scenario, Span } from '../../scenario/types.js';
import { makeTarget } from '../contacts.js';
import { scheduleAntennas, type Job } from '../schedule.js';
import { onTimeS, type DrainSegment } from '../recorder.js';
import type { PlanResult } from '../types.js';
import { buildCandidates, type WindowInput } from './candidates.js';
import { maxSlewS, slewBetweenS, type ConflictContext } from './conflicts.js';
import { solveGreedy } from './greedy.js';
import { lostTracking, overlapMs, type Intervals } from './mechanics.js';
import { solveMip } from './mip.js';
import { evaluateObjective, hardWeight, recorderModel, requirementRows, type RecorderModel, type RequirementRow } from './objective.js';
import { samplePointing, type PointingSeries } from './pointing.js';
import type { BookedTrack, BookingRules, Candidate, ComponentRun, RequirementOutcome, SolverName } from './types.js';

export interface MechanicsLoss {
  contactIndex: number;
  lostS: number;
}

export interface BookingResult {
  gridS: number;
  coarsestStepS: number;
  tracks: BookedTrack[];
  /** Drain profile of each booked track (same order). */
  profiles: DrainSegment[][];
  components: ComponentRun[];
  requirements: RequirementOutcome[];
  mechanics: MechanicsLoss[];
  objective: number;
  bound: number;
  gap: number;
  value: number;
  softPenalty: number;
  missedHard: number;
  timeMs: number;
  timeLimitS: number;
  mipRelGap: number;
}

class UnionFind {
  private p: Int32Array;
  constructor(n: number) {
    this.p = Int32Array.from({ length: n }, (_, i) => i);
  }
  find(x: number): number {
    while (this.p[x] !== x) {
      this.p[x] = this.p[this.p[x]!]!;
      x = this.p[x]!;
    }
    return x;
  }
  union(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.p[Math.max(ra, rb)] = Math.min(ra, rb);
  }
}

/** Pointing series and tracking lost for every contact at a station with mechanics. */
function mechanicsOf(plan: PlanResult, scenario: Scenario, rules: BookingRules, span: Span): Map<number, { lost: Intervals; pointing: PointingSeries }> {
  const out = new Map<number, { lost: Intervals; pointing: PointingSeries }>();
  if (rules.mechanics.size === 0) return out;
  const targets = new Map(scenario.spacecraft.map((s) => [s.id, makeTarget(s, span)]));
  const sites = new Map(scenario.stations.map((s) => [s.id, makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm)]));
  plan.contacts.forEach((c, i) => {
    const m = rules.mechanics.get(c.stationId);
    const target = targets.get(c.spacecraftId);
    const site = sites.get(c.stationId);
    if (!m || !target || !site || !c.link) return;
    const pointing = samplePointing(target, site, c.aosMs, c.losMs, m);
    out.set(i, { pointing, lost: lostTracking(pointing.tMs, pointing.azimuthDeg, pointing.elevationDeg, m) });
  });
  return out;
}

/** Exact optimum of whole-track jobs per station with set-up only (the greedy's upper bound, and the plain exact case). */
function stationExact(cands: readonly Candidate[], members: readonly number[], antennaCount: number, setupMs: number): Map<number, number> {
  const jobs: Job[] = members.map((t) => ({ startMs: cands[t]!.startMs, endMs: cands[t]!.endMs, weight: cands[t]!.value }));
  const out = new Map<number, number>();
  for (const [j, a] of scheduleAntennas(jobs, antennaCount, setupMs)) out.set(members[j]!, a);
  return out;
}

/** Why a requirement row was missed: what the spacecraft's own candidates allow that day, ignoring everyone else. */
function missReason(row: RequirementRow, cands: readonly Candidate[]): string {
  const kind = row.requirement.kind;
  if (row.members.length === 0) {
    return kind === 'maxGapH'
      ? `no window of ${row.spacecraftId} at an allowed station meets ${row.period} + ${row.requirement.value} h`
      : `no window of ${row.spacecraftId} at an allowed station starts on ${row.period} (with the track length, maintenance and fixed bookings)`;
  }
  // what the windows alone allow, ignoring every other spacecraft
  const list = [...row.members].sort((a, b) => cands[a]!.endMs - cands[b]!.endMs || a - b);
  if (kind === 'tracksPerDay') {
    let n = 0;
    let end = -Infinity;
    for (const t of list) {
      if (cands[t]!.startMs >= end) {
        n++;
        end = cands[t]!.endMs;
      }
    }
    if (n < row.needed) return `only ${n} track(s) of the allowed length fit in ${row.spacecraftId}'s windows on ${row.period}`;
  } else if (kind === 'minutesPerDay') {
    const iv = [...row.members].map((t) => [cands[t]!.startMs, cands[t]!.endMs] as [number, number]).sort((a, b) => a[0] - b[0]);
    let total = 0;
    let cs = -Infinity;
    let ce = -Infinity;
    for (const [s, e] of iv) {
      if (s > ce) {
        total += Math.max(0, ce - cs);
        cs = s;
        ce = e;
      } else ce = Math.max(ce, e);
    }
    total += Math.max(0, ce - cs);
    if (total / 60000 < row.needed) return `${row.spacecraftId}'s windows starting on ${row.period} hold ${(total / 60000).toFixed(0)} min, fewer than ${row.needed}`;
  } else if (kind === 'volumePerDayGbit') {
    const best = new Map<number, number>();
    for (const t of row.members) best.set(cands[t]!.contactIndex, Math.max(best.get(cands[t]!.contactIndex) ?? 0, cands[t]!.bits));
    const total = [...best.values()].reduce((s, b) => s + b, 0) / 1e9;
    if (total < row.needed) return `${row.spacecraftId}'s windows starting on ${row.period} carry ${total.toFixed(2)} Gbit, less than ${row.needed}`;
  }
  return 'the windows allow it, but the antennas are taken by tracks of more value or by other requirements';
}

export async function bookNetwork(plan: PlanResult, scenario: Scenario, rules: BookingRules): Promise<BookingResult> {
  const t0 = performance.now();
  const span = plan.span;
  const stationById = new Map(scenario.stations.map((s) => [s.id, s]));
  const scById = new Map(scenario.spacecraft.map((s) => [s.id, s]));
  const mech = mechanicsOf(plan, scenario, rules, span);
  const ctx: ConflictContext = {
    setupMs: new Map(scenario.stations.map((s) => [s.id, s.setupTimeS * 1000])),
    mechanics: rules.mechanics,
    oneStationAtATime: rules.oneStationAtATime,
  };
  // station events and blocked antennas
  const events = new Map<string, number[]>();
  for (const c of plan.contacts) {
    const l = events.get(c.stationId) ?? [];
    l.push(c.aosMs, c.losMs);
    events.set(c.stationId, l);
  }
  const blocked = new Map<string, number[]>();
  for (const m of rules.maintenance) (blocked.get(m.stationId) ?? blocked.set(m.stationId, []).get(m.stationId)!).push(m.startMs, m.endMs, m.antenna ?? -1);
  for (const f of rules.fixed) (blocked.get(f.stationId) ?? blocked.set(f.stationId, []).get(f.stationId)!).push(f.startMs, f.endMs, f.antenna);
  // maintenance and fixed bookings are events too: long windows get track edges beside them
  for (const [st, b] of blocked) for (let i = 0; i + 2 < b.length; i += 3) (events.get(st) ?? events.set(st, []).get(st)!).push(b[i]!, b[i + 1]!);

  const windows: WindowInput[] = plan.contacts.map((c, i) => {
    const st = stationById.get(c.stationId)!;
    const sc = scById.get(c.spacecraftId);
    const m = mech.get(i);
    return {
      contactIndex: i,
      contact: c,
      priority: sc?.priority ?? 0,
      rules: rules.spacecraft.get(c.spacecraftId),
      antennaCount: st.antennaCount,
      setupS: st.setupTimeS,
      lost: m?.lost ?? [],
      pointing: m?.pointing ?? null,
      stationEvents: events.get(c.stationId) ?? [],
      blocked: blocked.get(c.stationId) ?? [],
    };
  });
  const { candidates: all, profiles: allProfiles, coarsestStepS } = buildCandidates(windows, rules, span.startMs);

  const recorderSc = new Set(scenario.spacecraft.filter((s) => s.recorder && rules.recorderAware && (s.priority ?? 0) > 0).map((s) => s.id));
  const coupled = (id: string) => recorderSc.has(id) || (rules.spacecraft.get(id)?.requirements.length ?? 0) > 0;

  // components over contacts with candidates
  const n = plan.contacts.length;
  const uf = new UnionFind(n);
  const has = new Uint8Array(n);
  for (const c of all) has[c.contactIndex] = 1;
  const perStation = new Map<string, number[]>();
  const perSc = new Map<string, number[]>();
  for (let i = 0; i < n; i++) {
    if (!has[i]) continue;
    const c = plan.contacts[i]!;
    (perStation.get(c.stationId) ?? perStation.set(c.stationId, []).get(c.stationId)!).push(i);
    (perSc.get(c.spacecraftId) ?? perSc.set(c.spacecraftId, []).get(c.spacecraftId)!).push(i);
  }
  for (const [st, list] of perStation) {
    const reach = (ctx.setupMs.get(st) ?? 0) + maxSlewS(rules.mechanics.get(st)) * 1000;
    list.sort((a, b) => plan.contacts[a]!.aosMs - plan.contacts[b]!.aosMs || a - b);
    let head = -1;
    let end = -Infinity;
    for (const i of list) {
      const c = plan.contacts[i]!;
      if (head >= 0 && c.aosMs < end) uf.union(head, i);
      else head = i;
      end = Math.max(end, c.losMs + reach);
    }
  }
  for (const [sc, list] of perSc) {
    if (coupled(sc)) for (const i of list) uf.union(list[0]!, i);
    else if (rules.oneStationAtATime) {
      const s = [...list].sort((a, b) => plan.contacts[a]!.aosMs - plan.contacts[b]!.aosMs || a - b);
      let end = -Infinity;
      let head = -1;
      for (const i of s) {
        const c = plan.contacts[i]!;
        if (head >= 0 && c.aosMs < end) uf.union(head, i);
        else head = i;
        end = Math.max(end, c.losMs);
      }
    }
  }
  const compOf = new Map<number, number[]>(); // root -> candidate indices into `all`
  all.forEach((c, k) => {
    const r = uf.find(c.contactIndex);
    (compOf.get(r) ?? compOf.set(r, []).get(r)!).push(k);
  });
  const roots = [...compOf.keys()].sort((a, b) => a - b);

  const tracks: BookedTrack[] = [];
  const profiles: DrainSegment[][] = [];
  const components: ComponentRun[] = [];
  const requirements: RequirementOutcome[] = [];
  const seenSc = new Set<string>();
  let objective = 0;
  let bound = 0;
  let value = 0;
  let softPenalty = 0;
  let missedHard = 0;
  const deadline = t0 + rules.timeLimitS * 1000;

  const finish = (cands: Candidate[], globalIdx: number[], rows: RequirementRow[], recs: RecorderModel[], hard: number, chosen: Map<number, number>, run: Omit<ComponentRun, 'objective' | 'timeMs' | 'bound' | 'gap'> & { bound?: number }, started: number) => {
    const set = new Set(chosen.keys());
    const parts = evaluateObjective(cands, set, rows, recs, hard);
    const b = run.bound ?? parts.objective;
    const gap = Math.abs(b) > 0 ? Math.max(0, (b - parts.objective) / Math.abs(b)) : 0;
    components.push({ ...run, objective: parts.objective, bound: b, gap, timeMs: performance.now() - started });
    objective += parts.objective;
    bound += b;
    value += parts.value;
    softPenalty += parts.softPenalty;
    // tracks, with set-up and slew from the previous track on the antenna
    const byLane = new Map<string, number[]>();
    for (const [t, a] of chosen) (byLane.get(`${cands[t]!.stationId}:${a}`) ?? byLane.set(`${cands[t]!.stationId}:${a}`, []).get(`${cands[t]!.stationId}:${a}`)!).push(t);
    const before = new Map<number, [number, number]>();
    for (const lane of byLane.values()) {
      lane.sort((x, y) => cands[x]!.startMs - cands[y]!.startMs || x - y);
      lane.forEach((t, k) => {
        const slew = k > 0 ? slewBetweenS(cands[lane[k - 1]!]!, cands[t]!, ctx) : 0;
        before.set(t, [(ctx.setupMs.get(cands[t]!.stationId) ?? 0) / 1000 + slew, slew]);
      });
    }
    for (const t of [...chosen.keys()].sort((x, y) => x - y)) {
      const c = cands[t]!;
      const [setupBeforeS, slewBeforeS] = before.get(t)!;
      tracks.push({ candidate: c, antenna: chosen.get(t)!, setupBeforeS, slewBeforeS, modelDeliveredBits: Math.round((parts.delivered.get(t) ?? c.bits / 1e9) * 1e9) });
      profiles.push(allProfiles[globalIdx[t]!]!);
    }
    rows.forEach((row, k) => {
      const achieved = parts.achieved[k]!;
      const shortfall = Math.max(0, row.needed - achieved);
      const met = shortfall <= 1e-9;
      if (!met && row.requirement.hard) missedHard++;
      requirements.push({
        spacecraftId: row.spacecraftId,
        requirement: row.requirement,
        period: row.period,
        needed: row.needed,
        achieved,
        met,
        shortfall,
        penaltyApplied: met ? 0 : row.requirement.hard ? hard * shortfall : row.requirement.penalty * shortfall,
        reason: met ? null : missReason(row, cands),
      });
    });
  };

  for (const root of roots) {
    const started = performance.now();
    const globalIdx = compOf.get(root)!;
    const cands = globalIdx.map((k) => all[k]!);
    const scIds = [...new Set(cands.map((c) => c.spacecraftId))];
    const stIds = [...new Set(cands.map((c) => c.stationId))];
    for (const s of scIds) seenSc.add(s);
    const rows = requirementRows(cands, rules.spacecraft, span, scIds.filter((s) => coupled(s)));
    const candsOf = new Map<string, number[]>();
    cands.forEach((c, i) => (candsOf.get(c.spacecraftId) ?? candsOf.set(c.spacecraftId, []).get(c.spacecraftId)!).push(i));
    const atStation = new Map<string, number[]>();
    cands.forEach((c, i) => (atStation.get(c.stationId) ?? atStation.set(c.stationId, []).get(c.stationId)!).push(i));
    const recs = scIds.filter((s) => recorderSc.has(s)).map((s) => recorderModel(cands, candsOf.get(s)!, scById.get(s)!.recorder!, span, scById.get(s)!.priority, s));
    const hard = hardWeight(cands);
    const base = { stations: stIds, spacecraft: scIds, candidates: cands.length };
    const variables = cands.reduce((s, c) => s + c.antennas.length, 0);
    const st = stationById.get(stIds[0]!)!;
    const plain =
      stIds.length === 1 &&
      rows.length === 0 &&
      recs.length === 0 &&
      !rules.mechanics.has(st.id) &&
      cands.every((c) => c.antennas.length === st.antennaCount && c.startMs === plan.contacts[c.contactIndex]!.aosMs && c.endMs === plan.contacts[c.contactIndex]!.losMs) &&
      new Set(cands.map((c) => c.contactIndex)).size === cands.length;
    let solver: SolverName;
    let chosen: Map<number, number>;
    let extra: { bound?: number; status: string; variables: number };
    if (plain) {
      solver = 'whole-window exact (existing)';
      chosen = stationExact(cands, cands.map((_, i) => i), st.antennaCount, st.setupTimeS * 1000);
      extra = { status: 'optimal', variables };
    } else if (variables <= rules.mipMaxVariables) {
      solver = 'highs-mip';
      const left = Math.max(1, (deadline - performance.now()) / 1000);
      const r = await solveMip({ cands, rows, recorders: recs, hard, ctx, timeLimitS: Math.min(rules.timeLimitS, left), mipRelGap: rules.mipRelGap });
      chosen = r.chosen;
      extra = Number.isFinite(r.bound) ? { status: r.status, variables: r.variables, bound: r.bound } : { status: r.status, variables: r.variables };
    } else {
      solver = 'greedy';
      chosen = solveGreedy(cands, rows, hard, ctx);
      // A: per station; B: per spacecraft (a recorder's spacecraft sends at most fill + generated)
      const windowBest = new Map<number, number>();
      let boundA = 0;
      for (const sid of stIds) {
        const s = stationById.get(sid)!;
        const members = atStation.get(sid)!;
        let flow = 0;
        for (const t of stationExact(cands, members, s.antennaCount, s.setupTimeS * 1000).keys()) flow += cands[t]!.value;
        // each window alone: its tracks never overlap (one spacecraft at one station)
        const byWindow = new Map<number, number[]>();
        for (const t of members) (byWindow.get(cands[t]!.contactIndex) ?? byWindow.set(cands[t]!.contactIndex, []).get(cands[t]!.contactIndex)!).push(t);
        let windows = 0;
        for (const [w, list] of byWindow) {
          let v = 0;
          for (const t of stationExact(cands, list, 1, 0).keys()) v += cands[t]!.value;
          windowBest.set(w, v);
          windows += v;
        }
        boundA += Math.min(flow, windows);
      }
      let boundB = 0;
      let recPart = 0;
      for (const sid of scIds) {
        const ws = new Set(candsOf.get(sid)!.map((t) => cands[t]!.contactIndex));
        let v = 0;
        for (const w of ws) v += windowBest.get(w) ?? 0;
        const rec = recorderSc.has(sid) ? scById.get(sid)!.recorder! : undefined;
        if (rec) {
          v = Math.min(v, (scById.get(sid)!.priority * (rec.initialFillBits + rec.generationBps * onTimeS(span.endMs - span.startMs, rec.duty))) / 1e9);
          recPart += v;
        }
        boundB += v;
      }
      // C: the spacecraft without a recorder model per station (their candidates alone), plus the recorder caps
      let boundC = recPart;
      for (const sid of stIds) {
        const s = stationById.get(sid)!;
        const members = atStation.get(sid)!.filter((t) => !recorderSc.has(cands[t]!.spacecraftId));
        for (const t of stationExact(cands, members, s.antennaCount, s.setupTimeS * 1000).keys()) boundC += cands[t]!.value;
      }
      const ub = Math.min(boundA, boundB, boundC);
      extra = { status: 'heuristic', variables, bound: ub };
    }
    finish(cands, globalIdx, rows, recs, hard, chosen, { solver, ...base, ...extra }, started);
  }
  // spacecraft with requirements and no candidate at all
  for (const [sc, r] of rules.spacecraft) {
    if (seenSc.has(sc) || r.requirements.length === 0) continue;
    const rows = requirementRows([], rules.spacecraft, span, [sc]);
    finish([], [], rows, [], hardWeight([]), new Map(), { solver: 'greedy', stations: [], spacecraft: [sc], candidates: 0, status: 'no candidates', variables: 0 }, performance.now());
  }
  const order = new Map(plan.contacts.map((c, i) => [i, i]));
  const idx = tracks.map((_, i) => i).sort((a, b) => (order.get(tracks[a]!.candidate.contactIndex)! - order.get(tracks[b]!.candidate.contactIndex)!) || tracks[a]!.candidate.startMs - tracks[b]!.candidate.startMs);
  const mechanics: MechanicsLoss[] = [...mech.entries()].map(([contactIndex, m]) => ({ contactIndex, lostS: overlapMs(m.lost, -Infinity, Infinity) / 1000 })).filter((m) => m.lostS > 0);
  return {
    gridS: rules.gridS,
    coarsestStepS,
    tracks: idx.map((i) => tracks[i]!),
    profiles: idx.map((i) => profiles[i]!),
    components,
    requirements,
    mechanics,
    objective,
    bound,
    gap: Math.abs(bound) > 0 ? Math.max(0, (bound - objective) / Math.abs(bound)) : 0,
    value,
    softPenalty,
    missedHard,
    timeMs: performance.now() - t0,
    timeLimitS: rules.timeLimitS,
    mipRelGap: rules.mipRelGap,
  };
}
