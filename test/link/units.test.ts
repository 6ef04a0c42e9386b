import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN_DBW_PER_K_HZ,
  BOLTZMANN_EXACT_DBW_PER_K_HZ,
  BOLTZMANN_J_PER_K,
  dbToLinear,
  linearToDb,
  SPEED_OF_LIGHT_M_S,
  T0_K,
  wattsToDbw,
} from '../../src/link/units.js';
import { noiseDensityDbwHz } from '../../src/link/noise.js';
import { modcodRef, readCsv } from './read-csv.js';

const constants = readCsv(modcodRef('constants_relations.csv'));
const constant = (name: string): number => {
  const row = constants.find((r) => r.name === name);
  if (!row) throw new Error(`constants_relations.csv has no ${name}`);
  return Number(row.value);
};

describe('RF constants (test/reference/modcod/constants_relations.csv)', () => {
  it('Boltzmann constant equals the SI 2019 exact value (BIPM SI Brochure 9th ed.)', () => {
    expect(BOLTZMANN_J_PER_K).toBe(constant('boltzmann_constant'));
  });

  it('speed of light equals the SI exact value (BIPM SI Brochure 9th ed.)', () => {
    expect(SPEED_OF_LIGHT_M_S).toBe(constant('speed_of_light'));
  });

  it('10 log10 k = -228.5992 dBW/(K.Hz) (computed, 1e-4 dB) and rounds to the trade -228.6 (0.01 dB)', () => {
    // constants_relations.csv boltzmann_constant_db: -228.5992, printed to 4 decimals.
    expect(Math.abs(BOLTZMANN_EXACT_DBW_PER_K_HZ - constant('boltzmann_constant_db'))).toBeLessThan(0.5e-4);
    // Trade rounding -228.6 (Roddy 4th ed. Ex. 12.9 text; FCC, NOAA budgets): within 0.01 dB.
    expect(Math.abs(BOLTZMANN_EXACT_DBW_PER_K_HZ - -228.6)).toBeLessThan(0.01);
    expect(BOLTZMANN_DBW_PER_K_HZ).toBe(-228.6);
  });

  it('N0 at T0 = 290 K is -204.0 dBW/Hz (common practice figure, 0.05 dB: printed to 0.1 dB)', () => {
    expect(T0_K).toBe(290);
    expect(Math.abs(noiseDensityDbwHz(290) - -204.0)).toBeLessThan(0.05);
  });

  it('dB conversions: 3.0103 dB is a factor 2, 1 W is 0 dBW, 15 W is 11.76 dBW (Pratt & Allnutt 3rd ed. Ex. 4.1, 0.005 dB)', () => {
    expect(linearToDb(2)).toBeCloseTo(3.0103, 4);
    expect(dbToLinear(linearToDb(7.3))).toBeCloseTo(7.3, 12);
    expect(wattsToDbw(1)).toBe(0);
    // Pratt & Allnutt 3rd ed. Ex. 4.1: EIRP 26.76 dBW = 15 W (11.76 dBW) + 15 dB.
    expect(Math.abs(wattsToDbw(15) + 15 - 26.76)).toBeLessThan(0.005);
  });
});
