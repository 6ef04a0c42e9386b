/**
 * The worker threads running now (plan/parallel.ts adds and removes them), so that a
 * stop (a failed batch, SIGINT / SIGTERM: cli/signals.ts) can end them all. A module of
 * its own: the signal handlers load it at start-up without the plan engine.
 */
import type { Worker } from 'node:worker_threads';

export const runningWorkers = new Set<Worker>();

/** Stops every plan worker still running. */
export function terminateWorkers(): void {
  for (const w of runningWorkers) void w.terminate();
  runningWorkers.clear();
}
