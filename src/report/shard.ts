/**
 * A shard's partial result as a file (`plan --shard K/N` writes it, `merge` reads it with
 * scenario/shard-file.ts): a header line of JSON naming the format, the passbudget
 * version, the shard, the span, the link step, the availability and the spacecraft it holds, then the
 * PlanResult in Node's structured-clone form (node:v8 serialize), which keeps every
 * number bit for bit (NaN, infinities, -0 included), so the merge gives the single run's
 * bytes.
 */
import { serialize } from 'node:v8';
import type { PlanResult } from '../plan/types.js';
import type { ShardSpec } from '../plan/shard.js';

export const SHARD_FORMAT = 'passbudget-shard/1';

export interface ShardHeader {
  format: typeof SHARD_FORMAT;
  version: string;
  shard: ShardSpec;
  fromMs: number;
  toMs: number;
  linkStepS: number;
  availabilityPercent: number;
  spacecraft: string[];
}

export const shardFileName = (shard: ShardSpec): string => `shard-${shard.index}-of-${shard.count}.pbshard`;

export function shardFileContent(header: ShardHeader, part: PlanResult): Uint8Array {
  const head = Buffer.from(`${JSON.stringify(header)}\n`, 'utf8');
  return Buffer.concat([head, serialize(part)]);
}
