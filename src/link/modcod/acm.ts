/**
 * Adaptive coding and modulation: choose the MODCOD a receiver at a given Es/N0 can use.
 *
 * Rule (common practice for ACM/VCM links, as in the DVB-S2 ACM mode, ETSI EN 302
 * 307-1 V1.4.1 clause 4.4 / annex on ACM): the highest-efficiency entry whose
 * threshold plus the required margin does not exceed the available Es/N0.
 * Ties in efficiency go to the lower threshold. Allocates nothing; returns an index.
 */
import type { ModcodEntry } from '../../scenario/types.js';

/**
 * Index of the best entry of `table` at esN0Db with marginDb kept in reserve:
 * max spectral efficiency among entries with esN0ThresholdDb + marginDb <= esN0Db;
 * -1 when none closes (or esN0Db is NaN).
 */
export function bestModcod(table: readonly ModcodEntry[], esN0Db: number, marginDb: number): number {
  let best = -1;
  let bestEff = -Infinity;
  let bestThr = Infinity;
  for (let i = 0; i < table.length; i++) {
    const e = table[i] as ModcodEntry;
    if (e.esN0ThresholdDb + marginDb <= esN0Db) {
      const eff = e.spectralEfficiencyBitsPerSymbol;
      if (eff > bestEff || (eff === bestEff && e.esN0ThresholdDb < bestThr)) {
        best = i;
        bestEff = eff;
        bestThr = e.esN0ThresholdDb;
      }
    }
  }
  return best;
}

/** Index of the entry with the lowest threshold (the fallback reported when none closes); -1 for an empty table. */
export function lowestThresholdModcod(table: readonly ModcodEntry[]): number {
  let best = -1;
  let thr = Infinity;
  for (let i = 0; i < table.length; i++) {
    const t = (table[i] as ModcodEntry).esN0ThresholdDb;
    if (t < thr) {
      thr = t;
      best = i;
    }
  }
  return best;
}

/**
 * The ACM choice as a step function: step k applies from thresholdsDb[k] (inclusive) to
 * the next threshold, carrying efficiency[k] bits per symbol with table entry index[k].
 * Built so that, for any q, the last step with thresholdsDb <= q is exactly
 * bestModcod(table, q, 0): the highest efficiency among entries whose threshold does not
 * exceed q, ties to the lower threshold. Thresholds and efficiencies ascend.
 */
export interface ModcodStaircase {
  thresholdsDb: Float64Array;
  efficiency: Float64Array;
  index: Int32Array;
}

export function modcodStaircase(table: readonly ModcodEntry[]): ModcodStaircase {
  const order = table.map((_, i) => i);
  order.sort((a, b) => {
    const ea = table[a] as ModcodEntry;
    const eb = table[b] as ModcodEntry;
    return ea.esN0ThresholdDb - eb.esN0ThresholdDb || eb.spectralEfficiencyBitsPerSymbol - ea.spectralEfficiencyBitsPerSymbol;
  });
  const thr: number[] = [];
  const eff: number[] = [];
  const idx: number[] = [];
  let best = -Infinity;
  for (const i of order) {
    const e = table[i] as ModcodEntry;
    if (e.spectralEfficiencyBitsPerSymbol > best) {
      best = e.spectralEfficiencyBitsPerSymbol;
      if (thr.length > 0 && thr[thr.length - 1] === e.esN0ThresholdDb) {
        // same threshold, higher efficiency: replaces the step
        eff[eff.length - 1] = best;
        idx[idx.length - 1] = i;
      } else {
        thr.push(e.esN0ThresholdDb);
        eff.push(best);
        idx.push(i);
      }
    }
  }
  return { thresholdsDb: Float64Array.from(thr), efficiency: Float64Array.from(eff), index: Int32Array.from(idx) };
}

/** The step of `stairs` in force at q (last threshold <= q), or -1 below the first. */
export function stepAt(stairs: ModcodStaircase, q: number): number {
  const t = stairs.thresholdsDb;
  let lo = -1;
  let hi = t.length;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((t[mid] as number) <= q) lo = mid;
    else hi = mid;
  }
  return lo;
}
