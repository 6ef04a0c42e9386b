import { describe, expect, it } from 'vitest';
import {
  gOverTAtSkyDbK,
  gOverTDbK,
  impliedSystemNoiseTempK,
  noiseFigureFromNoiseTempDb,
  noiseTempFromNoiseFigureK,
  systemNoiseTempK,
} from '../../src/link/noise.js';
import { dbToLinear } from '../../src/link/units.js';

describe('noise temperature from noise figure: Te = 290 (F - 1) (constants_relations.csv, textbook relation)', () => {
  it('3.0103 dB (F = 2) is 290 K exactly; 0 dB is 0 K; 1 dB is 75.1 K (common practice figure, 0.05 K)', () => {
    expect(noiseTempFromNoiseFigureK(10 * Math.log10(2))).toBeCloseTo(290, 9);
    expect(noiseTempFromNoiseFigureK(0)).toBe(0);
    expect(Math.abs(noiseTempFromNoiseFigureK(1) - 75.1)).toBeLessThan(0.05);
    expect(noiseFigureFromNoiseTempDb(noiseTempFromNoiseFigureK(2.7))).toBeCloseTo(2.7, 12);
  });
});

describe('system noise temperature, one reference point (Roddy 4th ed. ch. 12 cascade)', () => {
  it('LNA-input form equals the antenna-flange form divided by Lf, and G/T is the same at both points (1e-9)', () => {
    for (const [sky, ant, lfDb, tf, trx] of [
      [20, 10, 0.5, 290, 50],
      [150, 25, 1.2, 300, 35],
      [3, 0, 0, 290, 80],
    ] as const) {
      const lf = dbToLinear(lfDb);
      const tLna = systemNoiseTempK(sky, ant, lfDb, tf, trx);
      // Independent form at the antenna flange: T = Tsky + Tant + Tf (Lf - 1) + Lf Trx.
      const tFlange = sky + ant + tf * (lf - 1) + lf * trx;
      expect(tLna).toBeCloseTo(tFlange / lf, 9);
      const g = 45;
      expect(gOverTDbK(g, lfDb, tLna)).toBeCloseTo(g - 10 * Math.log10(tFlange), 9);
    }
  });

  it('hand example: Tsky 20 K, Tant 10 K, 0.5 dB feed at 290 K, Trx 50 K -> 108.27 K at the LNA input (0.01 K)', () => {
    // 30 / 1.12202 + 290 (1 - 1/1.12202) + 50 = 26.737 + 31.534 + 50 = 108.271 K (hand arithmetic).
    expect(Math.abs(systemNoiseTempK(20, 10, 0.5, 290, 50) - 108.271)).toBeLessThan(0.01);
  });
});

describe('station stated as G/T at an elevation (documented assumption in noise.ts)', () => {
  it('reproduces the stated G/T at the reference sky and falls by 10 log10(1 + dT/Tsys) when the sky warms', () => {
    const tsysRef = impliedSystemNoiseTempK(45, 23); // 10^(2.2) = 158.49 K
    expect(tsysRef).toBeCloseTo(158.489, 3);
    expect(gOverTAtSkyDbK(23, tsysRef, 30, 30)).toBe(23);
    // +50 K of sky: 23 - 10 log10(208.49/158.49) = 23 - 1.191 = 21.809 dB/K (hand arithmetic).
    expect(Math.abs(gOverTAtSkyDbK(23, tsysRef, 30, 80) - 21.809)).toBeLessThan(0.001);
    expect(gOverTAtSkyDbK(23, tsysRef, 30, 10)).toBeGreaterThan(23);
  });
});
