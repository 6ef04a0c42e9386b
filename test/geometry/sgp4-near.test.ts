/**
 * The allocation-free near-Earth SGP4 (src/geometry/targets/sgp4-near.ts) against
 * satellite.js 7.1.0's `sgp4` itself: the same TEME position and velocity bit for bit
 * (Object.is on every component), the same error codes and satrec.error, for invented
 * orbits (test/fixtures/orbits.ts: SSO, LEO, an eccentric LEO, a drag-decaying one, a very
 * low one on the simplified drag branch; deep-space sets are not handled here) at seeded
 * times from 10 days before epoch to 10 days after.
 */
import { sgp4, twoline2satrec } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { nearEarthTerms, sgp4NearEarthInto } from '../../src/geometry/targets/sgp4-near.js';
import { inventedDecayingOrbit, inventedFleet, makeTle, meanMotionForAltitude, type InventedElements } from '../fixtures/orbits.js';
import { mulberry32 } from '../fixtures/prng.js';

const fleet = inventedFleet();
const orbits: Record<string, InventedElements> = {
  'sso-550': fleet['sso-550']!,
  'leo-500-50': fleet['leo-500-50']!,
  'leo-1200-70': fleet['leo-1200-70']!,
  decaying: inventedDecayingOrbit(),
  // perigee under 220 km: SGP4's simplified drag (isimp = 1)
  'low-180': { ...fleet['leo-500-50']!, catalogNumber: 90011, meanMotionRevPerDay: meanMotionForAltitude(180), bstar: 1e-4 },
  'eccentric-leo': { ...fleet['leo-500-50']!, catalogNumber: 90012, eccentricity: 0.05, meanMotionRevPerDay: 13.2 },
};

describe('sgp4NearEarthInto', () => {
  for (const [name, el] of Object.entries(orbits)) {
    it(`equals satellite.js sgp4 bit for bit (${name})`, () => {
      const tle = makeTle(el);
      const a = twoline2satrec(tle.line1, tle.line2);
      const b = twoline2satrec(tle.line1, tle.line2);
      expect(a.method).toBe('n');
      if (name === 'low-180') expect(a.isimp).toBe(1);
      const rnd = mulberry32(name.length * 7919);
      const out = new Float64Array(6);
      // the satrec-only terms made once, as a track does (Sgp4Target), and made on each call
      const terms = nearEarthTerms(a);
      const outEach = new Float64Array(6);
      let ok = 0;
      let failed = 0;
      for (let n = 0; n < 3000; n++) {
        const t = (rnd() * 20 - 10) * 1440;
        const codeEach = sgp4NearEarthInto(a, t, outEach);
        const code = sgp4NearEarthInto(a, t, out, terms);
        const pv = sgp4(b, t);
        expect(a.error).toBe(b.error);
        expect(codeEach).toBe(code);
        if (pv === null) {
          expect(code).toBe(b.error);
          failed++;
          continue;
        }
        expect(code).toBe(0);
        const p = pv.position;
        const v = pv.velocity as { x: number; y: number; z: number };
        [p.x, p.y, p.z, v.x, v.y, v.z].forEach((x, i) => {
          expect(Object.is(out[i], x), `${name} t ${t} [${i}]`).toBe(true);
          expect(Object.is(outEach[i], x), `${name} t ${t} [${i}] (terms made per call)`).toBe(true);
        });
        ok++;
      }
      expect(ok).toBeGreaterThan(0);
      if (name === 'decaying') expect(failed).toBeGreaterThan(0);
    });
  }
});
