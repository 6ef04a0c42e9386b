// Fast path against the slow obvious one: buildAtmosphereTable(...).at(el) against direct
// atmosphereAt at a dense elevation sweep. Requirement (not a published value): agreement
// within 0.01 dB on every attenuation term and on totalDb, and within 0.1 K on the sky noise
// temperature, from minElevationDeg to 90°. Station values are invented.
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../../src/errors.js';
import { atmosphereAt, buildAtmosphereTable, type AtmosphereResult } from '../../../src/link/atmosphere/index.js';
import { invented } from './fixtures.js';

const hundredthDb = 0.01;
const tenthK = 0.1;
const newResult = (): AtmosphereResult => ({ gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 });

describe('AtmosphereTable', () => {
  const cases: Array<[string, number, Parameters<typeof invented>[1], number]> = [
    ['2.2 GHz', 2.2, {}, 0],
    ['8.4 GHz', 8.4, {}, 0],
    ['8.4 GHz, 34 m dish (scintillation cut-off)', 8.4, { antennaDiameterM: 34 }, 0],
    ['26 GHz', 26, {}, 0],
    ['26 GHz, p 0.01 %, min 3.3°', 26, { exceedancePercent: 0.01 }, 3.3],
    ['40 GHz', 40, {}, 0],
    ['40 GHz, high latitude, p 1 %', 40, { latitudeDeg: 55, exceedancePercent: 1, rainHeightKm: 2.2 }, 0],
    ['40 GHz, p 0.001 %, heavy rain', 40, { exceedancePercent: 0.001, rainRate001MmH: 120 }, 0],
  ];
  let worstDb = 0;
  for (const [label, f, extra, minEl] of cases) {
    it(`agrees with direct evaluation within 0.01 dB at ${label}`, () => {
      const station = invented(f, extra);
      const table = buildAtmosphereTable(station, minEl);
      expect(table.minElevationDeg).toBe(minEl);
      const a = newResult();
      const b = newResult();
      let maxDb = 0;
      let maxK = 0;
      let at = 0;
      const check = (el: number): void => {
        table.at(el, a);
        atmosphereAt({ ...station, elevationDeg: el }, b);
        for (const k of ['gasDb', 'rainDb', 'cloudDb', 'scintillationDb', 'totalDb'] as const) {
          const e = Math.abs(a[k] - b[k]);
          if (e > maxDb) {
            maxDb = e;
            at = el;
          }
        }
        maxK = Math.max(maxK, Math.abs(a.skyNoiseTempK - b.skyNoiseTempK));
      };
      for (let i = 0; i <= 40000; i++) check(minEl + ((90 - minEl) * i) / 40000);
      for (const el of [5, 5 - 1e-7, 25, 25 - 1e-7, 90]) if (el >= minEl) check(el);
      console.info(`table vs direct ${label}: max ${maxDb.toExponential(2)} dB at ${at.toFixed(4)} deg, max ${maxK.toExponential(2)} K`);
      worstDb = Math.max(worstDb, maxDb);
      expect(maxDb).toBeLessThanOrEqual(hundredthDb);
      expect(maxK).toBeLessThanOrEqual(tenthK);
    });
  }

  it('clamps minElevationDeg to >= 0 and rejects lookups below it', () => {
    const t = buildAtmosphereTable(invented(8.4), -3);
    expect(t.minElevationDeg).toBe(0);
    const out = newResult();
    expect(() => t.at(-0.01, out)).toThrow(ModelRangeError);
    expect(() => buildAtmosphereTable(invented(8.4), 10).at(9.99, out)).toThrow(ModelRangeError);
    expect(() => t.at(Number.NaN, out)).toThrow(ModelRangeError);
    console.info(`worst table error over all cases: ${worstDb.toExponential(2)} dB`);
  });
});
