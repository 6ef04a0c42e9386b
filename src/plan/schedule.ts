/**
 * Antenna deconfliction: which contact windows a ground network can actually
 * take when windows of several spacecraft overlap at a station.
 *
 * Model. A station has `antennaCount` identical antennas. One antenna serves
 * one contact at a time, whole (AOS..LOS), and needs `setupTimeS` between the
 * LOS of one contact and the AOS of the next: contact j may follow contact i
 * on the same antenna when los_i + setup <= aos_j. So each contact occupies
 * its antenna over the half-open interval [aos, los + setup).
 *
 * Objective. Maximise the sum of weights of the contacts taken, with
 *   weight = spacecraft priority x contact volumeBits
 * (the priority-weighted delivered volume). A contact of weight 0 (no link,
 * no volume, or priority 0) is never taken.
 *
 * Methods and guarantees (per station, exact):
 *  - no conflict (the most contacts in progress at any instant, setup
 *    included, is <= antennaCount): every contact is taken; antennas are
 *    assigned greedily by AOS (interval-graph colouring: an interval graph's
 *    chromatic number equals its largest clique, Golumbic, "Algorithmic Graph
 *    Theory and Perfect Graphs", 1980, ch. 8; from memory).
 *  - one antenna: weighted interval scheduling by dynamic programming (sort by
 *    the end of the occupied interval, binary search for the latest
 *    compatible contact): exact optimum, O(n log n).
 *  - k > 1 antennas: the min-cost-flow formulation of k-track interval
 *    scheduling (time points as nodes, a chain of capacity k at cost 0, one
 *    arc of capacity 1 and cost -weight per contact from its AOS to its
 *    LOS + setup; k units from first to last point). Exact for identical
 *    machines (Arkin and Silverberg, "Scheduling jobs with fixed start and end
 *    times", Discrete Applied Mathematics 18 (1987) 1-8; from memory). Solved
 *    by successive shortest paths with Dijkstra on reduced costs (the graph is
 *    a DAG, so the first potentials come from one pass in time order).
 *
 * Cross-station rule (option `oneStationAtATime`: a spacecraft downlinks to
 * one station at a time). A heuristic, not an optimum: schedule every
 * station exactly; then, for each spacecraft, walk its taken windows by
 * descending weight and keep a window only if it does not overlap (AOS..LOS)
 * one already kept; the others are dropped for good (reason "one-station",
 * naming the kept window). Stations that lost a window are rescheduled
 * without the dropped ones (freed antenna time may admit other windows), and
 * the loop repeats until no spacecraft is at two stations at once. Each round
 * drops at least one window, so it ends within n rounds. Guarantees: the
 * result respects antennas, setup times and the one-station rule; each
 * station's schedule is optimal for the windows left to it; the total is not
 * claimed optimal for the joint problem (whose conflict graph is no longer an
 * interval graph).
 *
 * Pure: no I/O, the plan is not modified.
 */
import type { Spacecraft, Station } from '../scenario/types.js';
import type { Contact, PlanResult } from './types.js';

/** One job for the exact solvers: a contact reduced to its times and weight. */
export interface Job {
  startMs: number;
  endMs: number;
  weight: number;
}

export interface ScheduleOptions {
  /** A spacecraft downlinks to one station at a time (cross-station heuristic above). */
  oneStationAtATime?: boolean;
}

export const WEIGHT_RULE = 'weight = spacecraft priority x contact volume (bits); a window of weight 0 is not taken';

/** A contact named for messages: index into plan.contacts plus who, where and when. */
export interface ContactRef {
  contactIndex: number;
  spacecraftId: string;
  stationId: string;
  aosMs: number;
  losMs: number;
}

export type LostReason =
  /** Antennas busy: the window overlaps these taken windows at the same station. */
  | { kind: 'overlap'; with: ContactRef[] }
  /** No overlap, but the station's setup time between contacts is not available. */
  | { kind: 'setup'; with: ContactRef[]; setupTimeS: number }
  /** Dropped by the one-station rule: the spacecraft is downlinking to this window at another station. */
  | { kind: 'one-station'; with: ContactRef }
  /** Weight 0: no link result, zero volume or priority 0. */
  | { kind: 'no-data' };

export interface TakenWindow {
  contactIndex: number;
  /** Antenna index at the station, 0-based. */
  antenna: number;
  weight: number;
  volumeBits: number;
}

export interface LostWindow {
  contactIndex: number;
  reason: LostReason;
  volumeBits: number;
}

export type StationMethod = 'no-conflict' | 'dp-one-antenna' | 'min-cost-flow';

export interface StationSchedule {
  stationId: string;
  antennaCount: number;
  setupTimeS: number;
  method: StationMethod;
  offered: number;
  taken: number;
  /** Sum of weights taken at this station. */
  weight: number;
}

export interface SpacecraftLoss {
  spacecraftId: string;
  priority: number;
  offeredBits: number;
  deliveredBits: number;
  /** Volume of the windows lost to conflicts (antennas, setup, one-station rule). */
  lostBits: number;
  takenWindows: number;
  lostWindows: number;
}

export interface ScheduleResult {
  weightRule: string;
  oneStationAtATime: boolean;
  /** Rounds of the cross-station loop (1 without the rule). */
  rounds: number;
  /** Taken windows, in plan.contacts order. */
  taken: TakenWindow[];
  /** Lost windows, in plan.contacts order. */
  lost: LostWindow[];
  stations: StationSchedule[];
  spacecraft: SpacecraftLoss[];
  totalWeight: number;
}

// ---------------------------------------------------------------- exact solvers

/** Index of the last element of the sorted `ends` that is <= t, or -1. */
function lastAtOrBefore(ends: readonly number[], t: number): number {
  let lo = 0;
  let hi = ends.length - 1;
  let ans = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (ends[mid]! <= t) {
      ans = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  return ans;
}

/**
 * One antenna: the exact maximum-weight set of jobs with endMs + setupMs <=
 * next startMs. Returns the chosen job indices in time order.
 */
export function scheduleOneAntenna(jobs: readonly Job[], setupMs: number): number[] {
  const order = jobs.map((_, i) => i).filter((i) => jobs[i]!.weight > 0);
  order.sort((a, b) => jobs[a]!.endMs - jobs[b]!.endMs || jobs[a]!.startMs - jobs[b]!.startMs || a - b);
  const n = order.length;
  // occupied interval ends (end + setup), ascending with the sort
  const ends = order.map((i) => jobs[i]!.endMs + setupMs);
  const best = new Float64Array(n + 1); // best[m]: optimum over the first m jobs
  const take = new Uint8Array(n + 1);
  const prev = new Int32Array(n + 1);
  for (let m = 1; m <= n; m++) {
    const j = jobs[order[m - 1]!]!;
    const p = lastAtOrBefore(ends, j.startMs) + 1; // compatible prefix length (p < m since setup >= 0, end > start)
    const withJ = j.weight + best[Math.min(p, m - 1)]!;
    prev[m] = Math.min(p, m - 1);
    if (withJ > best[m - 1]!) {
      best[m] = withJ;
      take[m] = 1;
    } else {
      best[m] = best[m - 1]!;
      take[m] = 0;
    }
  }
  const chosen: number[] = [];
  for (let m = n; m > 0; ) {
    if (take[m]) {
      chosen.push(order[m - 1]!);
      m = prev[m]!;
    } else m--;
  }
  return chosen.reverse();
}

/** Largest number of jobs in progress at one instant, each occupying [start, end + setup). */
export function maxDepth(jobs: readonly Job[], setupMs: number): number {
  const ev: [number, number][] = [];
  for (const j of jobs) {
    ev.push([j.startMs, 1], [j.endMs + setupMs, -1]);
  }
  ev.sort((a, b) => a[0] - b[0] || a[1] - b[1]); // a leave before an arrive at the same instant
  let d = 0;
  let m = 0;
  for (const [, s] of ev) {
    d += s;
    if (d > m) m = d;
  }
  return m;
}

/** Antenna for each chosen job (greedy by start: valid whenever the depth is <= k). */
function assignAntennas(jobs: readonly Job[], chosen: readonly number[], setupMs: number, k: number): Map<number, number> {
  const sorted = [...chosen].sort((a, b) => jobs[a]!.startMs - jobs[b]!.startMs || a - b);
  const freeAt = new Array<number>(k).fill(-Infinity);
  const out = new Map<number, number>();
  for (const i of sorted) {
    const j = jobs[i]!;
    let a = -1;
    for (let x = 0; x < k; x++) {
      if (freeAt[x]! <= j.startMs) {
        a = x;
        break;
      }
    }
    if (a < 0) throw new Error('assignAntennas: more jobs in progress than antennas (bug)');
    freeAt[a] = j.endMs + setupMs;
    out.set(i, a);
  }
  return out;
}

/** Binary min-heap of (key, node) for Dijkstra. */
class Heap {
  private keys: number[] = [];
  private nodes: number[] = [];
  get size(): number {
    return this.keys.length;
  }
  push(key: number, node: number): void {
    const k = this.keys;
    const n = this.nodes;
    k.push(key);
    n.push(node);
    let i = k.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (k[p]! <= k[i]!) break;
      [k[p], k[i]] = [k[i]!, k[p]!];
      [n[p], n[i]] = [n[i]!, n[p]!];
      i = p;
    }
  }
  pop(): [number, number] {
    const k = this.keys;
    const n = this.nodes;
    const top: [number, number] = [k[0]!, n[0]!];
    const lk = k.pop()!;
    const ln = n.pop()!;
    if (k.length > 0) {
      k[0] = lk;
      n[0] = ln;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < k.length && k[l]! < k[m]!) m = l;
        if (r < k.length && k[r]! < k[m]!) m = r;
        if (m === i) break;
        [k[m], k[i]] = [k[i]!, k[m]!];
        [n[m], n[i]] = [n[i]!, n[m]!];
        i = m;
      }
    }
    return top;
  }
}

/**
 * k identical antennas: the exact maximum-weight feasible set by min-cost flow
 * (see the head comment). Returns the chosen job indices with their antenna.
 */
export function scheduleAntennas(jobs: readonly Job[], antennaCount: number, setupMs: number): Map<number, number> {
  const k = antennaCount;
  const positive = jobs.map((_, i) => i).filter((i) => jobs[i]!.weight > 0);
  if (positive.length === 0) return new Map();
  const sub = positive.map((i) => jobs[i]!);
  if (maxDepth(sub, setupMs) <= k) return assignAntennas(jobs, positive, setupMs, k);
  if (k === 1) return assignAntennas(jobs, scheduleOneAntenna(jobs, setupMs), setupMs, 1);

  // Nodes: sorted distinct time points.
  const times = [...new Set(sub.flatMap((j) => [j.startMs, j.endMs + setupMs]))].sort((a, b) => a - b);
  const nodeOf = new Map(times.map((t, i) => [t, i]));
  const V = times.length;
  // Arcs in forward/backward pairs: arc e and e^1.
  const head: number[] = [];
  const cap: number[] = [];
  const cost: number[] = [];
  const adj: number[][] = Array.from({ length: V }, () => []);
  const jobArc: number[] = []; // per positive job: its forward arc
  const addArc = (u: number, v: number, c: number, w: number): number => {
    const e = head.length;
    head.push(v, u);
    cap.push(c, 0);
    cost.push(w, -w);
    adj[u]!.push(e);
    adj[v]!.push(e + 1);
    return e;
  };
  for (let i = 0; i + 1 < V; i++) addArc(i, i + 1, k, 0);
  // Normalised weights keep the float sums well inside double precision.
  const wMax = Math.max(...sub.map((j) => j.weight));
  for (const j of sub) jobArc.push(addArc(nodeOf.get(j.startMs)!, nodeOf.get(j.endMs + setupMs)!, 1, -j.weight / wMax));

  // Potentials: shortest distances from node 0 in the DAG (all arcs go forward in time).
  const pot = new Float64Array(V).fill(Infinity);
  pot[0] = 0;
  for (let u = 0; u < V; u++) {
    if (pot[u] === Infinity) continue;
    for (const e of adj[u]!) {
      if (cap[e]! > 0 && e % 2 === 0) {
        const v = head[e]!;
        const d = pot[u]! + cost[e]!;
        if (d < pot[v]!) pot[v] = d;
      }
    }
  }
  const dist = new Float64Array(V);
  const via = new Int32Array(V);
  let sent = 0;
  while (sent < k) {
    dist.fill(Infinity);
    via.fill(-1);
    dist[0] = 0;
    const heap = new Heap();
    heap.push(0, 0);
    while (heap.size > 0) {
      const [d, u] = heap.pop();
      if (d > dist[u]!) continue;
      for (const e of adj[u]!) {
        if (cap[e]! <= 0) continue;
        const v = head[e]!;
        // reduced cost >= 0 up to rounding; clamp the rounding away
        const rc = Math.max(0, cost[e]! + pot[u]! - pot[v]!);
        const nd = d + rc;
        if (nd < dist[v]!) {
          dist[v] = nd;
          via[v] = e;
          heap.push(nd, v);
        }
      }
    }
    const sink = V - 1;
    if (dist[sink] === Infinity) break;
    for (let v = 0; v < V; v++) if (dist[v]! < Infinity) pot[v]! += dist[v]!;
    // bottleneck along the path
    let push = k - sent;
    for (let v = sink; v !== 0; v = head[via[v]! ^ 1]!) push = Math.min(push, cap[via[v]!]!);
    for (let v = sink; v !== 0; v = head[via[v]! ^ 1]!) {
      cap[via[v]!]! -= push;
      cap[via[v]! ^ 1]! += push;
    }
    sent += push;
  }
  const chosen: number[] = [];
  positive.forEach((i, s) => {
    if (cap[jobArc[s]!] === 0) chosen.push(i);
  });
  return assignAntennas(jobs, chosen, setupMs, k);
}

// ---------------------------------------------------------------- network schedule

function refOf(plan: PlanResult, i: number): ContactRef {
  const c = plan.contacts[i]!;
  return { contactIndex: i, spacecraftId: c.spacecraftId, stationId: c.stationId, aosMs: c.aosMs, losMs: c.losMs };
}

const volumeOf = (c: Contact): number => c.link?.volumeBits ?? 0;

interface StationRun {
  method: StationMethod;
  /** contact index -> antenna */
  taken: Map<number, number>;
}

function scheduleStation(plan: PlanResult, indices: readonly number[], weights: readonly number[], station: Station): StationRun {
  const setupMs = station.setupTimeS * 1000;
  const jobs: Job[] = indices.map((i) => ({ startMs: plan.contacts[i]!.aosMs, endMs: plan.contacts[i]!.losMs, weight: weights[i]! }));
  const positive = jobs.filter((j) => j.weight > 0);
  const method: StationMethod =
    maxDepth(positive, setupMs) <= station.antennaCount ? 'no-conflict' : station.antennaCount === 1 ? 'dp-one-antenna' : 'min-cost-flow';
  const chosen = scheduleAntennas(jobs, station.antennaCount, setupMs);
  const taken = new Map<number, number>();
  for (const [j, a] of chosen) taken.set(indices[j]!, a);
  return { method, taken };
}

/** Why a window of positive weight was not taken at its station. */
function stationReason(plan: PlanResult, i: number, takenHere: readonly number[], station: Station): LostReason {
  const c = plan.contacts[i]!;
  const setupMs = station.setupTimeS * 1000;
  const overlap: ContactRef[] = [];
  const setup: ContactRef[] = [];
  for (const t of takenHere) {
    const o = plan.contacts[t]!;
    if (o.aosMs < c.losMs && c.aosMs < o.losMs) overlap.push(refOf(plan, t));
    else if (o.aosMs < c.losMs + setupMs && c.aosMs < o.losMs + setupMs) setup.push(refOf(plan, t));
  }
  if (overlap.length > 0) return { kind: 'overlap', with: overlap };
  return { kind: 'setup', with: setup, setupTimeS: station.setupTimeS };
}

/**
 * Schedules every station's antennas over the plan's contacts (see the head
 * comment for the weight, the methods and what each guarantees).
 */
export function scheduleContacts(
  plan: PlanResult,
  stations: readonly Station[],
  spacecraft: readonly Pick<Spacecraft, 'id' | 'priority'>[],
  opts: ScheduleOptions = {},
): ScheduleResult {
  const priority = new Map(spacecraft.map((s) => [s.id, s.priority]));
  for (const s of plan.spacecraft) if (!priority.has(s.id)) priority.set(s.id, s.priority);
  const weights = plan.contacts.map((c) => (priority.get(c.spacecraftId) ?? 0) * volumeOf(c));
  const stationById = new Map(stations.map((s) => [s.id, s]));
  const byStation = new Map<string, number[]>();
  plan.contacts.forEach((c, i) => {
    if (!stationById.has(c.stationId)) throw new Error(`scheduleContacts: contact at unknown station ${c.stationId}`);
    const l = byStation.get(c.stationId) ?? [];
    l.push(i);
    byStation.set(c.stationId, l);
  });

  const dropped = new Map<number, LostReason>(); // one-station drops, final
  const runs = new Map<string, StationRun>();
  let dirty = new Set(byStation.keys());
  let rounds = 0;
  for (;;) {
    rounds++;
    for (const id of dirty) {
      const idx = (byStation.get(id) ?? []).filter((i) => !dropped.has(i));
      runs.set(id, scheduleStation(plan, idx, weights, stationById.get(id)!));
    }
    dirty = new Set();
    if (!opts.oneStationAtATime) break;
    // per spacecraft: keep by descending weight, drop what overlaps a kept window
    const takenBySc = new Map<string, number[]>();
    for (const run of runs.values()) {
      for (const i of run.taken.keys()) {
        const sc = plan.contacts[i]!.spacecraftId;
        const l = takenBySc.get(sc) ?? [];
        l.push(i);
        takenBySc.set(sc, l);
      }
    }
    for (const list of takenBySc.values()) {
      list.sort((a, b) => weights[b]! - weights[a]! || plan.contacts[a]!.aosMs - plan.contacts[b]!.aosMs || a - b);
      const kept: number[] = [];
      for (const i of list) {
        const c = plan.contacts[i]!;
        const clash = kept.find((k) => {
          const o = plan.contacts[k]!;
          return o.stationId !== c.stationId && o.aosMs < c.losMs && c.aosMs < o.losMs;
        });
        if (clash === undefined) kept.push(i);
        else {
          dropped.set(i, { kind: 'one-station', with: refOf(plan, clash) });
          dirty.add(c.stationId);
        }
      }
    }
    if (dirty.size === 0) break;
  }

  const antennaOf = new Map<number, number>();
  for (const run of runs.values()) for (const [i, a] of run.taken) antennaOf.set(i, a);
  const takenAt = new Map<string, number[]>();
  for (const [id, run] of runs) takenAt.set(id, [...run.taken.keys()]);

  const taken: TakenWindow[] = [];
  const lost: LostWindow[] = [];
  plan.contacts.forEach((c, i) => {
    const a = antennaOf.get(i);
    if (a !== undefined) {
      taken.push({ contactIndex: i, antenna: a, weight: weights[i]!, volumeBits: volumeOf(c) });
      return;
    }
    let reason: LostReason;
    if (!(weights[i]! > 0)) reason = { kind: 'no-data' };
    else reason = dropped.get(i) ?? stationReason(plan, i, takenAt.get(c.stationId) ?? [], stationById.get(c.stationId)!);
    lost.push({ contactIndex: i, reason, volumeBits: volumeOf(c) });
  });

  const stationRows: StationSchedule[] = [];
  for (const st of stations) {
    const idx = byStation.get(st.id) ?? [];
    const run = runs.get(st.id);
    stationRows.push({
      stationId: st.id,
      antennaCount: st.antennaCount,
      setupTimeS: st.setupTimeS,
      method: run?.method ?? 'no-conflict',
      offered: idx.length,
      taken: run?.taken.size ?? 0,
      weight: [...(run?.taken.keys() ?? [])].reduce((s, i) => s + weights[i]!, 0),
    });
  }
  const scIds = [...new Set([...plan.spacecraft.map((s) => s.id), ...plan.contacts.map((c) => c.spacecraftId)])];
  const scRows: SpacecraftLoss[] = scIds.map((id) => ({
    spacecraftId: id,
    priority: priority.get(id) ?? 0,
    offeredBits: 0,
    deliveredBits: 0,
    lostBits: 0,
    takenWindows: 0,
    lostWindows: 0,
  }));
  const scRow = new Map(scRows.map((r) => [r.spacecraftId, r]));
  for (const t of taken) {
    const r = scRow.get(plan.contacts[t.contactIndex]!.spacecraftId)!;
    r.offeredBits += t.volumeBits;
    r.deliveredBits += t.volumeBits;
    r.takenWindows++;
  }
  for (const l of lost) {
    const r = scRow.get(plan.contacts[l.contactIndex]!.spacecraftId)!;
    r.offeredBits += l.volumeBits;
    if (l.reason.kind !== 'no-data') {
      r.lostBits += l.volumeBits;
      r.lostWindows++;
    }
  }
  return {
    weightRule: WEIGHT_RULE,
    oneStationAtATime: Boolean(opts.oneStationAtATime),
    rounds,
    taken,
    lost,
    stations: stationRows,
    spacecraft: scRows,
    totalWeight: taken.reduce((s, t) => s + t.weight, 0),
  };
}

/** The plan as the schedule leaves it: only the taken windows (renderers and totals then follow the schedule). */
export function scheduledPlan(plan: PlanResult, schedule: ScheduleResult): PlanResult {
  const keep = new Set(schedule.taken.map((t) => t.contactIndex));
  return { ...plan, contacts: plan.contacts.filter((_, i) => keep.has(i)) };
}
