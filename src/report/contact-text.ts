/**
 * One contact's text in every form the outputs hold it, made in one pass: its contacts.csv
 * row, its plan.json record (indented as it sits in plan.json's "contacts" array) and its
 * contacts.jsonl line. Each value is formatted once and written into all three, by hand
 * rather than through JSON.stringify of a record object, with the same bytes as
 * `JSON.stringify(contactJson(c), null, 2)` re-indented, `JSON.stringify(contactJson(c))`
 * and the RFC 4180 row of the contact's CONTACT_COLUMNS cells (test/report/contact-text.test.ts
 * checks all three against those definitions).
 * Pure and allocation-light: the plan worker (plan/plan-worker.ts) runs it for its own batch
 * so the records of a large fleet are made on every core, not on the main thread alone.
 */
import type { Contact, ContactLink } from '../plan/types.js';
import { CONTACT_COLUMNS, type Cell } from './contact-columns.js';

/** Indentation of a contact record inside plan.json (document -> "contacts" -> item). */
export const CONTACT_JSON_PAD = '    ';

/** A JSON string literal, memoised (ids and MODCOD names repeat across a million records). */
const quoted = new Map<string, string>();
export function jsonString(s: string): string {
  let q = quoted.get(s);
  if (q === undefined) {
    q = JSON.stringify(s);
    if (quoted.size < 100_000) quoted.set(s, q);
  }
  return q;
}

/**
 * `String(Number(v.toFixed(d)))` (JSON's and CSV's text of a rounded number) without the
 * second conversion: toFixed's digits with trailing zeros dropped. Up to 15 significant
 * digits a decimal text survives the round trip through a double unchanged, so stripping
 * gives the same text; longer ones take the round trip. "null" for a value that is not finite.
 */
export function roundedText(v: number, d: number): string {
  if (!Number.isFinite(v)) return 'null';
  const t = v.toFixed(d);
  if (t.length > 16 || t.indexOf('e') >= 0) return String(Number(t));
  let end = t.length;
  if (d > 0) {
    while (t.charCodeAt(end - 1) === 48) end--; // '0'
    if (t.charCodeAt(end - 1) === 46) end--; // '.'
  }
  const s = end === t.length ? t : t.slice(0, end);
  return s === '-0' ? '0' : s;
}

/** JSON text of a plain number (JSON.stringify: null when not finite). */
const numberText = (v: number): string => (Number.isFinite(v) ? String(v) : 'null');

/** JSON text of a cell. */
function cellJson(v: Cell): string {
  if (v === null) return 'null';
  if (typeof v === 'number') return numberText(v);
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  return jsonString(v);
}

const CSV_SPECIAL = /[",\r\n]/;

/** RFC 4180 field of a cell (quoted when it holds a comma, a quote or a line break). */
export function cellCsv(v: Cell | undefined): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (typeof v === 'number') return String(v);
  return CSV_SPECIAL.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** Which CONTACT_COLUMNS a contacts.csv holds, as a mask over CONTACT_COLUMNS (and their header line). */
export interface CsvLayout {
  mask: readonly boolean[];
  header: string;
}

/** The columns some contact of `contacts` has, in CONTACT_COLUMNS order (contacts.csv's layout). */
export function csvLayout(contacts: readonly Contact[]): CsvLayout {
  let hasLink = false;
  for (const c of contacts) if (c.link !== undefined) hasLink = true;
  const mask = CONTACT_COLUMNS.map((col) => !col.jsonOnly && (hasLink || !col.link) && (!col.when || contacts.some(col.when)));
  return { mask, header: `${CONTACT_COLUMNS.filter((_, i) => mask[i]).map((col) => col.key).join(',')}\n` };
}

/**
 * The time per MODCOD in its forms, from one pass over its names: the JSON object (keys
 * sorted, seconds to 0.1 s) [pretty at `pad`, compact], and when `csv`, the CSV cell
 * (modcodCell: the closed ones by time, largest first, names breaking ties).
 */
function modcodTexts(timeInModcodS: Record<string, number>, pad: string, csv: boolean): [string, string, string] {
  const keys = Object.keys(timeInModcodS).sort();
  if (keys.length === 0) return ['{}', '{}', ''];
  const inner = `${pad}  `;
  let pretty = '{';
  let compact = '{';
  const closed: string[] = [];
  const secs: number[] = [];
  for (let i = 0; i < keys.length; i++) {
    const name = keys[i]!;
    const t = timeInModcodS[name] ?? 0;
    const k = jsonString(name);
    const v = roundedText(t, 1);
    pretty += `${i === 0 ? '' : ','}\n${inner}${k}: ${v}`;
    compact += `${i === 0 ? '' : ','}${k}:${v}`;
    if (csv && t > 0) {
      // insertion after every longer or equal time: names come sorted, so ties stay by name
      let at = closed.length;
      while (at > 0 && secs[at - 1]! < t) at--;
      closed.splice(at, 0, name);
      secs.splice(at, 0, t);
    }
  }
  let cell = '';
  for (let i = 0; i < closed.length; i++) cell += `${i === 0 ? '' : ';'}${closed[i]}=${secs[i]!.toFixed(1)}`;
  return [`${pretty}\n${pad}}`, `${compact}}`, cell];
}

/** The other radios' list: [pretty at `pad`, compact]. */
export function otherRadiosJson(links: readonly ContactLink[], pad: string): [string, string] {
  if (links.length === 0) return ['[]', '[]'];
  const item = `${pad}  `;
  const field = `${pad}    `;
  let pretty = '[';
  let compact = '[';
  links.forEach((l, i) => {
    const fields: [string, string][] = [
      ['"radio"', jsonString(l.radioId)],
      ['"volume_bits"', numberText(l.volumeBits)],
      ...(l.expectedVolumeBits !== undefined ? [['"expected_volume_bits"', numberText(l.expectedVolumeBits)] as [string, string]] : []),
      ['"closure_margin_db"', roundedText(l.worstMarginDb, 2)],
      ['"peak_rate_bps"', numberText(Math.round(l.peakRateBps))],
    ];
    pretty += `${i === 0 ? '' : ','}\n${item}{`;
    compact += `${i === 0 ? '' : ','}{`;
    fields.forEach(([k, v], j) => {
      pretty += `${j === 0 ? '' : ','}\n${field}${k}: ${v}`;
      compact += `${j === 0 ? '' : ','}${k}:${v}`;
    });
    pretty += `\n${item}}`;
    compact += '}';
  });
  return [`${pretty}\n${pad}]`, `${compact}]`];
}

/** Quoted keys of CONTACT_COLUMNS, made once. */
const KEYS = CONTACT_COLUMNS.map((col) => jsonString(col.key));
const MODCOD_COLUMN = CONTACT_COLUMNS.findIndex((col) => col.key === 'time_in_modcod_s');

export interface ContactTexts {
  /** The contacts.csv row with its line end ('' when no layout was given). */
  csv: string;
  /** The plan.json record at CONTACT_JSON_PAD (no leading pad, no trailing comma or line end). */
  json: string;
  /** The contacts.jsonl line with its line end. */
  line: string;
}

/** One contact's CSV row (in `layout`'s columns), plan.json record and JSON Lines line. */
export function contactTexts(c: Contact, layout: CsvLayout | undefined): ContactTexts {
  const pad = CONTACT_JSON_PAD;
  const keyPad = `\n${pad}  `;
  let json = '{';
  let line = '{';
  let csv = '';
  let firstJson = true;
  let firstCsv = true;
  for (let i = 0; i < CONTACT_COLUMNS.length; i++) {
    const col = CONTACT_COLUMNS[i]!;
    const present = !(col.link && !c.link) && !(col.when && !col.when(c));
    const inCsv = layout !== undefined && layout.mask[i] === true;
    if (!present) {
      if (inCsv) {
        if (!firstCsv) csv += ',';
        firstCsv = false;
      }
      continue;
    }
    let pretty: string;
    let compact: string;
    let cellText: string | undefined;
    if (i === MODCOD_COLUMN) {
      let cell: string;
      [pretty, compact, cell] = modcodTexts(c.link!.timeInModcodS, `${pad}  `, inCsv);
      if (inCsv) cellText = cellCsv(cell);
    } else if (col.digits !== undefined) {
      const t = roundedText(col.num!(c), col.digits);
      pretty = compact = t;
      if (inCsv) cellText = t === 'null' ? '' : t;
    } else if (col.iso) {
      const t = col.value(c) as string;
      pretty = compact = `"${t}"`;
      if (inCsv) cellText = t;
    } else {
      const v = col.value(c);
      pretty = compact = cellJson(v);
      if (inCsv) cellText = cellCsv(v);
    }
    if (inCsv) {
      if (!firstCsv) csv += ',';
      firstCsv = false;
      csv += cellText;
    }
    json += `${firstJson ? '' : ','}${keyPad}${KEYS[i]}: ${pretty}`;
    line += `${firstJson ? '' : ','}${KEYS[i]}:${compact}`;
    firstJson = false;
  }
  if (c.otherLinks) {
    const [pretty, compact] = otherRadiosJson(c.otherLinks, `${pad}  `);
    json += `${firstJson ? '' : ','}${keyPad}"other_radios": ${pretty}`;
    line += `${firstJson ? '' : ','}"other_radios":${compact}`;
    firstJson = false;
  }
  json += firstJson ? '}' : `\n${pad}}`;
  line += '}\n';
  return { csv: layout ? `${csv}\n` : '', json, line };
}
