/**
 * The atmosphere and exceedance-level tables try the interval of their last lookup first
 * (src/link/atmosphere/table.ts HermiteGrid.locate). Reference: the previous
 * implementation's path, a lookup on a table that has seen no other lookup (its search
 * starts cold): every value must be the same number bit for bit (Object.is), whatever the
 * order of lookups (slow sweeps as a pass gives, random jumps, node values and 90 deg).
 * Station values are invented (fixtures.ts).
 */
import { describe, expect, it } from 'vitest';
import { buildAtmosphereTable, type AtmosphereResult } from '../../../src/link/atmosphere/index.js';
import { buildExceedanceLevelsTable } from '../../../src/link/atmosphere/table.js';
import { invented } from './fixtures.js';
import { mulberry32 } from '../../fixtures/prng.js';

const newResult = (): AtmosphereResult => ({ gasDb: 0, rainDb: 0, cloudDb: 0, scintillationDb: 0, totalDb: 0, skyNoiseTempK: 0 });

/** Elevations: a slow rise and fall (a pass), random jumps, whole degrees, the ends. */
function elevations(minEl: number): number[] {
  const rnd = mulberry32(31337);
  const out: number[] = [];
  for (let e = minEl; e <= 90; e += 1.37) out.push(e);
  for (let e = 90; e >= minEl; e -= 1.53) out.push(e);
  for (let n = 0; n < 100; n++) out.push(minEl + (90 - minEl) * rnd());
  for (let e = Math.ceil(minEl); e <= 90; e += 5) out.push(e);
  out.push(minEl, 90, minEl);
  return out;
}

describe('table lookups from the last interval', () => {
  it('give the cold lookup values bit for bit (atmosphere table)', () => {
    for (const [f, minEl] of [
      [8.4, 0],
      [26, 3.3],
      [40, 5],
    ] as const) {
      const warm = buildAtmosphereTable(invented(f, {}), minEl);
      const a = newResult();
      const b = newResult();
      for (const el of elevations(minEl)) {
        warm.at(el, a);
        buildAtmosphereTable(invented(f, {}), minEl).at(el, b); // cold: a table of its own
        for (const k of Object.keys(a) as (keyof AtmosphereResult)[]) expect(Object.is(a[k], b[k]), `${f} GHz at ${el} deg: ${k}`).toBe(true);
      }
    }
  });

  it('give the cold lookup values bit for bit (exceedance-level table)', () => {
    const inputs = [0.01, 0.1, 1, 10].map((p) => invented(26, { exceedancePercent: p }));
    const warm = buildExceedanceLevelsTable(inputs, 2);
    const a = new Float64Array(inputs.length);
    const b = new Float64Array(inputs.length);
    for (const el of elevations(2)) {
      warm.valuesAt(el, a);
      buildExceedanceLevelsTable(inputs, 2).valuesAt(el, b);
      for (let k = 0; k < a.length; k++) expect(Object.is(a[k], b[k]), `at ${el} deg: level ${k}`).toBe(true);
    }
  });
});
