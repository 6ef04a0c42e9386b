/**
 * Figures of the week that belong to one spacecraft alone, made by the plan worker that
 * planned it (its contacts and its geometry are at hand there): the spacecraft's volume
 * counted once (plan/unique-volume.ts) and its margin rows at every station
 * (plan/margin.ts). The main thread then only puts them in order instead of making them
 * for the whole fleet by itself.
 *
 * They are kept for the one PlanResult they were made for (a WeakMap: never carried into a
 * shard file). A plan made from it (scheduled, booked, merged from shards) has none, and
 * the week stage makes its figures itself, by the same functions.
 */
import type { Scenario } from '../scenario/types.js';
import type { AtmosphereTable } from '../link/atmosphere/types.js';
import type { Geometry } from './contacts.js';
import { marginRows, type MarginRow } from './margin.js';
import type { PlanResult } from './types.js';
import { uniqueVolumes, type UniqueVolume } from './unique-volume.js';

/** What one worker batch adds: unique volumes of its spacecraft (fleet order), and their margin rows when asked. */
export interface BatchParts {
  unique: UniqueVolume[];
  margins?: MarginRow[];
}

/** The batch's own figures (`margins`: also the margin rows, which only the report needs; `tables`: atmosphere tables kept by the worker). */
export function batchParts(scenario: Scenario, result: PlanResult, geometry: Geometry, margins: boolean, tables?: Map<string, AtmosphereTable>): BatchParts {
  const unique = uniqueVolumes(
    scenario.spacecraft.map((s) => s.id),
    result.contacts,
  );
  return margins ? { unique, margins: marginRows(scenario, result, tables ? { tables } : {}, geometry) } : { unique };
}

/** The figures of a whole plan, gathered from its batches. */
export interface PlanParts {
  unique: Map<string, UniqueVolume>;
  /** Margin rows in marginRows' order (station, then spacecraft), when every batch made them. */
  margins?: MarginRow[];
}

const parts = new WeakMap<PlanResult, PlanParts>();

/** Gathers the batches' figures for `plan` (the merged plan of `scenario`'s fleet). */
export function attachPlanParts(plan: PlanResult, scenario: Scenario, batches: readonly BatchParts[]): void {
  const unique = new Map<string, UniqueVolume>();
  for (const b of batches) for (const u of b.unique) unique.set(u.spacecraftId, u);
  const out: PlanParts = { unique };
  if (batches.every((b) => b.margins !== undefined)) {
    const byPair = new Map<string, MarginRow>();
    for (const b of batches) for (const r of b.margins!) byPair.set(`${r.station}\u0000${r.spacecraft}`, r);
    const rows: MarginRow[] = [];
    for (const st of scenario.stations) {
      for (const sc of scenario.spacecraft) {
        const r = byPair.get(`${st.id}\u0000${sc.id}`);
        if (r) rows.push(r);
      }
    }
    out.margins = rows;
  }
  parts.set(plan, out);
}

/** Unique volumes of `ids` made by the workers for this very plan, or undefined. */
export function workerUniqueVolumes(plan: PlanResult, ids: readonly string[]): UniqueVolume[] | undefined {
  const p = parts.get(plan);
  if (!p) return undefined;
  const out: UniqueVolume[] = [];
  for (const id of ids) {
    const u = p.unique.get(id);
    if (!u) return undefined;
    out.push(u);
  }
  return out;
}

/** Margin rows made by the workers for this very plan, or undefined. */
export function workerMarginRows(plan: PlanResult): MarginRow[] | undefined {
  return parts.get(plan)?.margins;
}
