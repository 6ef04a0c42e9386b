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
