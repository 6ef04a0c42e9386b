/**
 * Greedy booking for components too large for the MIP (a heuristic; the
 * caller states its gap against an upper bound):
 *  1. requirement rows with a shortfall, hard first, then soft by penalty:
 *     their candidates by (contribution x penalty + value), taken while
 *     feasible until the row is met;
 *  2. every other candidate by value, taken while feasible.
 * Feasible = the rules of conflicts.ts against what is already booked (each
 * antenna keeps its tracks sorted by start; only neighbours within the
 * set-up + largest slew reach are checked). Deterministic: ties go to the
 * lower candidate index and the lower antenna.
 */
import { antennaCompatible, maxSlewS, spacecraftConflict, type ConflictContext } from './conflicts.js';
import type { RequirementRow } from './objective.js';
import type { Candidate } from './types.js';

export function solveGreedy(cands: readonly Candidate[], rows: readonly RequirementRow[], hard: number, ctx: ConflictContext): Map<number, number> {
  const chosen = new Map<number, number>();
  const lanes = new Map<string, number[]>(); // station:antenna -> candidate indices sorted by start
  const bySc = new Map<string, number[]>();
  const reach = new Map<string, number>();
  for (const c of cands) if (!reach.has(c.stationId)) reach.set(c.stationId, (ctx.setupMs.get(c.stationId) ?? 0) + maxSlewS(ctx.mechanics.get(c.stationId)) * 1000);
  const longest = cands.reduce((m, c) => Math.max(m, c.endMs - c.startMs), 0);

  const fits = (t: number): number => {
    const c = cands[t]!;
    for (const o of bySc.get(c.spacecraftId) ?? []) if (spacecraftConflict(c, cands[o]!, ctx)) return -1;
    const r = reach.get(c.stationId)!;
    for (const a of c.antennas) {
      const lane = lanes.get(`${c.stationId}:${a}`) ?? [];
      let lo = 0;
      let hi = lane.length;
      const from = c.startMs - r - longest;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cands[lane[mid]!]!.startMs < from) lo = mid + 1;
        else hi = mid;
      }
      let ok = true;
      for (let k = lo; k < lane.length && cands[lane[k]!]!.startMs < c.endMs + r; k++) {
        if (!antennaCompatible(c, cands[lane[k]!]!, ctx)) {
          ok = false;
          break;
        }
      }
      if (ok) return a;
    }
    return -1;
  };
  const take = (t: number, a: number) => {
    chosen.set(t, a);
    const key = `${cands[t]!.stationId}:${a}`;
    const lane = lanes.get(key) ?? [];
    let k = lane.length;
    while (k > 0 && cands[lane[k - 1]!]!.startMs > cands[t]!.startMs) k--;
    lane.splice(k, 0, t);
    lanes.set(key, lane);
    const l = bySc.get(cands[t]!.spacecraftId) ?? [];
    l.push(t);
    bySc.set(cands[t]!.spacecraftId, l);
  };
  const pen = (r: RequirementRow) => (r.requirement.hard ? hard : r.requirement.penalty);
  const rowOrder = rows.map((_, i) => i).sort((a, b) => pen(rows[b]!) - pen(rows[a]!) || a - b);
  for (const ri of rowOrder) {
    const row = rows[ri]!;
    let got = row.members.reduce((s, t, k) => s + (chosen.has(t) ? row.coef[k]! : 0), 0);
    if (got >= row.needed) continue;
    const order = row.members.map((t, k) => ({ t, score: row.coef[k]! * pen(row) + cands[t]!.value, k })).sort((x, y) => y.score - x.score || x.t - y.t);
    for (const { t, k } of order) {
      if (got >= row.needed) break;
      if (chosen.has(t)) continue;
      const a = fits(t);
      if (a < 0) continue;
      take(t, a);
      got += row.coef[k]!;
    }
  }
  const rest = cands.map((_, i) => i).sort((a, b) => cands[b]!.value - cands[a]!.value || a - b);
  for (const t of rest) {
    if (chosen.has(t)) continue;
    const a = fits(t);
    if (a >= 0) take(t, a);
  }
  return chosen;
}
