/**
 * Reads the shard files `plan --shard K/N` wrote (report/shard.ts) for `merge`: every
 * "shard-K-of-N.pbshard" in the folders given (or a shard file named directly). A file
 * that is not a shard, or one of another passbudget version, is a ScenarioError naming it.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { deserialize } from 'node:v8';
import { ScenarioError } from '../errors.js';
import type { PlanResult } from '../plan/types.js';
import { SHARD_FORMAT, type ShardHeader } from '../report/shard.js';

export interface ShardFile {
  file: string;
  header: ShardHeader;
  part: PlanResult;
}

const SHARD_NAME = /^shard-\d+-of-\d+\.pbshard$/;

/** The shard files under each path (a folder's shard-*.pbshard, or the file itself), in name order. */
export function shardPaths(paths: readonly string[]): string[] {
  const out: string[] = [];
  for (const p of paths) {
    let isDir: boolean;
    try {
      isDir = statSync(p).isDirectory();
    } catch {
      throw new ScenarioError([{ file: p, path: '', message: 'does not exist (give the folders plan --shard K/N wrote to)' }]);
    }
    if (!isDir) {
      out.push(p);
      continue;
    }
    const names = readdirSync(p).filter((n) => SHARD_NAME.test(n)).sort();
    if (names.length === 0) throw new ScenarioError([{ file: p, path: '', message: 'holds no shard-K-of-N.pbshard file (written by plan --shard K/N)' }]);
    for (const n of names) out.push(join(p, n));
  }
  return out;
}

export function readShardFile(file: string, version: string): ShardFile {
  const bad = (message: string): ScenarioError => new ScenarioError([{ file, path: '', message }]);
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (err) {
    throw bad(`cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  const eol = bytes.indexOf(0x0a);
  let header: ShardHeader;
  try {
    header = JSON.parse(bytes.subarray(0, eol < 0 ? 0 : eol).toString('utf8')) as ShardHeader;
  } catch {
    throw bad(`is not a shard file (no ${SHARD_FORMAT} header line)`);
  }
  if (header?.format !== SHARD_FORMAT) throw bad(`is not a shard file (no ${SHARD_FORMAT} header line)`);
  if (header.version !== version) throw bad(`was written by passbudget ${header.version}; merge with the same version (this is ${version})`);
  let part: PlanResult;
  try {
    part = deserialize(bytes.subarray(eol + 1)) as PlanResult;
  } catch {
    throw bad('is damaged (its result cannot be read); run its shard again');
  }
  return { file, header, part };
}
