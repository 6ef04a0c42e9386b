// Reference: ITU-R SG3 validation workbook Rev 8.3.0, sheet "P.618-14 Att_Tot"
// (p618-14_total_attenuation.csv, 36 rows; p618-14_total_attenuation_ccdf.csv, 15 rows),
// Rec. ITU-R P.618-14 §2.5 Eq. (64) applied to the tabulated AG, AC, AR, AS.
// Tolerance: 1e-9 relative (closed form).
import { describe, expect, it } from 'vitest';
import { totalAttenuationDb } from '../../../src/link/atmosphere/combine.js';
import { col, ErrorStats, readReference } from './reference.js';

const CLOSED_FORM_REL = 1e-9;

describe('ITU-R P.618-14 §2.5 total attenuation', () => {
  for (const file of ['p618-14_total_attenuation.csv', 'p618-14_total_attenuation_ccdf.csv']) {
    it(`reproduces AT for every row of ${file}`, () => {
      const rows = readReference(file);
      const s = new ErrorStats(`P.618-14 AT (${file})`);
      for (const r of rows) {
        s.add(totalAttenuationDb(col(r, 'AG_dB'), col(r, 'AR_dB'), col(r, 'AC_dB'), col(r, 'AS_dB')), col(r, 'AT_dB'));
      }
      console.info(s.summary());
      expect(s.count).toBe(rows.length);
      expect(s.max).toBeLessThanOrEqual(CLOSED_FORM_REL);
    });
  }
});
