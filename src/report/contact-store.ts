/**
 * Contact texts rendered by the plan workers (report/batch-text.ts), kept for the one
 * PlanResult they were made for (a WeakMap: never carried into a shard file, never
 * outliving the plan). A plan made from it (scheduled, booked, merged from shards) is a
 * different object: its outputs are rendered afresh.
 */
import type { PlanResult } from '../plan/types.js';

/** The forms a batch renders, in the order of BatchTexts.forms. */
export const FORM = { csv: 0, json: 1, line: 2, ics: 3 } as const;
export type Form = (typeof FORM)[keyof typeof FORM];

/** One form's texts of a batch: contact i's bytes are bytes[offsets[i] .. offsets[i + 1]). */
export interface FormBytes {
  bytes: Uint8Array;
  offsets: Uint32Array;
}

/** A batch's rendered contacts (in the batch plan's order) and the CSV layout its rows were made in. */
export interface BatchTexts {
  csvHeader: string;
  forms: FormBytes[];
}

/** Where each contact of a merged plan was rendered: batch and index in it. */
export interface ContactTextStore {
  batches: (BatchTexts | undefined)[];
  /** Contact i of the plan: batch source[2i], index source[2i + 1]. */
  source: Uint32Array;
}

const stores = new WeakMap<PlanResult, ContactTextStore>();

export function attachContactTexts(plan: PlanResult, store: ContactTextStore): void {
  if (store.source.length !== 2 * plan.contacts.length) throw new Error('attachContactTexts: one source per contact expected');
  stores.set(plan, store);
}

export function contactTextsOf(plan: PlanResult): ContactTextStore | undefined {
  return stores.get(plan);
}

/** Contact i's bytes in one form (a view, no copy), or undefined when its batch was not rendered. */
export function storedText(store: ContactTextStore, form: Form, i: number): Uint8Array | undefined {
  const b = store.batches[store.source[2 * i]!];
  if (!b) return undefined;
  const j = store.source[2 * i + 1]!;
  const f = b.forms[form]!;
  return f.bytes.subarray(f.offsets[j]!, f.offsets[j + 1]!);
}

