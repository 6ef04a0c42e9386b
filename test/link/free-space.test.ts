import { describe, expect, it } from 'vitest';
import { fluxDensityDbwM2, freeSpaceLossDb } from '../../src/link/free-space.js';
import { ModelRangeError } from '../../src/errors.js';
import { modcodRef, readCsv } from './read-csv.js';

const constants = readCsv(modcodRef('constants_relations.csv'));
const value = (name: string): number => Number(constants.find((r) => r.name === name)?.value);

describe('ITU-R P.525 sec. 2.2 free-space basic loss', () => {
  it('matches 32.45 + 20 log f(MHz) + 20 log d(km) over 100 MHz..100 GHz, 100..400000 km (0.003 dB: 32.45 vs exact 32.4478)', () => {
    const c = value('free_space_loss_const_mhz_km'); // 32.45
    const cGhz = value('free_space_loss_const_ghz_km'); // 92.45
    let maxErr = 0;
    let sumSq = 0;
    let n = 0;
    for (const fMHz of [100, 400, 2200, 8400, 12000, 26000, 40000, 100000]) {
      for (const dKm of [100, 500, 2000, 36000, 40000, 400000]) {
        const got = freeSpaceLossDb(dKm, fMHz * 1e6);
        const ref = c + 20 * Math.log10(fMHz) + 20 * Math.log10(dKm);
        const refGhz = cGhz + 20 * Math.log10(fMHz / 1000) + 20 * Math.log10(dKm);
        const err = Math.abs(got - ref);
        maxErr = Math.max(maxErr, err);
        sumSq += err * err;
        n++;
        expect(Math.abs(got - refGhz)).toBeLessThan(0.003);
      }
    }
    // The rounded constant 32.45 differs from the exact 32.4478 by 0.0022 dB.
    expect(maxErr).toBeLessThan(0.003);
    expect(Math.sqrt(sumSq / n)).toBeGreaterThan(0.002); // the exact constant really is used
  });

  it('the frequency/distance-free constant is 32.4478 dB (constants_relations.csv, computed, 1e-4 dB)', () => {
    // Lbf(1 km, 1 MHz) is the constant itself.
    expect(Math.abs(freeSpaceLossDb(1, 1e6) - 32.4478)).toBeLessThan(1e-4);
  });

  it('rejects a non-positive range', () => {
    expect(() => freeSpaceLossDb(0, 1e9)).toThrow(ModelRangeError);
  });

  it('flux density: Pratt & Allnutt 3rd ed. Ex. 4.1, 2.91e-14 W/m^2 (printed precision) and -135.3 dBW/m^2 (0.1 dB)', () => {
    const fd = fluxDensityDbwM2(26.76, 36000);
    // The book prints -135.3 for 10 log10(2.91e-14) = -135.36: its dB figures are cut, not
    // rounded, so the dB check allows 0.1 dB; the linear value is checked to its printed digits.
    expect(Math.abs(fd - -135.3)).toBeLessThan(0.1);
    expect(Math.abs(10 ** (fd / 10) - 2.91e-14) / 2.91e-14).toBeLessThan(0.005 / 2.91);
  });
});
