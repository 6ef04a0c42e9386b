/**
 * The booking problem of one component as a mixed-integer linear program,
 * solved by HiGHS (the `highs` package: HiGHS compiled to WebAssembly, MIT;
 * Huangfu and Hall, "Parallelizing the dual revised simplex method",
 * Mathematical Programming Computation 10 (2018) 119-142, for the solver).
 *
 * Variables: x[t,a] binary (candidate t on antenna a); per requirement row a
 * shortfall s in [0, needed]; per recorder model d[t] in [0, Gbit of t]
 * (Gbit taken off by t), D[k] and L[k] >= 0 per checkpoint.
 * Objective (objective.ts): max sum value x (spacecraft without a recorder
 * model) + sum priority d - sum penalty s (HARD for a hard row).
 * Rows:
 *  - antenna: for each antenna and each distinct candidate start u, the
 *    candidates on it with start <= u < end + set-up: sum x <= 1 (every
 *    overlapping pair of [start, end + set-up) shares such a point);
 *  - slew: pairs that clear the set-up but not set-up + slew: x + x <= 1;
 *  - spacecraft: at each distinct start u of its candidates (per station,
 *    or network-wide with oneStationAtATime) sum over t covering u and
 *    every antenna of x <= 1 (also: one antenna per candidate);
 *  - requirement: sum coef x + s >= needed;
 *  - recorder: D[k] - D[k-1] - sum d (ending at k) = 0, D + L <= avail,
 *    D + L >= avail - capacity, L[k] - L[k-1] >= 0, d - Gbit x <= 0.
 * Every pairwise rule of conflicts.ts is held, so a solution is feasible by
 * construction, and the optimum is the optimum of objective.ts.
 */
import { antennaCompatible, maxSlewS, type ConflictContext } from './conflicts.js';
import type { RecorderModel, RequirementRow } from './objective.js';
import type { Candidate } from './types.js';

interface HighsModule {
  withModel<R>(src: unknown, op: (m: HighsModel) => R): R;
  constants: { objectiveSense: { maximize: unknown }; variableType: { continuous: number; integer: number } };
  infinity: number;
}
interface HighsModel {
  options: { set(v: Record<string, unknown>): unknown };
  info: { get(name: string): number | bigint };
  run(): { modelStatus: number };
  getSolution(): { colValue: Float64Array };
}

let loaded: Promise<HighsModule> | undefined;
/** The HiGHS module, loaded once. */
export function loadHighs(): Promise<HighsModule> {
  loaded ??= import('highs').then((m) => (m.default as unknown as () => Promise<HighsModule>)());
  return loaded;
}

export interface MipInput {
  cands: readonly Candidate[];
  rows: readonly RequirementRow[];
  recorders: readonly RecorderModel[];
  hard: number;
  ctx: ConflictContext;
  timeLimitS: number;
  mipRelGap: number;
}

export interface MipOutput {
  /** Candidate index -> antenna. */
  chosen: Map<number, number>;
  objective: number;
  bound: number;
  gap: number;
  status: string;
  variables: number;
}

const STATUS: Record<number, string> = { 7: 'optimal', 8: 'infeasible', 13: 'time limit reached', 14: 'iteration limit reached', 15: 'interrupted', 16: 'solution limit' };

/** Variable index of x[t,a] and the antenna of each x column, built in candidate order. */
export function xColumns(cands: readonly Candidate[]): { col: Map<string, number>; of: [number, number][] } {
  const col = new Map<string, number>();
  const of: [number, number][] = [];
  cands.forEach((c, t) => {
    for (const a of c.antennas) {
      col.set(`${t}:${a}`, of.length);
      of.push([t, a]);
    }
  });
  return { col, of };
}

/** For each distinct start u: the candidates with start <= u < end + reach (sweep in start order). */
function cliqueGroups(members: readonly number[], cands: readonly Candidate[], reachMs: number): number[][] {
  const sorted = [...members].sort((a, b) => cands[a]!.startMs - cands[b]!.startMs || a - b);
  const groups: number[][] = [];
  let active: number[] = [];
  for (let k = 0; k < sorted.length; ) {
    const u = cands[sorted[k]!]!.startMs;
    active = active.filter((t) => cands[t]!.endMs + reachMs > u);
    while (k < sorted.length && cands[sorted[k]!]!.startMs === u) active.push(sorted[k++]!);
    groups.push([...active]);
  }
  return groups;
}

export async function solveMip(inp: MipInput): Promise<MipOutput> {
  const highs = await loadHighs();
  const { cands, ctx } = inp;
  const { col: xCol, of: xOf } = xColumns(cands);
  const cost: number[] = [];
  const lo: number[] = [];
  const hi: number[] = [];
  const integ: number[] = [];
  const INT = highs.constants.variableType.integer;
  const CONT = highs.constants.variableType.continuous;
  const withRec = new Set(inp.recorders.map((r) => r.spacecraftId));
  for (const [t] of xOf) {
    const c = cands[t]!;
    cost.push(withRec.has(c.spacecraftId) ? 0 : c.value);
    lo.push(0);
    hi.push(1);
    integ.push(INT);
  }
  const addVar = (c: number, l: number, h: number): number => {
    cost.push(c);
    lo.push(l);
    hi.push(h);
    integ.push(CONT);
    return cost.length - 1;
  };
  const rStart: number[] = [0];
  const rIdx: number[] = [];
  const rVal: number[] = [];
  const rLo: number[] = [];
  const rHi: number[] = [];
  const INF = highs.infinity;
  const addRow = (idx: readonly number[], val: readonly number[], l: number, h: number) => {
    for (let i = 0; i < idx.length; i++) {
      rIdx.push(idx[i]!);
      rVal.push(val[i]!);
    }
    rStart.push(rIdx.length);
    rLo.push(l);
    rHi.push(h);
  };
  const xs = (t: number): number[] => cands[t]!.antennas.map((a) => xCol.get(`${t}:${a}`)!);

  // antenna rows, per station and antenna
  const byStation = new Map<string, number[]>();
  cands.forEach((c, t) => {
    const l = byStation.get(c.stationId) ?? [];
    l.push(t);
    byStation.set(c.stationId, l);
  });
  for (const [st, list] of byStation) {
    const setup = ctx.setupMs.get(st) ?? 0;
    const ants = [...new Set(list.flatMap((t) => cands[t]!.antennas))].sort((a, b) => a - b);
    for (const a of ants) {
      const on = list.filter((t) => cands[t]!.antennas.includes(a));
      for (const g of cliqueGroups(on, cands, setup)) {
        if (g.length < 2) continue;
        const idx = g.map((t) => xCol.get(`${t}:${a}`)!);
        addRow(idx, idx.map(() => 1), -INF, 1);
      }
    }
    // slew pairs
    const slewMs = maxSlewS(ctx.mechanics.get(st)) * 1000;
    if (slewMs > 0) {
      const sorted = [...list].sort((x, y) => cands[x]!.startMs - cands[y]!.startMs || x - y);
      const starts = sorted.map((t) => cands[t]!.startMs);
      for (const i of list) {
        const ci = cands[i]!;
        const from = ci.endMs + setup;
        let k = lowerBound(starts, from);
        for (; k < sorted.length && starts[k]! < from + slewMs; k++) {
          const j = sorted[k]!;
          const cj = cands[j]!;
          if (j === i || antennaCompatible(ci, cj, ctx)) continue;
          for (const a of ci.antennas) {
            if (!cj.antennas.includes(a)) continue;
            addRow([xCol.get(`${i}:${a}`)!, xCol.get(`${j}:${a}`)!], [1, 1], -INF, 1);
          }
        }
      }
    }
  }
  // spacecraft rows
  const groups = new Map<string, number[]>();
  cands.forEach((c, t) => {
    const key = ctx.oneStationAtATime ? c.spacecraftId : `${c.spacecraftId}\u0000${c.stationId}`;
    const l = groups.get(key) ?? [];
    l.push(t);
    groups.set(key, l);
  });
  for (const list of groups.values()) {
    for (const g of cliqueGroups(list, cands, 0)) {
      const idx = g.flatMap(xs);
      if (idx.length < 2) continue;
      addRow(idx, idx.map(() => 1), -INF, 1);
    }
  }
  // requirement rows
  for (const row of inp.rows) {
    const pen = row.requirement.hard ? inp.hard : row.requirement.penalty;
    const s = addVar(-pen, 0, row.needed);
    const idx: number[] = [s];
    const val: number[] = [1];
    row.members.forEach((t, k) => {
      for (const c of xs(t)) {
        idx.push(c);
        val.push(row.coef[k]!);
      }
    });
    addRow(idx, val, row.needed, INF);
  }
  // recorder rows
  for (const r of inp.recorders) {
    const dOf = new Map<number, number>();
    let prevD = -1;
    let prevL = -1;
    r.checkpointsMs.forEach((_, k) => {
      const D = addVar(0, 0, INF);
      const L = addVar(0, 0, INF);
      const idx = [D];
      const val = [1];
      if (prevD >= 0) {
        idx.push(prevD);
        val.push(-1);
      }
      for (const t of r.endingAt[k]!) {
        const gbit = cands[t]!.bits / 1e9;
        const d = addVar(r.priority, 0, gbit);
        dOf.set(t, d);
        idx.push(d);
        val.push(-1);
        const xi = xs(t);
        addRow([d, ...xi], [1, ...xi.map(() => -gbit)], -INF, 0);
      }
      addRow(idx, val, 0, 0);
      const avail = r.availableGbit[k]!;
      addRow([D, L], [1, 1], avail - r.capacityGbit, avail);
      if (prevL >= 0) addRow([L, prevL], [1, -1], 0, INF);
      else addRow([L], [1], r.lost0Gbit, INF);
      prevD = D;
      prevL = L;
    });
  }

  const numCols = cost.length;
  const numRows = rLo.length;
  const model = {
    numCols,
    numRows,
    sense: highs.constants.objectiveSense.maximize,
    offset: 0,
    colCost: Float64Array.from(cost),
    colLower: Float64Array.from(lo),
    colUpper: Float64Array.from(hi),
    rowLower: Float64Array.from(rLo),
    rowUpper: Float64Array.from(rHi),
    matrix: { format: 'csr', numRows, numCols, starts: Int32Array.from(rStart), indices: Int32Array.from(rIdx), values: Float64Array.from(rVal) },
    integrality: Int32Array.from(integ),
  };
  return highs.withModel(model, (m) => {
    m.options.set({ time_limit: inp.timeLimitS, mip_rel_gap: inp.mipRelGap, output_flag: false, random_seed: 0 });
    const res = m.run();
    const status = STATUS[res.modelStatus] ?? `status ${res.modelStatus}`;
    const sol = m.getSolution();
    const chosen = new Map<number, number>();
    if (sol.colValue.length === numCols) {
      xOf.forEach(([t, a], c) => {
        if (sol.colValue[c]! > 0.5) chosen.set(t, a);
      });
    }
    const num = (k: string): number => {
      try {
        return Number(m.info.get(k));
      } catch {
        return Number.NaN;
      }
    };
    return { chosen, objective: num('objective_function_value'), bound: num('mip_dual_bound'), gap: num('mip_gap'), status, variables: numCols };
  });
}

function lowerBound(a: readonly number[], x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a[mid]! < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
