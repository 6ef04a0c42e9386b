/**
 * One contact's contacts.csv row, plan.json record and contacts.jsonl line written as
 * UTF-8 straight into three byte buffers (report/byte-writer.ts), for the plan workers
 * (report/batch-text.ts): the same bytes as report/contact-text.ts contactTexts, column by
 * column of CONTACT_COLUMNS in the same way, with each value formatted once into the
 * plan.json buffer and copied to the other two. The fixed pieces (quoted keys with their
 * indentation, ids and MODCOD names as JSON and CSV texts) are encoded once and kept.
 * Checked byte for byte against JSON.stringify and csv-stringify, and against
 * contactTexts, in test/report/contact-text.test.ts.
 */
import type { Contact } from '../plan/types.js';
import { CONTACT_COLUMNS, type Cell } from './contact-columns.js';
import { CONTACT_JSON_PAD, cellCsv, jsonString, otherRadiosJson, type CsvLayout } from './contact-text.js';
import type { ByteWriter } from './byte-writer.js';

const enc = (s: string): Uint8Array => Buffer.from(s, 'utf8');

const KEY_PAD = `\n${CONTACT_JSON_PAD}  `;
/** Per column: the pretty key with its line break and indentation (first, then later), the compact key. */
const PRETTY_FIRST = CONTACT_COLUMNS.map((col) => enc(`${KEY_PAD}${jsonString(col.key)}: `));
const PRETTY_NEXT = CONTACT_COLUMNS.map((col) => enc(`,${KEY_PAD}${jsonString(col.key)}: `));
const COMPACT_FIRST = CONTACT_COLUMNS.map((col) => enc(`${jsonString(col.key)}:`));
const COMPACT_NEXT = CONTACT_COLUMNS.map((col) => enc(`,${jsonString(col.key)}:`));
const MODCOD_COLUMN = CONTACT_COLUMNS.findIndex((col) => col.key === 'time_in_modcod_s');
const MODCOD_PAD = `${CONTACT_JSON_PAD}  `;
const MODCOD_INNER = `\n${MODCOD_PAD}  `;
const MODCOD_CLOSE = enc(`\n${MODCOD_PAD}}`);
const RECORD_CLOSE = enc(`\n${CONTACT_JSON_PAD}}`);
const OTHER_PRETTY_FIRST = enc(`${KEY_PAD}"other_radios": `);
const OTHER_PRETTY_NEXT = enc(`,${KEY_PAD}"other_radios": `);

/** CONTACT_COLUMNS as objects of one shape (the loop below reads them all alike). */
const KIND_VALUE = 0;
const KIND_ROUNDED = 1;
const KIND_ISO = 2;
const KIND_MODCOD = 3;
interface Column {
  kind: number;
  link: boolean;
  when: ((c: Contact) => boolean) | null;
  value: (c: Contact) => Cell;
  num: (c: Contact) => number;
  ms: (c: Contact) => number;
  digits: number;
}
const noNumber = (): number => Number.NaN;
const COLUMNS: Column[] = CONTACT_COLUMNS.map((col, i) => ({
  kind: i === MODCOD_COLUMN ? KIND_MODCOD : col.digits !== undefined ? KIND_ROUNDED : col.iso ? KIND_ISO : KIND_VALUE,
  link: col.link === true,
  when: col.when ?? null,
  value: col.value,
  num: col.num ?? noNumber,
  ms: col.ms ?? noNumber,
  digits: col.digits ?? 0,
}));

const TRUE = enc('true');
const FALSE = enc('false');
const NULL = enc('null');

/** A string cell's JSON and CSV texts. */
interface StringTexts {
  json: Uint8Array;
  csv: Uint8Array;
}
const stringTexts = new Map<string, StringTexts>();
function textsOf(s: string): StringTexts {
  let t = stringTexts.get(s);
  if (t === undefined) {
    t = { json: enc(jsonString(s)), csv: enc(cellCsv(s)) };
    if (stringTexts.size < 100_000) stringTexts.set(s, t);
  }
  return t;
}

/** A MODCOD name's pieces: pretty and compact key (first, later) and its text in the CSV cell. */
interface ModcodName {
  prettyFirst: Uint8Array;
  prettyNext: Uint8Array;
  compactFirst: Uint8Array;
  compactNext: Uint8Array;
  /** The name in a CSV cell (quotes doubled when `special`). */
  csv: Uint8Array;
  /** Holds a character that makes the CSV cell quoted. */
  special: boolean;
}
const CSV_SPECIAL = /[",\r\n]/;
const modcodNames = new Map<string, ModcodName>();
function modcodName(name: string): ModcodName {
  let m = modcodNames.get(name);
  if (m === undefined) {
    const k = jsonString(name);
    const special = CSV_SPECIAL.test(name);
    m = {
      prettyFirst: enc(`${MODCOD_INNER}${k}: `),
      prettyNext: enc(`,${MODCOD_INNER}${k}: `),
      compactFirst: enc(`${k}:`),
      compactNext: enc(`,${k}:`),
      csv: enc(special ? name.replace(/"/g, '""') : name),
      special,
    };
    if (modcodNames.size < 100_000) modcodNames.set(name, m);
  }
  return m;
}

// the closed MODCODs of one contact, by time (reused)
let closedNames: ModcodName[] = [];
let closedSecs: number[] = [];

/** modcodTexts of report/contact-text.ts, written: the JSON object in both forms and, when `inCsv`, the CSV cell. */
function writeModcod(times: Record<string, number>, inCsv: boolean, csv: ByteWriter, json: ByteWriter, line: ByteWriter): void {
  const keys = Object.keys(times);
  const values = Object.values(times); // in the order of keys (own enumerable string keys)
  const n = keys.length;
  if (n === 0) {
    json.byte(123);
    json.byte(125);
    line.byte(123);
    line.byte(125);
    return; // the CSV cell is empty
  }
  // Array.prototype.sort's order of strings (UTF-16 code units), by insertion: a dozen names
  for (let i = 1; i < n; i++) {
    const k = keys[i]!;
    const v = values[i]!;
    let j = i - 1;
    while (j >= 0 && keys[j]! > k) {
      keys[j + 1] = keys[j]!;
      values[j + 1] = values[j]!;
      j--;
    }
    keys[j + 1] = k;
    values[j + 1] = v;
  }
  json.byte(123);
  line.byte(123);
  let closed = 0;
  let special = false;
  for (let i = 0; i < n; i++) {
    const t = values[i] ?? 0;
    const m = modcodName(keys[i]!);
    json.bytes(i === 0 ? m.prettyFirst : m.prettyNext);
    line.bytes(i === 0 ? m.compactFirst : m.compactNext);
    const at = json.pos;
    json.rounded(t, 1);
    line.copyOf(json, at, json.pos);
    if (inCsv && t > 0) {
      // insertion after every longer or equal time: names come sorted, so ties stay by name
      let k = closed;
      while (k > 0 && closedSecs[k - 1]! < t) {
        closedSecs[k] = closedSecs[k - 1]!;
        closedNames[k] = closedNames[k - 1]!;
        k--;
      }
      closedSecs[k] = t;
      closedNames[k] = m;
      closed++;
      if (m.special) special = true;
    }
  }
  json.bytes(MODCOD_CLOSE);
  line.byte(125);
  if (closed === 0) return;
  if (special) csv.byte(34);
  for (let i = 0; i < closed; i++) {
    if (i > 0) csv.byte(59); // ';'
    csv.bytes(closedNames[i]!.csv);
    csv.byte(61); // '='
    csv.fixed(closedSecs[i]!, 1);
  }
  if (special) csv.byte(34);
  if (closedNames.length > 1024) {
    closedNames = [];
    closedSecs = [];
  }
}

/** contactTexts(c, layout) written: the CSV row into `csv`, the plan.json record into `json`, the JSON Lines line into `line`. */
export function writeContactTexts(c: Contact, layout: CsvLayout, csv: ByteWriter, json: ByteWriter, line: ByteWriter): void {
  json.byte(123); // '{'
  line.byte(123);
  let firstJson = true;
  let firstCsv = true;
  const mask = layout.mask;
  const hasLink = c.link !== undefined;
  for (let i = 0; i < COLUMNS.length; i++) {
    const col = COLUMNS[i]!;
    const present = !(col.link && !hasLink) && !(col.when !== null && !col.when(c));
    const inCsv = mask[i] === true;
    if (inCsv) {
      if (!firstCsv) csv.byte(44); // ','
      firstCsv = false;
    }
    if (!present) continue;
    json.bytes(firstJson ? PRETTY_FIRST[i]! : PRETTY_NEXT[i]!);
    line.bytes(firstJson ? COMPACT_FIRST[i]! : COMPACT_NEXT[i]!);
    firstJson = false;
    const kind = col.kind;
    if (kind === KIND_MODCOD) {
      writeModcod(c.link!.timeInModcodS, inCsv, csv, json, line);
    } else if (kind === KIND_ROUNDED) {
      const v = col.num(c);
      const at = json.pos;
      json.rounded(v, col.digits);
      line.copyOf(json, at, json.pos);
      if (inCsv && Number.isFinite(v)) csv.copyOf(json, at, json.pos);
    } else if (kind === KIND_ISO) {
      json.byte(34);
      const at = json.pos;
      json.iso(col.ms(c), 3);
      const end = json.pos;
      json.byte(34);
      line.copyOf(json, at - 1, end + 1);
      if (inCsv) csv.copyOf(json, at, end);
    } else {
      const v = col.value(c);
      if (typeof v === 'string') {
        const t = textsOf(v);
        json.bytes(t.json);
        line.bytes(t.json);
        if (inCsv) csv.bytes(t.csv);
      } else if (typeof v === 'number') {
        const at = json.pos;
        json.jsonNumber(v);
        line.copyOf(json, at, json.pos);
        if (inCsv) {
          if (Number.isFinite(v)) csv.copyOf(json, at, json.pos);
          else csv.ascii(String(v));
        }
      } else if (typeof v === 'boolean') {
        const b = v ? TRUE : FALSE;
        json.bytes(b);
        line.bytes(b);
        if (inCsv) csv.bytes(b);
      } else {
        json.bytes(NULL);
        line.bytes(NULL);
      }
    }
  }
  if (c.otherLinks) {
    const [pretty, compact] = otherRadiosJson(c.otherLinks, MODCOD_PAD);
    json.bytes(firstJson ? OTHER_PRETTY_FIRST : OTHER_PRETTY_NEXT);
    json.text(pretty);
    line.ascii(firstJson ? '"other_radios":' : ',"other_radios":');
    line.text(compact);
    firstJson = false;
  }
  if (firstJson) json.byte(125);
  else json.bytes(RECORD_CLOSE);
  line.byte(125);
  line.byte(10);
  csv.byte(10);
}
