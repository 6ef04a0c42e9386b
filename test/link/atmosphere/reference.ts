/**
 * Test helpers: read the ITU-R SG3 validation tables copied into test/reference/itu-r/
 * (source note in that folder's README.md) and summarise relative errors.
 */

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const REFERENCE_DIR = fileURLToPath(new URL('../../reference/itu-r/', import.meta.url));

export type Row = Record<string, number>;

/** Rows of a reference CSV as numbers keyed by column name (empty cells -> NaN). */
export function readReference(file: string): Row[] {
  const lines = readFileSync(REFERENCE_DIR + file, 'utf8').trim().split(/\r?\n/);
  const header = (lines[0] ?? '').split(',');
  return lines.slice(1).map((line) => {
    const cells = line.split(',');
    const row: Row = {};
    header.forEach((name, i) => {
      const cell = cells[i] ?? '';
      row[name] = cell === '' ? Number.NaN : Number(cell);
    });
    return row;
  });
}

export function col(row: Row, name: string): number {
  const v = row[name];
  if (v === undefined) throw new Error(`no column ${name}`);
  return v;
}

/** Collects |calc/ref - 1| (or |calc| when ref is 0) and reports max and rms. */
export class ErrorStats {
  private maxRel = 0;
  private sumSq = 0;
  private n = 0;
  private maxAbsAtZero = 0;
  constructor(readonly label: string) {}

  add(calc: number, ref: number): void {
    if (ref === 0) {
      this.maxAbsAtZero = Math.max(this.maxAbsAtZero, Math.abs(calc));
      return;
    }
    const e = Math.abs(calc / ref - 1);
    this.maxRel = Math.max(this.maxRel, Number.isNaN(e) ? Number.POSITIVE_INFINITY : e);
    this.sumSq += e * e;
    this.n++;
  }

  get max(): number {
    return this.maxRel;
  }
  get rms(): number {
    return this.n > 0 ? Math.sqrt(this.sumSq / this.n) : 0;
  }
  get maxAbsWhereRefZero(): number {
    return this.maxAbsAtZero;
  }
  get count(): number {
    return this.n;
  }

  summary(): string {
    const zero = this.maxAbsAtZero > 0 ? `, max |calc| where ref = 0: ${this.maxAbsAtZero.toExponential(2)}` : '';
    return `${this.label}: n=${this.n} max rel ${this.maxRel.toExponential(2)} rms ${this.rms.toExponential(2)}${zero}`;
  }
}
