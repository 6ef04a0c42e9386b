/**
 * Worker-thread entry of runPlanParallel: runs the plan pipeline on each batch of
 * spacecraft the main thread sends ({ batch, spacecraft }) and posts each batch's
 * result back at once, so a worker never holds more than one batch of contacts. The
 * scenario's stations and link settings come once (workerData); the link's tables are
 * built once per worker and shared by its batches. Pure computation, no I/O. An error
 * is posted as data (serializeError) so the main thread re-raises it as its own class:
 * a user's mistake stays one line and exit 2, whichever thread found it.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runPlan, type PlanOptions } from './run.js';
import { serializeError } from '../errors.js';
import type { Scenario, Spacecraft, Span } from '../scenario/types.js';
import { newLinkTableCache } from './link.js';
import type { BatchJob, WorkerReply } from './parallel.js';

interface Job {
  /** The scenario without its spacecraft (they come batch by batch). */
  scenario: Scenario;
  span: Span;
  opts: Omit<PlanOptions, 'onProgress'>;
}

const job = workerData as Job;
const tables = newLinkTableCache();

parentPort?.on('message', (msg: BatchJob) => {
  let reply: WorkerReply;
  try {
    const spacecraft: Spacecraft[] = msg.spacecraft;
    reply = { ok: true, batch: msg.batch, result: runPlan({ ...job.scenario, spacecraft }, job.span, job.opts, tables) };
  } catch (err) {
    reply = { ok: false, error: serializeError(err) };
  }
  parentPort?.postMessage(reply);
});
