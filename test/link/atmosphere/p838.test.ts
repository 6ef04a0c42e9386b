// Reference: ITU-R SG3 validation workbook Rev 8.3.0, sheet "P.838-3 Sp.Att"
// (test/reference/itu-r/p838-3_rain_specific_attenuation.csv), Rec. ITU-R P.838-3 Eqs. 1-5.
// Tolerance: 1e-9 relative (closed form given all inputs; README of test/reference/itu-r).
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../../src/errors.js';
import {
  p838HvCoefficients,
  p838PathCoefficients,
  rainSpecificAttenuationDbPerKm,
} from '../../../src/link/atmosphere/p838.js';
import { col, ErrorStats, readReference } from './reference.js';

const CLOSED_FORM_REL = 1e-9;

describe('ITU-R P.838-3 against the SG3 validation workbook', () => {
  const rows = readReference('p838-3_rain_specific_attenuation.csv');

  it('reproduces kH, kV, alphaH, alphaV, k, alpha and gammaR for all 48 rows', () => {
    const stats = ['kH', 'kV', 'alphaH', 'alphaV', 'k', 'alpha', 'gammaR_dB_per_km'].map((c) => new ErrorStats(`P.838-3 ${c}`));
    const hv = { kH: 0, kV: 0, alphaH: 0, alphaV: 0 };
    const path = { k: 0, alpha: 0 };
    expect(rows.length).toBe(48);
    for (const r of rows) {
      p838HvCoefficients(col(r, 'f_GHz'), hv);
      p838PathCoefficients(hv, col(r, 'elevation_deg'), col(r, 'tau_deg'), path);
      const gamma = rainSpecificAttenuationDbPerKm(path.k, path.alpha, col(r, 'R_mm_per_h'));
      const calc = [hv.kH, hv.kV, hv.alphaH, hv.alphaV, path.k, path.alpha, gamma];
      calc.forEach((v, i) => stats[i]?.add(v, col(r, ['kH', 'kV', 'alphaH', 'alphaV', 'k', 'alpha', 'gammaR_dB_per_km'][i] as string)));
    }
    for (const s of stats) {
      console.info(s.summary());
      expect(s.max).toBeLessThanOrEqual(CLOSED_FORM_REL);
    }
  });

  it('throws ModelRangeError outside 1..1000 GHz', () => {
    const hv = { kH: 0, kV: 0, alphaH: 0, alphaV: 0 };
    expect(() => p838HvCoefficients(0.5, hv)).toThrow(ModelRangeError);
    expect(() => p838HvCoefficients(1001, hv)).toThrow(ModelRangeError);
    expect(() => p838HvCoefficients(Number.NaN, hv)).toThrow(ModelRangeError);
  });
});
