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
import { join } from 'node:path';
import { runPlanWithGeometry, type PlanOptions } from './run.js';
import { batchParts } from './worker-parts.js';
import type { AtmosphereTable } from '../link/atmosphere/types.js';
import { serializeError } from '../errors.js';
import type { Scenario, Spacecraft, Span } from '../scenario/types.js';
import { newLinkTableCache } from './link.js';
import type { BatchJob, WorkerReply } from './parallel.js';
import { renderBatchTexts, transferablesOf } from '../report/batch-text.js';
import { packContacts, packTransferables } from './contact-pack.js';

interface Job {
  /** The scenario without its spacecraft (they come batch by batch). */
  scenario: Scenario;
  span: Span;
  opts: Omit<PlanOptions, 'onProgress'>;
  /** Render each batch's contact texts too (report/batch-text.ts). */
  renderTexts: boolean;
  /** Where the texts are spilled (one file per batch), when set. */
  spillDir?: string;
  /** Make each batch's own figures too (plan/worker-parts.ts); 'margins': with the margin rows. */
  weekParts: 'none' | 'unique' | 'margins';
  /** Send the contacts as columns, without their rate step functions (plan/contact-pack.ts): every window is shown as found. */
  slimContacts: boolean;
}

const job = workerData as Job;
const tables = newLinkTableCache();
/** The margin rows' atmosphere tables, kept across batches (keyed by their inputs). */
const marginTables = new Map<string, AtmosphereTable>();

parentPort?.on('message', (msg: BatchJob) => {
  let reply: WorkerReply;
  let transfer: ArrayBuffer[] = [];
  try {
    const spacecraft: Spacecraft[] = msg.spacecraft;
    const scenario = { ...job.scenario, spacecraft };
    const { result, geometry } = runPlanWithGeometry(scenario, job.span, job.opts, tables);
    reply = { ok: true, batch: msg.batch, result };
    if (job.renderTexts) {
      reply.texts = renderBatchTexts(result, job.spillDir !== undefined ? join(job.spillDir, `batch-${msg.batch}.bin`) : undefined);
      transfer = transferablesOf(reply.texts);
    }
    if (job.weekParts !== 'none') {
      reply.parts = batchParts(scenario, result, geometry, job.weekParts === 'margins', marginTables);
      if (job.slimContacts) {
        // the contacts cross as columns (plan/contact-pack.ts), without their rate step functions
        reply.packed = packContacts(result.contacts);
        reply.result = { ...result, contacts: [] };
        transfer = [...transfer, ...packTransferables(reply.packed)];
      }
    }
  } catch (err) {
    reply = { ok: false, error: serializeError(err) };
    transfer = [];
  }
  parentPort?.postMessage(reply, transfer);
});
