import { describe, expect, it } from 'vitest';
import { occupiedBandwidthHz, shannonCapacityBps, shannonMinEbN0Db } from '../../../src/link/modcod/shannon.js';
import { modcodRef, readCsv } from '../read-csv.js';

const constants = readCsv(modcodRef('constants_relations.csv'));
const value = (name: string): number => Number(constants.find((r) => r.name === name)?.value);

describe('Shannon capacity (Shannon-Hartley; constants_relations.csv)', () => {
  it('minimum Eb/N0: -1.5917 dB as eta -> 0 (1e-4), 0.00 dB at eta 1, 1.76 dB at eta 2 (computed, 0.005 dB)', () => {
    expect(Math.abs(shannonMinEbN0Db(1e-9) - value('shannon_limit_ebn0'))).toBeLessThan(1e-4);
    expect(Math.abs(shannonMinEbN0Db(0) - value('shannon_limit_ebn0'))).toBeLessThan(1e-4);
    expect(Math.abs(shannonMinEbN0Db(1) - value('shannon_min_ebn0_eta_1'))).toBeLessThan(0.005);
    expect(Math.abs(shannonMinEbN0Db(2) - value('shannon_min_ebn0_eta_2'))).toBeLessThan(0.005);
  });

  it('C = B log2(1 + C/(N0 B)) with B = Rs (1 + rolloff) (rrc_occupied_bandwidth, common practice)', () => {
    const bHz = occupiedBandwidthHz(10e6, 0.35);
    expect(bHz).toBeCloseTo(13.5e6, 6);
    // C/N0 = 10 log10 B gives S/N = 1 in the band: C = B exactly; S/N = 3: C = 2 B.
    expect(shannonCapacityBps(bHz, 10 * Math.log10(bHz))).toBeCloseTo(bHz, 3);
    expect(shannonCapacityBps(bHz, 10 * Math.log10(3 * bHz))).toBeCloseTo(2 * bHz, 3);
    // Wideband limit: C -> (C/N0) / ln 2 = (C/N0) log2 e.
    const cn0 = 1e5;
    expect(Math.abs(shannonCapacityBps(1e12, 50) / (cn0 / Math.LN2) - 1)).toBeLessThan(1e-6);
  });
});
