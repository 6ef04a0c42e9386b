import { describe, expect, it } from 'vitest';
import { DVBS2_EN302307_1 } from '../../../src/link/modcod/dvbs2-en302307-1.js';
import { DVBS2X_EN302307_2 } from '../../../src/link/modcod/dvbs2x-en302307-2.js';
import { modcodByName, modcodTable } from '../../../src/link/modcod/index.js';
import { shannonMinEbN0Db } from '../../../src/link/modcod/shannon.js';
import { modcodRef, readCsv } from '../read-csv.js';

const s2Csv = readCsv(modcodRef('dvbs2_modcod.csv'));
const s2xCsv = readCsv(modcodRef('dvbs2x_modcod.csv'));

const rate = (text: string): number => {
  const [p, q] = text.split('/').map(Number);
  return (p as number) / (q as number);
};

describe('DVB-S2 table vs ETSI EN 302 307-1 V1.4.1 Table 13 (test/reference/modcod/dvbs2_modcod.csv)', () => {
  it('has the 28 rows, thresholds to 0.01 dB and efficiencies to 1e-6 (printed precision)', () => {
    expect(DVBS2_EN302307_1.length).toBe(28);
    expect(s2Csv.length).toBe(28);
    let maxThrErr = 0;
    let maxEffErr = 0;
    s2Csv.forEach((r, i) => {
      const e = DVBS2_EN302307_1[i]!;
      expect(e.name).toBe(`${r.modulation} ${r.code_rate}`);
      expect(e.bitsPerSymbol).toBe(Number(r.bits_per_symbol));
      maxThrErr = Math.max(maxThrErr, Math.abs(e.esN0ThresholdDb - Number(r.es_n0_db)));
      maxEffErr = Math.max(maxEffErr, Math.abs(e.spectralEfficiencyBitsPerSymbol - Number(r.spectral_efficiency_bps_per_hz)));
      expect(e.source).toContain('EN 302 307-1 V1.4.1');
      expect(e.source).toContain('Table 13');
    });
    expect(maxThrErr).toBeLessThan(0.005);
    expect(maxEffErr).toBeLessThan(1e-6);
  });

  it('each efficiency re-derives from the frame: (Kbch - 80)/(64800/m + 90), Kbch = 64800 r - 16 t (reference README; 1e-6)', () => {
    let maxErr = 0;
    for (const e of DVBS2_EN302307_1) {
      const r = rate(e.codeRate);
      // BCH correction t: 12, except 10 for rates 2/3 and 5/6, 8 for 8/9 and 9/10 (EN 302 307-1 Table 5a).
      const t = ['2/3', '5/6'].includes(e.codeRate) ? 10 : ['8/9', '9/10'].includes(e.codeRate) ? 8 : 12;
      const kbch = 64800 * r - 16 * t;
      expect(kbch).toBe(e.kbchBits);
      const eff = (kbch - 80) / (64800 / e.bitsPerSymbol + 90);
      maxErr = Math.max(maxErr, Math.abs(eff - e.spectralEfficiencyBitsPerSymbol));
    }
    expect(maxErr).toBeLessThan(0.6e-6);
  });

  it('every threshold lies above the Shannon bound for its efficiency (Eb/N0 > (2^eta - 1)/eta)', () => {
    for (const e of DVBS2_EN302307_1) {
      const ebN0Db = e.esN0ThresholdDb - 10 * Math.log10(e.spectralEfficiencyBitsPerSymbol);
      const gap = ebN0Db - shannonMinEbN0Db(e.spectralEfficiencyBitsPerSymbol);
      expect(gap).toBeGreaterThan(0);
    }
  });

  it('looks up by table and entry name', () => {
    expect(modcodTable('DVB-S2')).toBe(DVBS2_EN302307_1);
    expect(modcodTable('dvbs2x')).toBe(DVBS2X_EN302307_2);
    expect(modcodTable('nope')).toBeUndefined();
    expect(modcodByName('DVB-S2', '8psk  3/4')?.esN0ThresholdDb).toBe(7.91);
    expect(modcodByName('DVB-S2', 'QPSK 7/8')).toBeUndefined();
  });
});

describe('DVB-S2X table (optional) vs ETSI EN 302 307-2 V1.1.1 Table 20a (dvbs2x_modcod.csv)', () => {
  it('matches the reference sheet row by row and keeps each row status (from-memory rows say so)', () => {
    expect(DVBS2X_EN302307_2.length).toBe(s2xCsv.length);
    s2xCsv.forEach((r, i) => {
      const e = DVBS2X_EN302307_2[i]!;
      expect(e.name).toBe(`${r.modulation} ${r.code_rate}`);
      expect(Math.abs(e.esN0ThresholdDb - Number(r.es_n0_db))).toBeLessThan(0.005);
      expect(Math.abs(e.spectralEfficiencyBitsPerSymbol - Number(r.spectral_efficiency_bps_per_hz))).toBeLessThan(1e-6);
      expect(e.status).toBe(r.status);
    });
    expect(DVBS2X_EN302307_2.filter((e) => e.status.includes('from memory, unverified')).length).toBe(8);
  });

  it('efficiencies re-derive from the frame with t = 12, except 128APSK (frame length unverified) (1e-6)', () => {
    for (const e of DVBS2X_EN302307_2) {
      if (e.modulation === '128APSK') continue;
      const eff = (64800 * rate(e.codeRate) - 16 * 12 - 80) / (64800 / e.bitsPerSymbol + 90);
      expect(Math.abs(eff - e.spectralEfficiencyBitsPerSymbol)).toBeLessThan(0.6e-6);
    }
  });
});
