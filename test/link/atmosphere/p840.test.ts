// Reference: ITU-R SG3 validation workbook Rev 8.3.0, sheet "P.840-9 A_Clouds"
// (p840-9_cloud_attenuation.csv, 24 rows): permittivity of liquid water, eta, K_L and
// Ac = K_L L / sin(el) (Rec. ITU-R P.840-9 Annex 1 Eqs. 2-14) with the tabulated L.
// Tolerance: 1e-9 relative (closed form); Ac = 0 rows checked absolutely.
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../../src/errors.js';
import {
  cloudAttenuationDb,
  cloudMassAbsorptionDbPerKgM2,
  P840_CLOUD_TEMPERATURE_K,
  waterPermittivity,
} from '../../../src/link/atmosphere/p840.js';
import { col, ErrorStats, readReference } from './reference.js';

const CLOSED_FORM_REL = 1e-9;

describe('ITU-R P.840-9 cloud attenuation', () => {
  it("reproduces eps', eps'', eta, K_L and Ac for all 24 rows", () => {
    const rows = readReference('p840-9_cloud_attenuation.csv');
    expect(rows.length).toBe(24);
    const cols = ['eps_real', 'eps_imag', 'eta', 'KL_dB_per_kg_m2', 'Ac_dB'];
    const stats = cols.map((c) => new ErrorStats(`P.840-9 ${c}`));
    const w = { epsReal: 0, epsImag: 0, eta: 0, klDbPerKmPerGM3: 0 };
    for (const r of rows) {
      const f = col(r, 'f_GHz');
      waterPermittivity(f, P840_CLOUD_TEMPERATURE_K, w);
      const kl = cloudMassAbsorptionDbPerKgM2(f);
      const ac = cloudAttenuationDb(kl, col(r, 'L_kg_per_m2'), col(r, 'elevation_deg'));
      [w.epsReal, w.epsImag, w.eta, kl, ac].forEach((v, i) => stats[i]?.add(v, col(r, cols[i] as string)));
    }
    for (const s of stats) {
      console.info(s.summary());
      expect(s.max).toBeLessThanOrEqual(CLOSED_FORM_REL);
      expect(s.maxAbsWhereRefZero).toBeLessThanOrEqual(1e-12);
    }
  });

  it('throws ModelRangeError outside 1..200 GHz', () => {
    expect(() => cloudMassAbsorptionDbPerKgM2(0.5)).toThrow(ModelRangeError);
    expect(() => cloudMassAbsorptionDbPerKgM2(201)).toThrow(ModelRangeError);
  });
});
