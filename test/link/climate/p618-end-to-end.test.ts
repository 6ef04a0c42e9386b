// End to end: ITU-R P.618-14 total attenuation with every climate input read from the
// shipped ITU-R maps for the site (src/link/climate/station.ts), against the ITU-R SG3
// validation workbook Rev 8.3.0, sheet P.618-14 Att_Tot (p618-14_total_attenuation.csv,
// 36 rows, and p618-14_total_attenuation_ccdf.csv for p <= 5 %; copies in
// test/reference/itu-r/, source note there). Each component is compared:
//  - AC (P.840-9 L at 5 %, held for p < 5 % per P.618-14 §2.5) and AS (P.453-14 Nwet):
//    1e-4 relative (read from a map).
//  - AR (P.837-7 R0.01 from the shipped 0.25 deg grid, P.839-4 hR): the grid's R0.01 is
//    within 1.3e-3 of the workbook's full method (p837-7.test.ts), which AR follows with
//    about its exponent; measured 9.2e-4, tolerance 1.5e-3 relative.
//  - AG: the workbook takes it from P.676-13 Annex 2 §2.3 (statistical: surface pressure and
//    temperature exceeded at p, V from the P.2145 maps and the KV coefficient table), data
//    not in the shipped maps; the program uses Annex 2 §2.1 with the P.835-6 pressure, the
//    P.1510-1 annual mean temperature and the P.836-6 rho at 5 %. The difference is
//    measured and bounded here (measured: 0.278 dB, 43 % of AG; bounds 0.3 dB, 50 %), not
//    claimed as agreement.
//  - AT: follows from the above; bounded by the AG difference.
import { describe, expect, it } from 'vitest';
import { atmosphereAt, type AtmosphereResult } from '../../../src/link/atmosphere/index.js';
import { stationClimate } from '../../../src/link/climate/station.js';
import { col, ErrorStats, readReference } from '../atmosphere/reference.js';

function compute(r: Record<string, number>): AtmosphereResult {
  const p = col(r, 'p_percent');
  const c = stationClimate({ id: 'WB', latitudeDeg: col(r, 'lat_deg_N'), longitudeDeg: col(r, 'lon_deg_E'), heightKm: col(r, 'hs_km'), climate: {} }, p).values;
  const out: AtmosphereResult = { gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 };
  atmosphereAt(
    {
      frequencyHz: col(r, 'f_GHz') * 1e9,
      elevationDeg: col(r, 'elevation_deg'),
      exceedancePercent: p,
      latitudeDeg: col(r, 'lat_deg_N'),
      stationHeightKm: col(r, 'hs_km'),
      polarizationTiltDeg: col(r, 'tau_deg'),
      antennaDiameterM: col(r, 'D_m'),
      apertureEfficiency: col(r, 'eta'),
      rainRate001MmH: c.rainRate001MmH,
      rainHeightKm: c.rainHeightKm,
      surfaceWaterVapourDensityGM3: c.surfaceWaterVapourDensityGM3,
      surfaceTemperatureK: c.surfaceTemperatureK,
      surfacePressureHpa: c.surfacePressureHpa,
      nWetMedian: c.nWetMedian,
      cloudLiquidWaterKgM2: c.cloudLiquidWaterKgM2,
    },
    out,
  );
  return out;
}

describe('ITU-R P.618-14 total attenuation with every input from the maps', () => {
  const rows = [...readReference('p618-14_total_attenuation.csv'), ...readReference('p618-14_total_attenuation_ccdf.csv').filter((r) => col(r, 'p_percent') <= 5)];
  it('AC, AS, AR, AG and AT of every workbook row', () => {
    const ac = new ErrorStats('AC');
    const as = new ErrorStats('AS');
    const ar = new ErrorStats('AR');
    const ag = new ErrorStats('AG');
    const at = new ErrorStats('AT');
    let agMaxDb = 0;
    let atMaxDb = 0;
    for (const r of rows) {
      const x = compute(r);
      ac.add(x.cloudDb, col(r, 'AC_dB'));
      as.add(x.scintillationDb, col(r, 'AS_dB'));
      ar.add(x.rainDb, col(r, 'AR_dB'));
      ag.add(x.gasDb, col(r, 'AG_dB'));
      at.add(x.totalDb, col(r, 'AT_dB'));
      agMaxDb = Math.max(agMaxDb, Math.abs(x.gasDb - col(r, 'AG_dB')));
      atMaxDb = Math.max(atMaxDb, Math.abs(x.totalDb - col(r, 'AT_dB')));
    }
    console.info([ac, as, ar, ag, at].map((s) => s.summary()).join('\n'), `\nAG max |diff| ${agMaxDb.toFixed(3)} dB, AT max |diff| ${atMaxDb.toFixed(3)} dB`);
    expect(ac.count).toBe(rows.length);
    expect(ac.max).toBeLessThanOrEqual(1e-4);
    expect(as.max).toBeLessThanOrEqual(1e-4);
    expect(ar.max).toBeLessThanOrEqual(1.5e-3);
    expect(agMaxDb).toBeLessThanOrEqual(0.3);
    expect(ag.max).toBeLessThanOrEqual(0.5);
    expect(atMaxDb).toBeLessThanOrEqual(0.3);
  });
});
