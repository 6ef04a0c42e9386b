/**
 * Worker-thread entry of runPlanParallel: runs the plan pipeline for the spacecraft
 * it is given and posts the result back. Pure computation, no I/O.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runPlan, type PlanOptions } from './run.js';
import type { Scenario, Span } from '../scenario/types.js';

interface Job {
  scenario: Scenario;
  span: Span;
  opts: Omit<PlanOptions, 'onProgress'>;
}

const job = workerData as Job;
parentPort?.postMessage(runPlan(job.scenario, job.span, job.opts));
