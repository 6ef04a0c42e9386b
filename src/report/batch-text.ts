/**
 * The contact texts of a plan made where the plan is made: a plan worker renders the
 * contacts of its own batch (CSV row, plan.json record, JSON Lines line, iCalendar event)
 * into byte buffers that cross to the main thread without a copy (transferable), so a
 * large fleet's records are formatted on every core. The main thread then only copies
 * bytes in output order (report/plan.ts, report/calendar.ts take them from the store,
 * report/contact-store.ts). From the CLI the bytes are spilled to a temp file per batch
 * (in a temp folder of the run) and read back in output order: the texts of a large fleet
 * are gigabytes, more than the main thread should hold.
 */
import { closeSync, openSync, writeSync } from 'node:fs';
import { outputErrorOf, shownPath } from './write.js';
import type { PlanResult } from '../plan/types.js';
import { csvLayout } from './contact-text.js';
import { contactUids } from './calendar.js';
import { ByteWriter } from './byte-writer.js';
import { writeContactTexts } from './contact-bytes.js';
import { eventBytesContext, writeEvent } from './event-bytes.js';
import { FORM, type BatchTexts, type FormBytes } from './contact-store.js';

export type { BatchTexts } from './contact-store.js';

/**
 * One growing buffer per form, the texts written into it as UTF-8 as they are made
 * (report/contact-bytes.ts, report/event-bytes.ts), never held as JS strings. Kept from
 * batch to batch (a worker renders one after another): a batch's buffers left to the
 * garbage collector linger, 200 x 20 x 7 d peak RSS 817 MB kept against 886 MB dropped.
 */
const writers: ByteWriter[] = [];

/**
 * Renders every contact of `plan` in every form (pure but for `spillFile`: when given, the
 * forms' bytes are written there, one region after another, and only their offsets kept).
 */
export function renderBatchTexts(plan: PlanResult, spillFile?: string): BatchTexts {
  const n = plan.contacts.length;
  const layout = csvLayout(plan.contacts);
  // first guesses of the bytes per contact (a buffer grows when it is short)
  const guess = [600, 1500, 1100, 800];
  for (let f = 0; f < 4; f++) {
    writers[f] ??= new ByteWriter(n * guess[f]!);
    writers[f]!.pos = 0;
  }
  const csv = writers[FORM.csv]!;
  const json = writers[FORM.json]!;
  const line = writers[FORM.line]!;
  const ics = writers[FORM.ics]!;
  const offsets = [0, 1, 2, 3].map(() => new Uint32Array(n + 1));
  const [csvAt, jsonAt, lineAt, icsAt] = [offsets[FORM.csv]!, offsets[FORM.json]!, offsets[FORM.line]!, offsets[FORM.ics]!];
  const uids = contactUids(plan);
  const ctx = eventBytesContext(plan);
  for (let i = 0; i < n; i++) {
    const c = plan.contacts[i]!;
    writeContactTexts(c, layout, csv, json, line);
    writeEvent(ics, ctx, c, uids[i]!);
    csvAt[i + 1] = csv.pos;
    jsonAt[i + 1] = json.pos;
    lineAt[i + 1] = line.pos;
    icsAt[i + 1] = ics.pos;
  }
  if (spillFile === undefined) {
    // each form's bytes in a buffer of their own (transferable without the unused tail);
    // spilled, they are written from the growing buffers themselves
    const forms = writers.map((w, f): FormBytes => {
      const bytes = new Uint8Array(w.pos);
      bytes.set(w.buf.subarray(0, w.pos));
      return { bytes, offsets: offsets[f]! };
    });
    return { csvHeader: layout.header, forms };
  }
  try {
    const fd = openSync(spillFile, 'w');
    try {
      let at = 0;
      const spilled: FormBytes[] = writers.map((w, f) => {
        for (let done = 0; done < w.pos; ) done += writeSync(fd, w.buf, done, w.pos - done);
        const region = { offsets: offsets[f]!, at };
        at += w.pos;
        return region;
      });
      return { csvHeader: layout.header, forms: spilled, file: spillFile };
    } finally {
      closeSync(fd);
    }
  } catch (err) {
    // a full disk names the temp file (in the run's temp folder, removed with the run)
    throw outputErrorOf(err, shownPath(spillFile)) ?? err;
  }
}

/** The buffers to hand to postMessage's transfer list. */
export function transferablesOf(texts: BatchTexts): ArrayBuffer[] {
  const out = new Set<ArrayBuffer>();
  for (const f of texts.forms) {
    if (f.bytes) out.add(f.bytes.buffer as ArrayBuffer);
    out.add(f.offsets.buffer as ArrayBuffer);
  }
  return [...out];
}

