/**
 * Reading scenario files: text from disk, JSON or YAML by extension, and zod
 * issues turned into problems that name the file, the field path, the value
 * and what is valid. The only module that touches the file system for input.
 */
import { readFileSync, statSync } from 'node:fs';
import { isAbsolute, resolve, dirname, extname } from 'node:path';
import { yamlLib } from '../lazy.js';
import type { z } from 'zod';
import type { Problem } from '../errors.js';

export type ReadResult<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

/**
 * Reads a text file; a missing, unreadable or empty file is a problem, not a throw.
 * A UTF-8 byte-order mark is dropped. A file that is not text (a NUL byte, a
 * control character other than tab / CR / LF / form feed, or bytes that are not
 * UTF-8) is one problem at its first such line: reading stops there, so a binary
 * file gives one line, not one per line of junk.
 */
export function readText(file: string, fieldPath = ''): ReadResult<string> {
  try {
    const st = statSync(file);
    if (!st.isFile()) return fail(file, fieldPath, 'is not a file');
    const text = readFileSync(file, 'utf8').replace(/^\uFEFF/, '');
    if (text.trim() === '') return fail(file, fieldPath, 'the file is empty');
    const bad = NOT_TEXT.exec(text);
    if (bad) {
      const line = text.slice(0, bad.index).split('\n').length;
      const what = bad[0] === '\u0000' ? 'a NUL byte' : bad[0] === '\uFFFD' ? 'bytes that are not UTF-8' : `control character U+${bad[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`;
      return fail(file, fieldPath, `is not a text file: line ${line} holds ${what} (reading stopped there); valid: a UTF-8 text file`);
    }
    return { ok: true, value: text };
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : `cannot be read (${code ?? 'error'})`;
    return fail(file, fieldPath, why);
  }
}

/** Characters no text file holds (U+FFFD is what bytes that are not UTF-8 decode to). */
const NOT_TEXT = /[\u0000-\u0008\u000B\u000E-\u001F\u007F\uFFFD]/;

/** Deepest nesting of arrays and objects a scenario file may use (the formats need 6). */
export const MAX_NESTING_DEPTH = 32;

/**
 * Nesting depth of the brackets in JSON (or YAML flow) text, outside strings, stopping
 * as soon as it passes `max`: returns the offset where it did, else -1. Run before
 * parsing, so no parser or validator recurses 20,000 levels deep.
 */
export function nestingTooDeepAt(text: string, max = MAX_NESTING_DEPTH): number {
  let depth = 0;
  let quote = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (quote !== 0) {
      if (c === 92 /* \\ */ && quote === 34) i++;
      else if (c === quote) quote = 0;
      continue;
    }
    if (c === 34 || c === 39) quote = c;
    else if (c === 91 || c === 123) {
      if (++depth > max) return i;
    } else if (c === 93 || c === 125) depth--;
  }
  return -1;
}

/** Depth of parsed data (iterative), stopping past `max`. */
function depthExceeds(value: unknown, max: number): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length > 0) {
    const [v, d] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (d + 1 > max) return true;
    for (const child of Object.values(v as Record<string, unknown>)) stack.push([child, d + 1]);
  }
  return false;
}

/** Parses JSON (.json) or YAML (.yaml, .yml) text into plain data. */
export function parseStructured(text: string, file: string): ReadResult<unknown> {
  const ext = extname(file).toLowerCase();
  const yaml = ext === '.yaml' || ext === '.yml';
  const deepAt = nestingTooDeepAt(text);
  const tooDeep = (at: string): { ok: false; problems: Problem[] } =>
    fail(file, '', `nests arrays and objects more than ${MAX_NESTING_DEPTH} levels deep${at}; valid: at most ${MAX_NESTING_DEPTH} levels`);
  if (deepAt >= 0) return tooDeep(` (line ${text.slice(0, deepAt).split('\n').length})`);
  try {
    const value = (yaml ? yamlLib().parse(text) : JSON.parse(text)) as unknown;
    if (depthExceeds(value, MAX_NESTING_DEPTH)) return tooDeep('');
    return { ok: true, value };
  } catch (err) {
    const kind = ext === '.yaml' || ext === '.yml' ? 'YAML' : 'JSON';
    const msg = ((err as Error).message.split('\n')[0] ?? 'parse error').replace(/:\s*$/, '');
    return fail(file, '', `is not valid ${kind}: ${msg}`);
  }
}

/** A path relative to the file that names it. */
export function resolveBeside(file: string, relative: string): string {
  return isAbsolute(relative) ? relative : resolve(dirname(file), relative);
}

export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out;
}

function valueAt(data: unknown, path: readonly PropertyKey[]): unknown {
  let cur: unknown = data;
  for (const key of path) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[key];
  }
  return cur;
}

function show(value: unknown, written?: () => string | undefined): string {
  if (value === undefined) return '';
  // NaN, Infinity and 1e400 have no JSON text of their own ("null"): quote them as written
  if (typeof value === 'number' && !Number.isFinite(value)) return written?.() ?? String(value);
  const s = JSON.stringify(value);
  return s.length > 60 ? `${s.slice(0, 57)}...` : s;
}

/**
 * The text of the value at `path` as written in `source` (JSON or YAML), or
 * undefined. Used only for messages (re-reads the text keeping positions).
 */
export function writtenAt(source: string, path: readonly PropertyKey[]): string | undefined {
  try {
    const doc = yamlLib().parseDocument(source);
    const node = doc.getIn(path as unknown[], true) as { range?: [number, number, number] } | undefined;
    const r = node?.range;
    if (!r) return undefined;
    const t = source.slice(r[0], r[1]).trim();
    return t.length > 60 ? `${t.slice(0, 57)}...` : t;
  } catch {
    return undefined;
  }
}

/**
 * Turns zod issues into problems: "file: path: value message". With the file's
 * text (`source`), a number JSON cannot show (NaN, Infinity, 1e400) is quoted as written.
 */
export function zodProblems(file: string, data: unknown, issues: readonly z.core.$ZodIssue[], base: readonly PropertyKey[] = [], source?: string): Problem[] {
  const out: Problem[] = [];
  for (const issue of issues) {
    const path = [...base, ...issue.path];
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        out.push({ file, path: formatPath([...path, key]), message: 'is not a known field (check its spelling)' });
      }
      continue;
    }
    const value = valueAt(data, issue.path);
    const written = source === undefined ? undefined : () => writtenAt(source, path);
    let message = issue.message;
    if (issue.code === 'invalid_type' && value === undefined) message = 'is required';
    else if (issue.code === 'invalid_type') message = `${show(value, written)} ${issue.message.replace(/^Invalid input: /, '')}`;
    else if (issue.code === 'invalid_value' || issue.code === 'custom' || issue.code === 'too_small' || issue.code === 'too_big' || issue.code === 'invalid_format') {
      const shown = value !== undefined && typeof value !== 'object' ? `${show(value, written)} ` : '';
      message = `${shown}${issue.message}`;
    }
    out.push({ file, path: formatPath(path), message });
  }
  return out;
}

function fail(file: string, path: string, message: string): { ok: false; problems: Problem[] } {
  return { ok: false, problems: [{ file, path, message }] };
}
