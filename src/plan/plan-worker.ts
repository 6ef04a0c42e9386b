/**
 * Worker-thread entry of runPlanParallel: runs the plan pipeline for the spacecraft
 * it is given and posts the result back. Pure computation, no I/O. An error is
 * posted as data (serializeError) so the main thread re-raises it as its own
 * class: a user's mistake stays one line and exit 2, whichever thread found it.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runPlan, type PlanOptions } from './run.js';
import { serializeError } from '../errors.js';
import type { Scenario, Span } from '../scenario/types.js';
import type { WorkerReply } from './parallel.js';

interface Job {
  scenario: Scenario;
  span: Span;
  opts: Omit<PlanOptions, 'onProgress'>;
}

const job = workerData as Job;
let reply: WorkerReply;
try {
  reply = { ok: true, result: runPlan(job.scenario, job.span, job.opts) };
} catch (err) {
  reply = { ok: false, error: serializeError(err) };
}
parentPort?.postMessage(reply);
