/**
 * Contact texts rendered by the plan workers (report/batch-text.ts), kept for the one
 * PlanResult they were made for (a WeakMap: never carried into a shard file, never
 * outliving the plan). A plan made from it (scheduled, booked, merged from shards) is a
 * different object: its outputs are rendered afresh.
 */
import { closeSync, openSync, readSync } from 'node:fs';
import type { PlanResult } from '../plan/types.js';

/** The forms a batch renders, in the order of BatchTexts.forms. */
export const FORM = { csv: 0, json: 1, line: 2, ics: 3 } as const;
export type Form = (typeof FORM)[keyof typeof FORM];

/**
 * One form's texts of a batch: contact i's bytes are [offsets[i], offsets[i + 1]) of the
 * form's region, held in `bytes` or at `at` in the batch's spill file.
 */
export interface FormBytes {
  offsets: Uint32Array;
  bytes?: Uint8Array;
  /** Where the region starts in the batch's spill file. */
  at?: number;
}

/** A batch's rendered contacts (in the batch plan's order) and the CSV layout its rows were made in. */
export interface BatchTexts {
  csvHeader: string;
  forms: FormBytes[];
  /** The file holding every form's region (spilled: the main thread reads them back in output order). */
  file?: string;
}

/** Where each contact of a merged plan was rendered: batch and index in it. */
export interface ContactTextStore {
  batches: (BatchTexts | undefined)[];
  /** Contact i of the plan: batch source[2i], index source[2i + 1]. */
  source: Uint32Array;
  /** Contact i's station (index in the plan's stations): a batch's texts run station by station. */
  station: Uint32Array;
  stations: number;
  /** Reads spilled texts back (made on first use). */
  reader?: SpillReader;
}

const stores = new WeakMap<PlanResult, ContactTextStore>();

export function attachContactTexts(plan: PlanResult, store: ContactTextStore): void {
  if (store.source.length !== 2 * plan.contacts.length) throw new Error('attachContactTexts: one source per contact expected');
  stores.set(plan, store);
}

export function contactTextsOf(plan: PlanResult): ContactTextStore | undefined {
  return stores.get(plan);
}

/**
 * Contact i's bytes in one form, or undefined when its batch was not rendered. A view, no
 * copy: valid until the next call (a spilled text sits in a read window that is reused).
 */
export function storedText(store: ContactTextStore, form: Form, i: number): Uint8Array | undefined {
  const b = store.source[2 * i]!;
  const batch = store.batches[b];
  if (!batch) return undefined;
  const j = store.source[2 * i + 1]!;
  const f = batch.forms[form]!;
  const start = f.offsets[j]!;
  const end = f.offsets[j + 1]!;
  if (f.bytes) return f.bytes.subarray(start, end);
  if (batch.file === undefined || f.at === undefined) return undefined;
  store.reader ??= new SpillReader();
  // iCalendar events are taken by AOS across stations: one read window per station of each batch
  const key = form === FORM.ics ? b * store.stations + store.station[i]! : b;
  return store.reader.read(batch.file, form, key, f.at + start, f.at + end);
}

/** Bytes read from a spill file at a time (iCalendar events: one window per station of a batch). */
export const SPILL_WINDOW_BYTES = 32 * 1024;
/** The same for the forms read batch by batch (one window per batch: few, so larger, fewer reads). */
export const SPILL_BATCH_WINDOW_BYTES = 256 * 1024;
/** Spill files kept open at once. */
const MAX_OPEN_SPILL_FILES = 256;

/**
 * Spilled texts read back through windows: texts are asked for in order within each batch
 * (and station), so one window per key serves many texts before the next read.
 */
export class SpillReader {
  private readonly fds = new Map<string, number>();
  private windows = new Map<number, { start: number; end: number; buf: Buffer }>();
  private form = -1;

  read(file: string, form: number, key: number, start: number, end: number): Uint8Array {
    if (form !== this.form) {
      this.windows = new Map(); // a new output: the last one's windows are done with
      this.form = form;
    }
    let w = this.windows.get(key);
    if (!w || start < w.start || end > w.end) {
      const want = Math.max(form === FORM.ics ? SPILL_WINDOW_BYTES : SPILL_BATCH_WINDOW_BYTES, end - start);
      const buf = w && w.buf.length >= want ? w.buf : Buffer.allocUnsafe(want);
      const got = readSync(this.fd(file), buf, 0, want, start);
      if (got < end - start) throw new Error(`spilled contact texts: ${file} ends at ${start + got}, before ${end} (a bug or a removed temp file)`);
      w = { start, end: start + got, buf };
      this.windows.set(key, w);
    }
    return w.buf.subarray(start - w.start, end - w.start);
  }

  private fd(file: string): number {
    let fd = this.fds.get(file);
    if (fd === undefined) {
      if (this.fds.size >= MAX_OPEN_SPILL_FILES) this.close();
      fd = openSync(file, 'r');
      this.fds.set(file, fd);
    }
    return fd;
  }

  close(): void {
    for (const fd of this.fds.values()) closeSync(fd);
    this.fds.clear();
  }
}

/** Closes the files a plan's store reads its spilled texts from (their folder is removed by its owner). */
export function releaseContactTexts(plan: PlanResult): void {
  stores.get(plan)?.reader?.close();
}
