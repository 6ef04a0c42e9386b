import { describe, expect, it } from 'vitest';
import { bestModcod, lowestThresholdModcod } from '../../../src/link/modcod/acm.js';
import { DVBS2_EN302307_1 as S2 } from '../../../src/link/modcod/dvbs2-en302307-1.js';

const idx = (name: string): number => S2.findIndex((e) => e.name === name);
const justBelowDb = 0.001;

describe('ACM selection over DVB-S2 (ETSI EN 302 307-1 V1.4.1 Table 13 thresholds)', () => {
  it('switches exactly at a threshold: 8PSK 3/4 at 7.91 dB, 8PSK 2/3 just below (no margin)', () => {
    expect(bestModcod(S2, 7.91, 0)).toBe(idx('8PSK 3/4'));
    expect(bestModcod(S2, 7.91 - justBelowDb, 0)).toBe(idx('8PSK 2/3'));
  });

  it('keeps the required margin in reserve: 1 dB margin moves the switch to 8.91 dB', () => {
    expect(bestModcod(S2, 8.91, 1)).toBe(idx('8PSK 3/4'));
    expect(bestModcod(S2, 8.91 - justBelowDb, 1)).toBe(idx('8PSK 2/3'));
  });

  it('prefers efficiency over order: at 9.35 dB 16APSK 2/3 (2.637 b/sym) beats 8PSK 5/6 (2.479 b/sym)', () => {
    expect(bestModcod(S2, 9.35, 0)).toBe(idx('16APSK 2/3'));
  });

  it('returns -1 below QPSK 1/4 (-2.35 dB) and the top entry above 32APSK 9/10 (16.05 dB)', () => {
    expect(bestModcod(S2, -2.35 - justBelowDb, 0)).toBe(-1);
    expect(bestModcod(S2, -2.35, 0)).toBe(idx('QPSK 1/4'));
    expect(bestModcod(S2, 30, 0)).toBe(idx('32APSK 9/10'));
    expect(bestModcod(S2, NaN, 0)).toBe(-1);
    expect(lowestThresholdModcod(S2)).toBe(idx('QPSK 1/4'));
  });

  it('at every entry threshold the choice closes and is at least as efficient; just below, that entry is not chosen', () => {
    S2.forEach((e, i) => {
      const at = bestModcod(S2, e.esN0ThresholdDb + 2, 2);
      expect(at).toBeGreaterThanOrEqual(0);
      expect(S2[at]!.esN0ThresholdDb).toBeLessThanOrEqual(e.esN0ThresholdDb);
      expect(S2[at]!.spectralEfficiencyBitsPerSymbol).toBeGreaterThanOrEqual(e.spectralEfficiencyBitsPerSymbol);
      expect(bestModcod(S2, e.esN0ThresholdDb + 2 - justBelowDb, 2)).not.toBe(i);
    });
  });
});
