import { describe, expect, it } from 'vitest';
import { CCSDS_TM_CODES } from '../../../src/link/modcod/ccsds-tm-131.js';
import { ccsdsCode } from '../../../src/link/modcod/index.js';
import { modcodRef, readCsv } from '../read-csv.js';

const csv = readCsv(modcodRef('ccsds_tm_coding.csv'));
const constants = readCsv(modcodRef('constants_relations.csv'));
const constant = (name: string): number => {
  const row = constants.find((r) => r.name === name);
  if (!row) throw new Error(`constants_relations.csv has no ${name}`);
  return Number(row.value);
};

/** Binary-input AWGN capacity limits (constants_relations.csv, computed by numerical integration there), by rate. */
const biAwgnLimits = constants
  .filter((r) => r.name.startsWith('bi_awgn_limit_rate_'))
  .map((r) => {
    const t = r.name.slice('bi_awgn_limit_rate_'.length);
    const [p, q] = t.split('/').map(Number);
    return { rate: q === undefined ? (p as number) : (p as number) / q, limitDb: Number(r.value) };
  });

/** Gaussian tail Q(x) by Simpson integration of the normal density (test-local, independent of src). */
function q(x: number): number {
  const n = 4000;
  const b = x + 14;
  const h = (b - x) / n;
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const t = x + i * h;
    const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
    s += w * Math.exp(-0.5 * t * t);
  }
  return (s * h) / 3 / Math.sqrt(2 * Math.PI);
}

/** Eb/N0 (dB) at which uncoded BPSK reaches bit error rate p: Pb = Q(sqrt(2 Eb/N0)), by bisection. */
function uncodedEbN0Db(p: number): number {
  let lo = 0;
  let hi = 20;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (q(Math.sqrt(2 * 10 ** (mid / 10))) > p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('CCSDS 131.0-B / 130.1-G code thresholds (test/reference/modcod/ccsds_tm_coding.csv)', () => {
  it('carry the reference sheet values, status and tolerance row by row', () => {
    expect(CCSDS_TM_CODES.length).toBe(csv.length);
    csv.forEach((r, i) => {
      const c = CCSDS_TM_CODES[i]!;
      expect(c.code).toBe(r.code);
      expect(c.ebN0ThresholdDb).toBe(Number(r.required_eb_n0_db));
      expect(c.status).toBe(r.status);
      expect(c.toleranceDb).toBe(Number(r.tolerance_db));
      expect(c.errorCriterion).toBe(r.error_rate_criterion);
    });
  });

  it('uncoded rows equal Pb = Q(sqrt(2 Eb/N0)) inverted here (Proakis/Sklar relation; 0.01 dB, printed precision)', () => {
    const uncoded = CCSDS_TM_CODES.filter((c) => c.rate === 1);
    expect(uncoded.length).toBe(4);
    let maxErr = 0;
    for (const c of uncoded) {
      const p = Number(c.errorCriterion.replace('BER ', ''));
      maxErr = Math.max(maxErr, Math.abs(uncodedEbN0Db(p) - c.ebN0ThresholdDb));
    }
    expect(maxErr).toBeLessThan(0.006);
    // constants_relations.csv bpsk_ebn0_for_ber_1e-5: 9.59 dB
    expect(Math.abs(uncodedEbN0Db(1e-5) - constant('bpsk_ebn0_for_ber_1e-5'))).toBeLessThan(0.005);
  });

  it('every coded threshold lies above the binary-input capacity limit for its rate and below uncoded BPSK at the same error rate', () => {
    const coded = CCSDS_TM_CODES.filter((c) => c.rate < 1);
    expect(coded.length).toBe(17);
    for (const c of coded) {
      const limit = biAwgnLimits.reduce((a, b) => (Math.abs(b.rate - c.rate) < Math.abs(a.rate - c.rate) ? b : a));
      expect(Math.abs(limit.rate - c.rate)).toBeLessThan(0.001);
      expect(c.ebN0ThresholdDb).toBeGreaterThan(limit.limitDb);
      // Same error rate: BER rows against uncoded BER; CER 1e-4 rows against uncoded BER 1e-4,
      // a stricter bound (uncoded codeword error 1e-4 would need a lower BER, i.e. more Eb/N0).
      const p = Number(c.errorCriterion.split(' ')[1]);
      const exp = -Math.round(Math.log10(p));
      const uncoded = constant(`bpsk_ebn0_for_ber_1e-${exp}`);
      expect(c.ebN0ThresholdDb).toBeLessThan(uncoded);
    }
  });

  it('looks codes up by name (case-insensitive)', () => {
    expect(ccsdsCode('conv k7 r1/2 ber 1e-5')?.ebN0ThresholdDb).toBe(4.2);
    expect(ccsdsCode('RS(255,223)+conv r1/2 BER 1e-6')?.ebN0ThresholdDb).toBe(2.6);
    expect(ccsdsCode('no such code')).toBeUndefined();
  });
});
