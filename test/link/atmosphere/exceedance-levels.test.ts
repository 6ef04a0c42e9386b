// The exceedance axis of the atmosphere tables (buildExceedanceLevelsTable) against direct
// evaluation of the models at each level (gas + rain + cloud, ITU-R P.676-13, P.618-14
// §2.2.1.1, P.840-9; our own model code, run without the table): dense elevation sweep,
// tolerance 0.01 dB or 1e-3 relative, whichever is larger (the level grid is coarser than
// the budget's table; its values feed a year average).
import { describe, it, expect } from 'vitest';
import { buildExceedanceLevelsTable } from '../../../src/link/atmosphere/table.js';
import { absorptionDb, newAtmospherePrepared, prepareAtmosphere } from '../../../src/link/atmosphere/prepare.js';
import { EXPECTED_VOLUME_LEVELS } from '../../../src/link/atmosphere/exceedance-levels.js';
import type { AtmosphereStationInput } from '../../../src/link/atmosphere/index.js';
import { newRainDetail, rainAtExceedanceDb, rainAttenuationDb, rainAttenuationDetail } from '../../../src/link/atmosphere/p618-rain.js';

// an invented tropical station (inputs of the kind the ITU-R maps give there) at 20.2 GHz
const base: AtmosphereStationInput = {
  frequencyHz: 20.2e9, exceedancePercent: 1, latitudeDeg: 0.7, stationHeightKm: 0.025, polarizationTiltDeg: 45,
  antennaDiameterM: 6.1, apertureEfficiency: 0.6, rainRate001MmH: 105, rainHeightKm: 4.9,
  surfaceWaterVapourDensityGM3: 19, surfaceTemperatureK: 299, surfacePressureHpa: 1010, nWetMedian: 125, cloudLiquidWaterKgM2: 1.4,
};

describe('exceedance-level table', () => {
  it('reproduces the direct absorption at every level over 2..90 deg', () => {
    const inputs = EXPECTED_VOLUME_LEVELS.map((l) => {
      const i = { ...base, exceedancePercent: l.exceedancePercent };
      if (l.rain) return i;
      const { rainRate001MmH: _r, rainHeightKm: _h, ...dry } = i;
      return dry;
    });
    const table = buildExceedanceLevelsTable(inputs, 2);
    const preps = inputs.map((i) => prepareAtmosphere(i, newAtmospherePrepared()));
    const out = new Float64Array(inputs.length);
    let worst = 0;
    for (let el = 2; el <= 90; el += 0.037) {
      table.valuesAt(el, out);
      preps.forEach((p, k) => {
        const ref = absorptionDb(p, el);
        const err = Math.abs((out[k] as number) - ref);
        worst = Math.max(worst, err / Math.max(0.01, 1e-3 * ref));
      });
    }
    console.log(`exceedance-level table: worst error ${worst.toFixed(3)} of the tolerance`);
    expect(worst).toBeLessThanOrEqual(1);
  });

  it('has more absorption at a rarer exceedance (the distribution the expected volume integrates)', () => {
    const inputs = EXPECTED_VOLUME_LEVELS.map((l) => ({ ...base, exceedancePercent: l.exceedancePercent }));
    const table = buildExceedanceLevelsTable(inputs.slice(0, 10), 5);
    const out = new Float64Array(10);
    table.valuesAt(30, out);
    for (let k = 0; k + 1 < 10; k++) expect(out[k]!).toBeGreaterThan(out[k + 1]!);
  });

  it('P.618-14 step 10 alone from A0.01 gives the full steps 2-10 at every p (1e-12 relative)', () => {
    const at001 = prepareAtmosphere({ ...base, exceedancePercent: 0.01 }, newAtmospherePrepared());
    const d = newRainDetail();
    for (const p of [0.001, 0.004, 0.05, 0.7, 1, 2.5, 5]) {
      const prep = prepareAtmosphere({ ...base, exceedancePercent: p }, newAtmospherePrepared());
      for (const el of [1, 4.9, 10, 24.9, 25, 60, 90]) {
        rainAttenuationDetail(at001.rain, el, d);
        const full = rainAttenuationDb(prep.rain, el);
        expect(Math.abs(rainAtExceedanceDb(prep.rain, d, el, p) - full)).toBeLessThanOrEqual(1e-12 * full);
      }
    }
  });
});
