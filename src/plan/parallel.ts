/**
 * The plan pipeline spread over worker threads, one group of spacecraft per thread
 * (work is independent per spacecraft: DESIGN "Scaling"). The merged result is the
 * same as runPlan's: contacts in the same order (station, AOS, spacecraft), warnings
 * deduplicated in the order runPlan gives them, stats summed.
 * Threads are used only from the compiled program (a worker needs a .js file), one
 * per MIN_SPACECRAFT_PER_THREAD spacecraft; from the compiled program even a
 * small fleet runs on one worker, so the main thread stays free to act on a
 * signal (Ctrl-C stops the run at once: src/cli/signals.ts). Errors come back
 * as data and are re-raised as their class (ScenarioError, ModelRangeError ...).
 * Elsewhere (tests on the sources) this is runPlan.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { runPlan, planResult, sortOutages, type PlanOptions } from './run.js';
import type { Scenario, Span } from '../scenario/types.js';
import type { PlanResult } from './types.js';
import { reviveError, type SerializedError } from '../errors.js';

/** What a plan worker posts back: its result, or its error as data. */
export type WorkerReply = { ok: true; result: PlanResult } | { ok: false; error: SerializedError };

/** Workers running now (terminated together when one fails). */
const running = new Set<Worker>();

/** Stops every plan worker still running (a failed group, or an interrupted run). */
export function terminateWorkers(): void {
  for (const w of running) void w.terminate();
  running.clear();
}

export const MIN_SPACECRAFT_PER_THREAD = 4;

/** Threads worth starting for this many spacecraft on this machine. */
export function threadsFor(spacecraftCount: number, maxThreads = availableParallelism()): number {
  return Math.max(1, Math.min(maxThreads, Math.floor(spacecraftCount / MIN_SPACECRAFT_PER_THREAD)));
}

function workerUrl(): URL | undefined {
  const url = new URL('./plan-worker.js', import.meta.url);
  return import.meta.url.endsWith('.js') ? url : undefined;
}

export async function runPlanParallel(scenario: Scenario, span: Span, opts: PlanOptions = {}, maxThreads?: number): Promise<PlanResult> {
  const threads = threadsFor(scenario.spacecraft.length, maxThreads);
  const url = workerUrl();
  if (url === undefined) return runPlan(scenario, span, opts);
  const { onProgress, ...plain } = opts;
  const groups: Scenario[] = [];
  for (let g = 0; g < threads; g++) {
    groups.push({ ...scenario, spacecraft: scenario.spacecraft.filter((_, i) => i % threads === g) });
  }
  let done = 0;
  onProgress?.(0, threads, 'threads');
  let parts: PlanResult[];
  try {
    parts = await Promise.all(
      groups.map(
        (group) =>
          new Promise<PlanResult>((resolve, reject) => {
            const w = new Worker(url, { workerData: { scenario: group, span, opts: plain } });
            running.add(w);
            w.once('message', (r: WorkerReply) => {
              if (!r.ok) {
                reject(reviveError(r.error));
                return;
              }
              onProgress?.(++done, threads, 'threads');
              resolve(r.result);
            });
            w.once('error', reject);
            w.once('exit', (code) => {
              running.delete(w);
              if (code !== 0) reject(new Error(`plan worker exited with code ${code}`));
            });
          }),
      ),
    );
  } catch (err) {
    terminateWorkers(); // the first error wins; the other groups' work is moot
    throw err;
  }
  return mergePlans(scenario, span, parts);
}

/** Merges per-group results into the single-thread order. */
export function mergePlans(scenario: Scenario, span: Span, parts: PlanResult[]): PlanResult {
  const stationOrder = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const scOrder = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  const contacts = parts.flatMap((p) => p.contacts);
  contacts.sort(
    (a, b) =>
      (stationOrder.get(a.stationId) ?? 0) - (stationOrder.get(b.stationId) ?? 0) ||
      a.aosMs - b.aosMs ||
      (scOrder.get(a.spacecraftId) ?? 0) - (scOrder.get(b.spacecraftId) ?? 0),
  );
  // runPlan's order: per-spacecraft warnings (spacecraft order), then link warnings (station order)
  const scWarn: string[][] = scenario.spacecraft.map(() => []);
  const other: string[] = [];
  for (const p of parts) {
    for (const w of p.warnings) {
      const k = scOrder.get(w.slice(0, w.indexOf(':')));
      if (k !== undefined) scWarn[k]!.push(w);
      else if (!other.includes(w)) other.push(w);
    }
  }
  other.sort((a, b) => (stationOrder.get(a.slice(0, a.indexOf(':'))) ?? 0) - (stationOrder.get(b.slice(0, b.indexOf(':'))) ?? 0));
  const stats = { propagations: 0, linkSamples: 0 };
  for (const p of parts) {
    stats.propagations += p.stats.propagations;
    stats.linkSamples += p.stats.linkSamples;
  }
  const merged = planResult(scenario, span, parts[0]?.linkStepS ?? 0, contacts, [...scWarn.flat(), ...other], stats);
  if (parts.some((p) => p.sunOutages)) merged.sunOutages = sortOutages(scenario, parts.flatMap((p) => p.sunOutages ?? []));
  return merged;
}
