import { describe, expect, it } from 'vitest';
import {
  beamwidthFromGainDeg,
  checkPattern,
  effectiveAreaGainDbi,
  halfPowerBeamwidthDeg,
  offNadirAngleDeg,
  parabolicGainDbi,
  patternGainDbi,
  pointingLossDb,
} from '../../src/link/antenna.js';
import { ModelRangeError } from '../../src/errors.js';
import { SPEED_OF_LIGHT_M_S } from '../../src/link/units.js';
import { modcodRef, readCsv } from './read-csv.js';

const worked = readCsv(modcodRef('worked_link_budgets.csv'));
const pratt = (item: string): number =>
  Number(worked.find((r) => r.example_id === 'pratt_ex4_1_4_2' && r.item === item)?.value);

describe('parabolic antenna', () => {
  it('Pratt & Allnutt 3rd ed. Ex. 4.2: 15 m^2 effective area at 11 GHz gives 54.0 dBi (printed 54.0; 0.05 dB)', () => {
    const g = effectiveAreaGainDbi(pratt('receive_effective_area'), pratt('frequency') * 1e9);
    expect(Math.abs(g - pratt('receive_antenna_gain'))).toBeLessThan(0.05);
  });

  it('eta (pi D / lambda)^2 equals 4 pi Ae / lambda^2 with Ae = eta pi D^2 / 4 (same relation, constants_relations.csv parabolic_gain; 1e-9 dB)', () => {
    for (const [dM, fHz, eta] of [
      [3.7, 2.25e9, 0.55],
      [11.3, 8.2e9, 0.65],
      [0.6, 26e9, 0.7],
    ] as const) {
      const areaEff = (eta * Math.PI * dM * dM) / 4;
      expect(Math.abs(parabolicGainDbi(dM, fHz, eta) - effectiveAreaGainDbi(areaEff, fHz))).toBeLessThan(1e-9);
    }
  });

  it('3 dB beamwidth 70 lambda/D (Maral & Bousquet; constants_relations.csv, common practice), same from the gain form', () => {
    const fHz = 8.4e9;
    const dM = 7.3;
    const lambda = SPEED_OF_LIGHT_M_S / fHz;
    expect(halfPowerBeamwidthDeg(dM, fHz)).toBeCloseTo((70 * lambda) / dM, 12);
    const g = parabolicGainDbi(dM, fHz, 0.6);
    expect(beamwidthFromGainDeg(g, 0.6)).toBeCloseTo(halfPowerBeamwidthDeg(dM, fHz), 10);
  });

  it('pointing loss 12 (theta/theta3)^2 gives 3 dB at theta3/2, the definition of the half-power beamwidth (common practice; exact)', () => {
    expect(pointingLossDb(0.05, 0.1)).toBeCloseTo(3, 12);
    expect(pointingLossDb(0, 0.1)).toBe(0);
    expect(pointingLossDb(0.1, 0.1)).toBeCloseTo(12, 12);
    expect(() => pointingLossDb(0.2, 0.1)).toThrow(ModelRangeError);
  });
});

describe('transmit pattern', () => {
  const ang = [0, 10, 30, 60];
  const gain = [6, 5, 0, -8];
  it('interpolates linearly in dB between points (hand values)', () => {
    expect(patternGainDbi(ang, gain, 0)).toBe(6);
    expect(patternGainDbi(ang, gain, 5)).toBeCloseTo(5.5, 12);
    expect(patternGainDbi(ang, gain, 20)).toBeCloseTo(2.5, 12);
    expect(patternGainDbi(ang, gain, 45)).toBeCloseTo(-4, 12);
    expect(patternGainDbi(ang, gain, 60)).toBe(-8);
    expect(patternGainDbi(ang, gain, 75)).toBe(-8); // held beyond the table
  });
  it('rejects bad tables', () => {
    expect(() => checkPattern([0, 10, 10], [1, 2, 3])).toThrow(ModelRangeError);
    expect(() => checkPattern([1, 10], [1, 2])).toThrow(ModelRangeError);
    expect(() => checkPattern([0, 10], [1])).toThrow(ModelRangeError);
  });
});

describe('off-nadir angle from a nadir-pointing spacecraft (law of cosines)', () => {
  const rS = 6371;
  const slant = (h: number, elDeg: number): number => {
    const e = (elDeg * Math.PI) / 180;
    return Math.sqrt((rS + h) ** 2 - (rS * Math.cos(e)) ** 2) - rS * Math.sin(e);
  };
  it('agrees with the law of sines sin(eta) = rS cos(el) / rSat (independent relation, 1e-9 deg)', () => {
    for (const h of [400, 800, 20200, 35786]) {
      for (let el = 0; el <= 90; el += 5) {
        const d = slant(h, el);
        const eta = offNadirAngleDeg(d, el, rS);
        const ref = (Math.asin((rS * Math.cos((el * Math.PI) / 180)) / (rS + h)) * 180) / Math.PI;
        expect(Math.abs(eta - ref)).toBeLessThan(1e-7);
      }
    }
  });
  it('is 0 at zenith and the Earth half-angle at the horizon: 8.7 deg from GEO (common practice, 0.05 deg)', () => {
    expect(offNadirAngleDeg(500, 90, rS)).toBeCloseTo(0, 6);
    expect(Math.abs(offNadirAngleDeg(slant(35786, 0), 0, rS) - 8.7)).toBeLessThan(0.05);
  });
});
