/**
 * elevationFrom (src/geometry/topocentric.ts), the contact search's scan for stations
 * with a constant mask, against the previous implementation's path lookFrom(...).elevationDeg:
 * the same number bit for bit (Object.is) for seeded states from 200 km to 400,000 km around
 * seeded sites (invented), above and below their horizons.
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { elevationFrom, lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { mulberry32 } from '../fixtures/prng.js';

describe('elevationFrom', () => {
  it('equals lookFrom elevation bit for bit', () => {
    const rnd = mulberry32(2718);
    const look = newLook();
    const state = new Float64Array(6);
    let above = 0;
    for (let n = 0; n < 20000; n++) {
      const site = makeSite('S', -89 + 178 * rnd(), -180 + 360 * rnd(), 4 * rnd());
      const r = 6578 + (rnd() < 0.8 ? 3000 * rnd() : 4e5 * rnd());
      const z = 2 * rnd() - 1;
      const phi = 2 * Math.PI * rnd();
      const c = Math.sqrt(1 - z * z);
      state.set([r * c * Math.cos(phi), r * c * Math.sin(phi), r * z, 7 * rnd() - 3.5, 7 * rnd() - 3.5, 7 * rnd() - 3.5]);
      const e = elevationFrom(site, state);
      expect(Object.is(e, lookFrom(site, state, look).elevationDeg)).toBe(true);
      if (e > 0) above++;
    }
    expect(above).toBeGreaterThan(1000);
  });
});
