import { describe, expect, it } from 'vitest';
import {
  CROSS_POLAR_LOSS_DB,
  linearMismatchLossDb,
  polarizationMismatchLossDb,
  polarizationTiltDeg,
} from '../../src/link/polarization.js';

describe('polarisation mismatch', () => {
  it('circular vs linear loses half the power: 3.01 dB (antenna theory, exact 10 log10 2; 0.005 dB)', () => {
    for (const c of ['RHCP', 'LHCP'] as const) {
      for (const l of ['linear-h', 'linear-v'] as const) {
        expect(Math.abs(polarizationMismatchLossDb(c, l) - 3.01)).toBeLessThan(0.005);
        expect(Math.abs(polarizationMismatchLossDb(l, c) - 3.01)).toBeLessThan(0.005);
      }
    }
  });
  it('matched: 0 dB; opposite circular and h vs v: the cross-polar isolation (assumed 25 dB, common practice 20-30 dB)', () => {
    expect(polarizationMismatchLossDb('RHCP', 'RHCP')).toBe(0);
    expect(polarizationMismatchLossDb('linear-v', 'linear-v')).toBe(0);
    expect(polarizationMismatchLossDb('RHCP', 'LHCP')).toBe(CROSS_POLAR_LOSS_DB);
    expect(polarizationMismatchLossDb('linear-h', 'linear-v')).toBe(CROSS_POLAR_LOSS_DB);
    expect(CROSS_POLAR_LOSS_DB).toBeGreaterThanOrEqual(20);
    expect(CROSS_POLAR_LOSS_DB).toBeLessThanOrEqual(30);
  });
  it("linear misalignment follows Malus's law cos^2: 45 deg -> 3.01 dB, 60 deg -> 6.02 dB, 90 deg -> isolation floor", () => {
    expect(linearMismatchLossDb(0)).toBeCloseTo(0, 12);
    expect(Math.abs(linearMismatchLossDb(45) - 3.0103)).toBeLessThan(1e-4);
    expect(Math.abs(linearMismatchLossDb(60) - 6.0206)).toBeLessThan(1e-4);
    expect(linearMismatchLossDb(90)).toBe(CROSS_POLAR_LOSS_DB);
  });
  it('tilt for the rain model: ITU-R P.838-3 convention (h 0, v 90, circular 45)', () => {
    expect(polarizationTiltDeg('linear-h')).toBe(0);
    expect(polarizationTiltDeg('linear-v')).toBe(90);
    expect(polarizationTiltDeg('LHCP')).toBe(45);
  });
});
