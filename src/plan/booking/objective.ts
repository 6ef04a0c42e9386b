/**
 * The booking objective, stated once and used by every solver, the report
 * and the checks:
 *
 *   maximise  sum of track values
 *             - sum over soft requirement rows of penalty x shortfall
 *             - HARD x sum over hard requirement rows of shortfall
 *
 * Track value: priority x Gbit. For a spacecraft with a recorder (and
 * recorderAware), the Gbit a track can take off the recorder instead of its
 * link bits, by this recorder model: checkpoints at every candidate's start
 * and end of the spacecraft; D_k = data sent by the tracks ending by
 * checkpoint k, L_k = data lost to a full recorder by then (non-decreasing,
 * from max(0, fill - capacity)); D_k + L_k <= fill + G(t_k) (only data that
 * exists can be sent or lost) and fill + G(t_k) - D_k - L_k <= capacity (the
 * store never exceeds the recorder). For a fixed set of tracks, sending as
 * much as possible at each checkpoint is optimal (more sent earlier never
 * forces more loss later), which is what `recorderValue` does; the MIP holds
 * the same rows. The recorder simulation (recorder.ts) then gives the exact
 * figures to the bit; this model decides the value only.
 *
 * Requirement rows (per spacecraft, per requirement):
 *  - tracksPerDay / minutesPerDay / volumePerDayGbit: one row per day of the
 *    requirement's zone that lies wholly inside the span; a track counts for
 *    the day its start falls in (1 per track, its minutes, its link Gbit).
 *  - maxGapH: one row per window [t, t + G] with t = span start + k x 15 min
 *    (t + G <= span end): some track must meet the window (start <= t + G and
 *    end >= t). Shortfall 1 when none does.
 * HARD = 10 x (sum of all candidate values + 1) per unit of shortfall, so a
 * hard requirement outranks any amount of value.
 */
import { DateTime } from 'luxon';
import { onTimeS, type RecorderSpec } from '../recorder.js';
import type { Span } from '../../scenario/types.js';
import type { Candidate, Requirement, SpacecraftRules } from './types.js';

export const GAP_STEP_MS = 15 * 60 * 1000;

export interface RequirementRow {
  spacecraftId: string;
  requirement: Requirement;
  period: string;
  startMs: number;
  endMs: number;
  needed: number;
  /** Candidate indices (into the component's list) and their contributions. */
  members: number[];
  coef: number[];
}

/** Days of `zone` wholly inside the span: [startMs, endMs, YYYY-MM-DD]. */
export function daysInSpan(span: Span, zone: string): [number, number, string][] {
  const out: [number, number, string][] = [];
  let d = DateTime.fromMillis(span.startMs, { zone }).startOf('day');
  if (d.toMillis() < span.startMs) d = d.plus({ days: 1 });
  for (;;) {
    const next = d.plus({ days: 1 });
    if (next.toMillis() > span.endMs) break;
    out.push([d.toMillis(), next.toMillis(), d.toISODate() ?? '']);
    d = next;
  }
  return out;
}

export function requirementRows(cands: readonly Candidate[], rules: ReadonlyMap<string, SpacecraftRules>, span: Span, spacecraftIds: readonly string[]): RequirementRow[] {
  const rows: RequirementRow[] = [];
  const bySc = new Map<string, number[]>();
  cands.forEach((c, i) => {
    const l = bySc.get(c.spacecraftId) ?? [];
    l.push(i);
    bySc.set(c.spacecraftId, l);
  });
  for (const sc of spacecraftIds) {
    const r = rules.get(sc);
    if (!r) continue;
    const mine = [...(bySc.get(sc) ?? [])].sort((a, b) => cands[a]!.startMs - cands[b]!.startMs || a - b);
    const starts = mine.map((i) => cands[i]!.startMs);
    const longest = mine.reduce((m, i) => Math.max(m, cands[i]!.endMs - cands[i]!.startMs), 0);
    /** First position in `mine` whose start is >= t (or > t with `after`). */
    const at = (t: number, after = false): number => {
      let lo = 0;
      let hi = starts.length;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (starts[mid]! < t || (after && starts[mid]! === t)) lo = mid + 1;
        else hi = mid;
      }
      return lo;
    };
    for (const req of r.requirements) {
      if (req.kind === 'maxGapH') {
        const G = req.value * 3_600_000;
        for (let t = span.startMs; t + G <= span.endMs; t += GAP_STEP_MS) {
          const members: number[] = [];
          for (let k = at(t - longest); k < at(t + G, true); k++) if (cands[mine[k]!]!.endMs >= t) members.push(mine[k]!);
          rows.push({ spacecraftId: sc, requirement: req, period: new Date(t).toISOString().slice(0, 16) + 'Z', startMs: t, endMs: t + G, needed: 1, members, coef: members.map(() => 1) });
        }
        continue;
      }
      for (const [a, b, name] of daysInSpan(span, req.dayZone)) {
        const members = mine.slice(at(a), at(b));
        const coef = members.map((i) => {
          const c = cands[i]!;
          return req.kind === 'tracksPerDay' ? 1 : req.kind === 'minutesPerDay' ? (c.endMs - c.startMs) / 60000 : c.bits / 1e9;
        });
        rows.push({ spacecraftId: sc, requirement: req, period: name, startMs: a, endMs: b, needed: req.value, members, coef });
      }
    }
  }
  return rows;
}

export const hardWeight = (cands: readonly Candidate[]): number => 10 * (cands.reduce((s, c) => s + c.value, 0) + 1);

/** Recorder model of one spacecraft over its candidates (Gbit). */
export interface RecorderModel {
  spacecraftId: string;
  priority: number;
  checkpointsMs: number[];
  /** fill + G(t_k), Gbit. */
  availableGbit: number[];
  capacityGbit: number;
  lost0Gbit: number;
  /** For each checkpoint k, the candidate indices ending in (t_{k-1}, t_k]. */
  endingAt: number[][];
}

export function recorderModel(cands: readonly Candidate[], members: readonly number[], spec: RecorderSpec, span: Span, priority: number, spacecraftId: string): RecorderModel {
  const ts = [...new Set(members.flatMap((i) => [cands[i]!.startMs, cands[i]!.endMs]))].sort((a, b) => a - b);
  const fill = Math.round(spec.initialFillBits);
  const cap = Math.round(spec.capacityBits);
  const gen = (t: number) => Math.floor(spec.generationBps * onTimeS(t - span.startMs, spec.duty));
  const idx = new Map(ts.map((t, k) => [t, k]));
  const endingAt: number[][] = ts.map(() => []);
  for (const i of members) endingAt[idx.get(cands[i]!.endMs)!]!.push(i);
  return {
    spacecraftId,
    priority,
    checkpointsMs: ts,
    availableGbit: ts.map((t) => (fill + gen(t)) / 1e9),
    capacityGbit: cap / 1e9,
    lost0Gbit: Math.max(0, fill - cap) / 1e9,
    endingAt,
  };
}

/** Gbit each chosen track takes off the recorder (greedy in checkpoint order; see the head comment). */
export function recorderValue(m: RecorderModel, cands: readonly Candidate[], chosen: ReadonlySet<number>): Map<number, number> {
  const out = new Map<number, number>();
  let D = 0;
  let L = m.lost0Gbit;
  m.checkpointsMs.forEach((_, k) => {
    const avail = m.availableGbit[k]!;
    let room = Math.max(0, avail - L - D);
    for (const i of m.endingAt[k]!) {
      if (!chosen.has(i)) continue;
      const d = Math.min(cands[i]!.bits / 1e9, room);
      out.set(i, d);
      room -= d;
      D += d;
    }
    L = Math.max(L, avail - D - m.capacityGbit);
  });
  return out;
}

export interface ObjectiveParts {
  value: number;
  softPenalty: number;
  hardShortfall: number;
  objective: number;
  /** Per requirement row: achieved amount. */
  achieved: number[];
  /** Per chosen candidate with a recorder model: Gbit taken off. */
  delivered: Map<number, number>;
}

export function evaluateObjective(
  cands: readonly Candidate[],
  chosen: ReadonlySet<number>,
  rows: readonly RequirementRow[],
  recorders: readonly RecorderModel[],
  hard: number,
): ObjectiveParts {
  const delivered = new Map<number, number>();
  const withRecorder = new Set(recorders.map((r) => r.spacecraftId));
  let value = 0;
  for (const i of chosen) if (!withRecorder.has(cands[i]!.spacecraftId)) value += cands[i]!.value;
  for (const r of recorders) {
    for (const [i, d] of recorderValue(r, cands, chosen)) {
      delivered.set(i, d);
      value += r.priority * d;
    }
  }
  let soft = 0;
  let hardShort = 0;
  const achieved = rows.map((row) => {
    let a = 0;
    row.members.forEach((i, k) => {
      if (chosen.has(i)) a += row.coef[k]!;
    });
    const short = Math.max(0, row.needed - a);
    if (row.requirement.hard) hardShort += short;
    else soft += row.requirement.penalty * short;
    return a;
  });
  return { value, softPenalty: soft, hardShortfall: hardShort, objective: value - soft - hard * hardShort, achieved, delivered };
}
