// Reference: ITU-R SG3 validation workbook Rev 8.3.0, sheet "P.618-14 A_Rain"
// (test/reference/itu-r/p618-14_rain_attenuation.csv), Rec. ITU-R P.618-14 §2.2.1.1 steps 1-10,
// run with the tabulated hR_km (P.839) and R001_mm_per_h (P.837) inputs.
// Tolerance: 1e-9 relative (closed form given all inputs; README of test/reference/itu-r);
// reference values of exactly 0 are checked absolutely (|calc| <= 1e-9).
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../../src/errors.js';
import {
  newRainDetail,
  newRainPath,
  prepareRainPath,
  rainAttenuationDetail,
} from '../../../src/link/atmosphere/p618-rain.js';
import { col, ErrorStats, readReference } from './reference.js';

const CLOSED_FORM_REL = 1e-9;
const ZERO_ABS_DB = 1e-9;

describe('ITU-R P.618-14 §2.2.1.1 rain attenuation', () => {
  it('reproduces every step and Ap for all 48 workbook rows', () => {
    const rows = readReference('p618-14_rain_attenuation.csv');
    expect(rows.length).toBe(48);
    const cols = ['Ls_km', 'LG_km', 'gammaR_dB_per_km', 'r001', 'nu001', 'LE_km', 'A001_dB', 'beta', 'Ap_dB'];
    const stats = cols.map((c) => new ErrorStats(`P.618-14 rain ${c}`));
    const rp = newRainPath();
    const d = newRainDetail();
    for (const r of rows) {
      prepareRainPath(
        col(r, 'f_GHz'),
        col(r, 'p_percent'),
        col(r, 'lat_deg_N'),
        col(r, 'hs_km'),
        col(r, 'hR_km'),
        col(r, 'R001_mm_per_h'),
        col(r, 'tau_deg'),
        rp,
      );
      rainAttenuationDetail(rp, col(r, 'elevation_deg'), d);
      const calc = [
        d.slantLengthKm,
        d.horizontalProjectionKm,
        d.gammaRDbPerKm,
        d.r001,
        d.nu001,
        d.effectiveLengthKm,
        d.a001Db,
        d.beta,
        d.attenuationDb,
      ];
      calc.forEach((v, i) => stats[i]?.add(v, col(r, cols[i] as string)));
    }
    for (const s of stats) {
      console.info(s.summary());
      expect(s.max).toBeLessThanOrEqual(CLOSED_FORM_REL);
      expect(s.maxAbsWhereRefZero).toBeLessThanOrEqual(ZERO_ABS_DB);
    }
  });

  it('gives 0 dB for R0.01 = 0 and for a station above the rain height', () => {
    // P.618-14 §2.2.1.1 steps 2 and 4.
    const rp = newRainPath();
    prepareRainPath(20, 0.01, 10, 0.1, 3, 0, 45, rp);
    expect(rainAttenuationDetail(rp, 30, newRainDetail())).toBe(0);
    prepareRainPath(20, 0.01, 10, 4, 3, 50, 45, rp);
    expect(rainAttenuationDetail(rp, 30, newRainDetail())).toBe(0);
  });

  it('throws ModelRangeError above 55 GHz and outside 0.001..5 %', () => {
    const rp = newRainPath();
    expect(() => prepareRainPath(56, 0.01, 10, 0, 3, 50, 45, rp)).toThrow(ModelRangeError);
    expect(() => prepareRainPath(20, 0.0009, 10, 0, 3, 50, 45, rp)).toThrow(ModelRangeError);
    expect(() => prepareRainPath(20, 5.1, 10, 0, 3, 50, 45, rp)).toThrow(ModelRangeError);
  });
});
