/**
 * The plan pipeline spread over worker threads (work is independent per spacecraft:
 * DESIGN "Scaling"). The fleet is cut into batches of consecutive spacecraft, handed out
 * to the workers as they come free (a pool sized to the machine), each batch's result
 * sent back as soon as it is done; the merged result is the same as runPlan's: contacts
 * in the same order (station, AOS, spacecraft), warnings deduplicated in the order runPlan
 * gives them (batches merged in fleet order), stats summed.
 * Threads are used only from the compiled program (a worker needs a .js file), one
 * per MIN_SPACECRAFT_PER_THREAD spacecraft; from the compiled program even a
 * small fleet runs on one worker (except a few spacecraft without radios: inlineWorthy),
 * so the main thread stays free to act on a signal (Ctrl-C stops the run at once:
 * src/cli/signals.ts). Errors come back as data and are re-raised as their class (ScenarioError, ModelRangeError ...).
 * Elsewhere (tests on the sources) this is runPlan.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { runPlan, planResult, sortOutages, type PlanOptions } from './run.js';
import type { Scenario, Spacecraft, Span } from '../scenario/types.js';
import type { PlanResult, WarningOrigin } from './types.js';
import { reviveError, type SerializedError } from '../errors.js';
import { runningWorkers, terminateWorkers } from './workers.js';
import { attachContactTexts, type BatchTexts } from '../report/contact-store.js';
import { attachPlanParts, type BatchParts } from './worker-parts.js';
import { unpackContacts, type ContactPack } from './contact-pack.js';

/** A batch of spacecraft sent to a worker. */
export interface BatchJob {
  batch: number;
  spacecraft: Spacecraft[];
}

/** What a plan worker posts back for a batch: its result, or its error as data. */
export type WorkerReply =
  | { ok: true; batch: number; result: PlanResult; texts?: BatchTexts; parts?: BatchParts; packed?: ContactPack }
  | { ok: false; error: SerializedError };

export interface ParallelOptions extends PlanOptions {
  /**
   * Have each worker render its batch's contact texts (report/batch-text.ts), attached to
   * the merged plan for the outputs to copy (set when the outputs will be written or printed).
   */
  renderTexts?: boolean;
  /** With renderTexts: a folder for the workers to spill the texts to (report/write.ts makeTempDir), else they cross in memory. */
  spillDir?: string;
  /**
   * Have each worker make its spacecraft's own figures of the week (plan/worker-parts.ts):
   * 'unique' volumes, or 'margins' too (for the report).
   */
  weekParts?: 'none' | 'unique' | 'margins';
  /**
   * With weekParts: every window will be shown as found (no schedule, no booking), so the
   * contacts may cross without their rate step functions (only the unique volumes read them),
   * as columns read through views (plan/contact-pack.ts): the merged plan's contacts are then
   * read-only.
   */
  slimContacts?: boolean;
}

export const MIN_SPACECRAFT_PER_THREAD = 4;
/** Most spacecraft in one batch (bounds what a worker holds and sends at once). */
export const MAX_BATCH_SPACECRAFT = 16;
/** Fewest spacecraft in a batch (but the last): a batch has a set-up cost of its own. */
export const MIN_BATCH_SPACECRAFT = 2;

/**
 * Young generation of a plan worker's heap, MB: V8's default lets each worker's young
 * objects grow to about 48 MB before a scavenge, and the process holds two or more
 * such heaps. 16 MB took the 200 x 20 x 7-day run's peak RSS from 748-764 MB to
 * 608-648 MB (two runs each) at the same CPU time within the noise (54.5-57.2 s).
 */
export const WORKER_YOUNG_GENERATION_MB = 16;

/** Threads worth starting for this many spacecraft on this machine. */
export function threadsFor(spacecraftCount: number, maxThreads = availableParallelism()): number {
  return Math.max(1, Math.min(maxThreads, Math.floor(spacecraftCount / MIN_SPACECRAFT_PER_THREAD)));
}

/**
 * A few spacecraft without radios (geometry only) take less time to plan than a worker
 * takes to start: they run on the main thread (a signal is acted on right after).
 */
export const INLINE_MAX_SPACECRAFT = 8;

export function inlineWorthy(scenario: Scenario): boolean {
  return scenario.spacecraft.length <= INLINE_MAX_SPACECRAFT && scenario.spacecraft.every((s) => s.radios.length === 0);
}

/**
 * The fleet cut into batches of consecutive spacecraft, handed out in order: each a share
 * of what is left (a quarter of it per thread, MIN_BATCH_SPACECRAFT to MAX_BATCH_SPACECRAFT), so the
 * batches shrink towards the end and the threads finish together instead of one waiting
 * on the other's last large batch.
 */
export function batchesOf<T>(fleet: readonly T[], threads: number, most = MAX_BATCH_SPACECRAFT): T[][] {
  const batches: T[][] = [];
  for (let i = 0; i < fleet.length; ) {
    const size = Math.max(MIN_BATCH_SPACECRAFT, Math.min(most, Math.ceil((fleet.length - i) / (4 * threads))));
    batches.push(fleet.slice(i, i + size));
    i += size;
  }
  if (batches.length === 0) batches.push([]);
  return batches;
}

/**
 * Most spacecraft in a batch over `span`: MAX_BATCH_SPACECRAFT for a week, fewer for a
 * longer span (a batch's contacts grow with it; what a worker holds and sends at once
 * should not), at least MIN_BATCH_SPACECRAFT.
 */
export function batchLimitFor(span: Span): number {
  const days = (span.endMs - span.startMs) / 86_400_000;
  return Math.max(MIN_BATCH_SPACECRAFT, Math.min(MAX_BATCH_SPACECRAFT, Math.round((MAX_BATCH_SPACECRAFT * 7) / Math.max(days, 1e-9))));
}

function workerUrl(): URL | undefined {
  const url = new URL('./plan-worker.js', import.meta.url);
  return import.meta.url.endsWith('.js') ? url : undefined;
}

export async function runPlanParallel(scenario: Scenario, span: Span, opts: ParallelOptions = {}, maxThreads?: number): Promise<PlanResult> {
  const threads = threadsFor(scenario.spacecraft.length, maxThreads);
  const url = workerUrl();
  if (url === undefined || inlineWorthy(scenario)) return runPlan(scenario, span, opts);
  const { onProgress, renderTexts, spillDir, weekParts, slimContacts, ...plain } = opts;
  const batches = batchesOf(scenario.spacecraft, threads, batchLimitFor(span));
  const parts: PlanResult[] = new Array<PlanResult>(batches.length);
  const texts: (BatchTexts | undefined)[] = new Array<BatchTexts | undefined>(batches.length);
  const figures: (BatchParts | undefined)[] = new Array<BatchParts | undefined>(batches.length);
  let next = 0;
  let done = 0;
  onProgress?.(0, batches.length, 'batches');
  const base: Scenario = { ...scenario, spacecraft: [] };
  const ids = new Map<string, string>();
  for (const x of [...scenario.spacecraft, ...scenario.stations]) ids.set(x.id, x.id);
  for (const sc of scenario.spacecraft) for (const r of sc.radios) ids.set(r.id, r.id);
  const shared = (id: string): string => ids.get(id) ?? id;
  try {
    await new Promise<void>((resolve, reject) => {
      let failed = false;
      const fail = (err: unknown): void => {
        if (failed) return;
        failed = true;
        reject(err);
      };
      const workers = Math.min(threads, batches.length);
      for (let t = 0; t < workers; t++) {
        const w = new Worker(url, { resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB }, workerData: { scenario: base, span, opts: plain, renderTexts: Boolean(renderTexts), ...(spillDir !== undefined ? { spillDir } : {}), weekParts: weekParts ?? 'none', slimContacts: Boolean(slimContacts) } });
        runningWorkers.add(w);
        let retired = false;
        const feed = (): void => {
          if (next < batches.length) {
            const job: BatchJob = { batch: next, spacecraft: batches[next]! };
            next++;
            w.postMessage(job);
          } else {
            retired = true; // nothing left to hand out
            runningWorkers.delete(w);
            void w.terminate();
          }
        };
        w.on('message', (r: WorkerReply) => {
          if (!r.ok) {
            fail(reviveError(r.error));
            return;
          }
          parts[r.batch] = r.packed ? { ...r.result, contacts: unpackContacts(r.packed, shared) } : withSharedIds(r.result, ids);
          texts[r.batch] = r.texts;
          figures[r.batch] = r.parts;
          done++; // not inside onProgress?.(...): its arguments are skipped without a hook
          onProgress?.(done, batches.length, 'batches');
          if (done === batches.length) resolve();
          feed();
        });
        w.once('error', fail);
        w.once('exit', (code) => {
          runningWorkers.delete(w);
          if (!retired) fail(new Error(`plan worker exited with code ${code} before its work was done`));
        });
        feed();
      }
    });
  } catch (err) {
    terminateWorkers(); // the first error wins; the other batches' work is moot
    throw err;
  }
  const { plan, source, station } = mergePlansWithSource(scenario, span, parts);
  if (renderTexts) attachContactTexts(plan, { batches: texts, source, station, stations: scenario.stations.length });
  if (figures.every((f) => f !== undefined)) attachPlanParts(plan, scenario, figures as BatchParts[]);
  return plan;
}

/**
 * The result with its ids pointing at the scenario's own strings: a result that crossed
 * threads carries a copy of every id in every contact, a million copies for a large fleet.
 */
function withSharedIds(result: PlanResult, ids: ReadonlyMap<string, string>): PlanResult {
  const shared = (id: string): string => ids.get(id) ?? id;
  for (const c of result.contacts) {
    c.spacecraftId = shared(c.spacecraftId);
    c.stationId = shared(c.stationId);
    if (c.link) c.link.radioId = shared(c.link.radioId);
    for (const l of c.otherLinks ?? []) l.radioId = shared(l.radioId);
  }
  return result;
}

/** Merges per-group results into the single-thread order. */
export function mergePlans(scenario: Scenario, span: Span, parts: PlanResult[]): PlanResult {
  return mergePlansWithSource(scenario, span, parts).plan;
}

/**
 * mergePlans, with where each merged contact came from: contact i is contact source[2i + 1]
 * of part source[2i]. The order is runPlan's (station, AOS, spacecraft; ties in part order).
 */
export function mergePlansWithSource(scenario: Scenario, span: Span, parts: PlanResult[]): { plan: PlanResult; source: Uint32Array; station: Uint32Array } {
  const stationOrder = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const scOrder = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  let n = 0;
  for (const p of parts) n += p.contacts.length;
  const all: PlanResult['contacts'] = new Array(n);
  const st = new Float64Array(n);
  const sc = new Float64Array(n);
  const from = new Uint32Array(2 * n);
  let k = 0;
  parts.forEach((p, b) => {
    p.contacts.forEach((c, j) => {
      all[k] = c;
      st[k] = stationOrder.get(c.stationId) ?? 0;
      sc[k] = scOrder.get(c.spacecraftId) ?? 0;
      from[2 * k] = b;
      from[2 * k + 1] = j;
      k++;
    });
  });
  const order = Array.from({ length: n }, (_, i) => i);
  order.sort((a, b) => st[a]! - st[b]! || all[a]!.aosMs - all[b]!.aosMs || sc[a]! - sc[b]! || a - b);
  const contacts: PlanResult['contacts'] = new Array(n);
  const source = new Uint32Array(2 * n);
  const station = new Uint32Array(n);
  for (let i = 0; i < n; i++) {
    const o = order[i]!;
    contacts[i] = all[o]!;
    source[2 * i] = from[2 * o]!;
    source[2 * i + 1] = from[2 * o + 1]!;
    station[i] = st[o]!;
  }
  const { warnings, origins } = mergeWarnings(scenario, parts);
  const stats = { propagations: 0, linkSamples: 0 };
  for (const p of parts) {
    stats.propagations += p.stats.propagations;
    stats.linkSamples += p.stats.linkSamples;
  }
  const merged = planResult(scenario, span, parts[0]?.linkStepS ?? 0, contacts, warnings, stats, origins);
  if (parts.some((p) => p.sunOutages)) merged.sunOutages = sortOutages(scenario, parts.flatMap((p) => p.sunOutages ?? []));
  return { plan: merged, source, station };
}

/**
 * The parts' warnings in runPlan's order, each said once: the search's (by spacecraft,
 * in fleet order), then the link set-up's (by station, then spacecraft, then radio: a
 * warning raised in several parts, such as a station's missing rain climate, stands where
 * its earliest origin puts it). Parts without origins (none of ours) fall back to the
 * id before the first ":" of the text.
 */
function mergeWarnings(scenario: Scenario, parts: readonly PlanResult[]): { warnings: string[]; origins: WarningOrigin[] } {
  const stationOrder = new Map(scenario.stations.map((s, i) => [s.id, i]));
  const scOrder = new Map(scenario.spacecraft.map((s, i) => [s.id, i]));
  const all: { text: string; origin: WarningOrigin; key: [number, number, number, number] }[] = [];
  for (const p of parts) {
    p.warnings.forEach((text, i) => {
      const prefix = text.slice(0, text.indexOf(':'));
      const origin: WarningOrigin = p.warningOrigins?.[i] ?? (scOrder.has(prefix) ? { spacecraftId: prefix } : { stationId: prefix });
      const sc = origin.spacecraftId !== undefined ? (scOrder.get(origin.spacecraftId) ?? 0) : 0;
      const key: [number, number, number, number] =
        origin.stationId === undefined ? [0, sc, 0, 0] : [1, stationOrder.get(origin.stationId) ?? 0, sc, origin.radioIndex ?? 0];
      all.push({ text, origin, key });
    });
  }
  // a stable sort: one origin's warnings keep the order their part gave them
  all.sort((a, b) => a.key[0] - b.key[0] || a.key[1] - b.key[1] || a.key[2] - b.key[2] || a.key[3] - b.key[3]);
  const seen = new Set<string>();
  const warnings: string[] = [];
  const origins: WarningOrigin[] = [];
  for (const w of all) {
    if (seen.has(w.text)) continue;
    seen.add(w.text);
    warnings.push(w.text);
    origins.push(w.origin);
  }
  return { warnings, origins };
}
