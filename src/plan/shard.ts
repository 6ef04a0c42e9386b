/**
 * Shards of a plan for runs that outgrow one machine: shard K of N plans the spacecraft
 * whose id hashes to K - 1 (FNV-1a 32-bit of the id's UTF-8 bytes, modulo N): stable
 * (the same id always lands in the same shard, whatever the file order or the other
 * spacecraft) and spread evenly. Work is independent per spacecraft (DESIGN "Scaling"),
 * so the shards' results merge into exactly the single run's (plan/parallel.ts mergePlans).
 */
import type { Scenario } from '../scenario/types.js';

export interface ShardSpec {
  /** 1-based shard number. */
  index: number;
  count: number;
}

/** FNV-1a, 32-bit (Fowler, Noll, Vo; offset basis 2166136261, prime 16777619). */
export function fnv1a32(text: string): number {
  let h = 0x811c9dc5;
  for (const byte of new TextEncoder().encode(text)) {
    h ^= byte;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** The 1-based shard of a spacecraft id among `count` shards. */
export function shardOfId(spacecraftId: string, count: number): number {
  return (fnv1a32(spacecraftId) % count) + 1;
}

/** The scenario restricted to the spacecraft of one shard (file order kept). */
export function shardScenario(scenario: Scenario, shard: ShardSpec): Scenario {
  return { ...scenario, spacecraft: scenario.spacecraft.filter((s) => shardOfId(s.id, shard.count) === shard.index) };
}

/** Largest shard count accepted. */
export const MAX_SHARDS = 10_000;
