/**
 * Reading scenario files: text from disk, JSON or YAML by extension, and zod
 * issues turned into problems that name the file, the field path, the value
 * and what is valid. The only module that touches the file system for input.
 */
import { readFileSync, statSync } from 'node:fs';
import { isAbsolute, resolve, dirname, extname } from 'node:path';
import { parse as parseYaml } from 'yaml';
import type { z } from 'zod';
import type { Problem } from '../errors.js';

export type ReadResult<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

/** Reads a text file; a missing, unreadable or empty file is a problem, not a throw. */
export function readText(file: string, fieldPath = ''): ReadResult<string> {
  try {
    const st = statSync(file);
    if (!st.isFile()) return fail(file, fieldPath, 'is not a file');
    const text = readFileSync(file, 'utf8');
    if (text.trim() === '') return fail(file, fieldPath, 'the file is empty');
    return { ok: true, value: text };
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : `cannot be read (${code ?? 'error'})`;
    return fail(file, fieldPath, why);
  }
}

/** Parses JSON (.json) or YAML (.yaml, .yml) text into plain data. */
export function parseStructured(text: string, file: string): ReadResult<unknown> {
  const ext = extname(file).toLowerCase();
  try {
    if (ext === '.yaml' || ext === '.yml') return { ok: true, value: parseYaml(text) as unknown };
    return { ok: true, value: JSON.parse(text) as unknown };
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

function show(value: unknown): string {
  if (value === undefined) return '';
  const s = JSON.stringify(value);
  return s.length > 60 ? `${s.slice(0, 57)}...` : s;
}

/** Turns zod issues into problems: "file: path: value message". */
export function zodProblems(file: string, data: unknown, issues: readonly z.core.$ZodIssue[], base: readonly PropertyKey[] = []): Problem[] {
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
    let message = issue.message;
    if (issue.code === 'invalid_type' && value === undefined) message = 'is required';
    else if (issue.code === 'invalid_type') message = `${show(value)} ${issue.message.replace(/^Invalid input: /, '')}`;
    else if (issue.code === 'invalid_value' || issue.code === 'custom' || issue.code === 'too_small' || issue.code === 'too_big' || issue.code === 'invalid_format') {
      const shown = value !== undefined && typeof value !== 'object' ? `${show(value)} ` : '';
      message = `${shown}${issue.message}`;
    }
    out.push({ file, path: formatPath(path), message });
  }
  return out;
}

function fail(file: string, path: string, message: string): { ok: false; problems: Problem[] } {
  return { ok: false, problems: [{ file, path, message }] };
}
