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
import { contactTexts, csvLayout } from './contact-text.js';
import { contactUids, eventContext, eventText } from './calendar.js';
import { FORM, type BatchTexts, type FormBytes } from './contact-store.js';

export type { BatchTexts } from './contact-store.js';

/**
 * Text appended as UTF-8 to a growing buffer at once, with the offset where each item
 * starts. Written piece by piece as made: a text built by concatenation is a chain of
 * pieces until it is flattened, and holding a batch's worth of such chains for one join
 * costs the garbage collector several times the formatting.
 */
class ByteRun {
  private buf: Buffer;
  private pos = 0;
  private n = 0;
  readonly offsets: Uint32Array;

  constructor(items: number, guessBytes: number) {
    this.buf = Buffer.allocUnsafeSlow(Math.max(1024, guessBytes));
    this.offsets = new Uint32Array(items + 1);
  }

  push(text: string): void {
    const need = this.pos + text.length * 3;
    if (need > this.buf.length) {
      const bigger = Buffer.allocUnsafeSlow(Math.max(need, this.buf.length * 2));
      this.buf.copy(bigger, 0, 0, this.pos);
      this.buf = bigger;
    }
    this.pos += this.buf.write(text, this.pos, 'utf8');
    this.offsets[++this.n] = this.pos;
  }

  /** The bytes in a buffer of their own (transferable without carrying the unused tail). */
  done(): FormBytes {
    const bytes = new Uint8Array(this.pos);
    bytes.set(this.buf.subarray(0, this.pos));
    return { bytes, offsets: this.offsets };
  }
}

/**
 * Renders every contact of `plan` in every form (pure but for `spillFile`: when given, the
 * forms' bytes are written there, one region after another, and only their offsets kept).
 */
export function renderBatchTexts(plan: PlanResult, spillFile?: string): BatchTexts {
  const n = plan.contacts.length;
  const layout = csvLayout(plan.contacts);
  // first guesses of the bytes per contact (a run grows when they are short)
  const runs = [new ByteRun(n, n * 600), new ByteRun(n, n * 1500), new ByteRun(n, n * 1100), new ByteRun(n, n * 800)];
  const uids = contactUids(plan);
  const ctx = eventContext(plan);
  for (let i = 0; i < n; i++) {
    const c = plan.contacts[i]!;
    const t = contactTexts(c, layout);
    runs[FORM.csv]!.push(t.csv);
    runs[FORM.json]!.push(t.json);
    runs[FORM.line]!.push(t.line);
    runs[FORM.ics]!.push(eventText(ctx, c, uids[i]!));
  }
  const forms = runs.map((r) => r.done());
  if (spillFile === undefined) return { csvHeader: layout.header, forms };
  try {
    const fd = openSync(spillFile, 'w');
    try {
      let at = 0;
      const spilled: FormBytes[] = forms.map((f) => {
        const bytes = f.bytes!;
        for (let done = 0; done < bytes.length; ) done += writeSync(fd, bytes, done, bytes.length - done);
        const region = { offsets: f.offsets, at };
        at += bytes.length;
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

