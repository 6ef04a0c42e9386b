// Checks of the assembled atmosphere stage: input validation (ModelRangeError), rain
// absent -> 0 dB, no NaN over a sweep, and the P.618-14 §3 sky-noise relation
// Tsky = Tmr (1 - 10^(-A/10)) + 2.7 10^(-A/10) with A = gas + rain + cloud (scintillation
// absorbs nothing). Station values are invented.
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../../src/errors.js';
import { atmosphereAt, rainModelled, type AtmosphereResult } from '../../../src/link/atmosphere/index.js';
import { totalAttenuationDb } from '../../../src/link/atmosphere/combine.js';
import { skyNoiseTemperatureK } from '../../../src/link/atmosphere/sky-noise.js';
import { invented } from './fixtures.js';

const newResult = (): AtmosphereResult => ({ gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 });

describe('atmosphereAt', () => {
  it('throws ModelRangeError for out-of-range frequency, exceedance and elevation', () => {
    const out = newResult();
    const bad: Array<[number, Partial<Parameters<typeof invented>[1]>, number]> = [
      [0.5, {}, 30], // below 1 GHz
      [60, {}, 30], // P.618 rain above 55 GHz
      [26, { exceedancePercent: 0.0005 }, 30],
      [26, { exceedancePercent: 11 }, 30],
      [26, { exceedancePercent: Number.NaN }, 30],
      [26, {}, -0.1],
      [26, {}, 90.5],
      [26, {}, Number.NaN],
      [Number.NaN, {}, 30],
      [26, { rainHeightKm: undefined as never }, 30], // rain rate without rain height
    ];
    for (const [f, extra, el] of bad) {
      const input = { ...invented(f, extra), elevationDeg: el };
      if ('rainHeightKm' in extra) delete (input as { rainHeightKm?: number }).rainHeightKm;
      expect(() => atmosphereAt(input, out), `f=${f} ${JSON.stringify(extra)} el=${el}`).toThrow(ModelRangeError);
    }
    // without rain the limit is P.840's 200 GHz
    const noRain = { ...invented(150), elevationDeg: 30 };
    delete (noRain as { rainRate001MmH?: number }).rainRate001MmH;
    delete (noRain as { rainHeightKm?: number }).rainHeightKm;
    expect(() => atmosphereAt(noRain, out)).not.toThrow();
    expect(() => atmosphereAt({ ...noRain, frequencyHz: 201e9 }, out)).toThrow(ModelRangeError);
  });

  it('reports rain as not modelled and gives 0 dB rain when R0.01 and hR are absent', () => {
    const withRain = { ...invented(26), elevationDeg: 20 };
    const noRain = { ...withRain };
    delete (noRain as { rainRate001MmH?: number }).rainRate001MmH;
    delete (noRain as { rainHeightKm?: number }).rainHeightKm;
    expect(rainModelled(withRain)).toBe(true);
    expect(rainModelled(noRain)).toBe(false);
    const a = newResult();
    const b = newResult();
    atmosphereAt(withRain, a);
    atmosphereAt(noRain, b);
    expect(a.rainDb).toBeGreaterThan(0);
    expect(b.rainDb).toBe(0);
    expect(b.gasDb).toBe(a.gasDb);
  });

  it('combines per P.618-14 §2.5 and derives sky noise from absorptive terms only (§3)', () => {
    const out = newResult();
    atmosphereAt({ ...invented(40), elevationDeg: 12 }, out);
    expect(out.scintillationDb).toBeGreaterThan(0);
    expect(out.totalDb).toBe(totalAttenuationDb(out.gasDb, out.rainDb, out.cloudDb, out.scintillationDb));
    const a = out.gasDb + out.rainDb + out.cloudDb;
    const t = Math.pow(10, -a / 10);
    expect(out.skyNoiseTempK).toBeCloseTo(275 * (1 - t) + 2.7 * t, 9);
    // limits of the §3 relation: clear sky -> cosmic background, opaque -> Tmr
    expect(skyNoiseTemperatureK(0)).toBeCloseTo(2.7, 12);
    expect(skyNoiseTemperatureK(300)).toBeCloseTo(275, 9);
  });

  it('produces no NaN and no negative term over a sweep of frequency, elevation, exceedance and latitude', () => {
    const out = newResult();
    let n = 0;
    for (const f of [1, 2.2, 8.4, 12, 22.235, 26, 32, 40, 55]) {
      for (const p of [0.001, 0.01, 0.1, 1, 5, 7.5, 10]) {
        for (const lat of [-80, -35.9, 0, 36, 65]) {
          for (let el = 0; el <= 90; el += 2.5) {
            for (const d of [0.6, 34]) {
              atmosphereAt({ ...invented(f, { exceedancePercent: p, latitudeDeg: lat, antennaDiameterM: d }), elevationDeg: el }, out);
              for (const v of Object.values(out)) {
                expect(Number.isFinite(v)).toBe(true);
                expect(v).toBeGreaterThanOrEqual(0);
              }
              n++;
            }
          }
        }
      }
    }
    expect(n).toBe(9 * 7 * 5 * 37 * 2);
  });
});
