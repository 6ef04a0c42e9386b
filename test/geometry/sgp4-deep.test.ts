/**
 * The allocation-free deep-space SGP4 (src/geometry/targets/sgp4-deep.ts) against
 * satellite.js 7.1.0's `sgp4` itself: the same TEME position and velocity bit for bit
 * (Object.is on every component), the same error codes and satrec.error, for invented
 * deep-space orbits (test/fixtures/orbits.ts style: a geostationary one, 24-h resonance with
 * the Lyddane branch of the lunar-solar terms; a 12-h e = 0.72 one, the half-day resonance; a
 * 12-h circular and a 6-h one, not resonant; a geosynchronous e = 0.3 one at 40 deg) at
 * seeded times from 10 days before epoch to 10 days after, in random order, so the kept
 * integrator steps are used in every order and both ways in time.
 */
import { sgp4, twoline2satrec } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { newDeepSpaceTrack, sgp4DeepSpaceInto } from '../../src/geometry/targets/sgp4-deep.js';
import { inventedFleet, makeTle, type InventedElements } from '../fixtures/orbits.js';
import { mulberry32 } from '../fixtures/prng.js';

const fleet = inventedFleet();
const base = fleet['leo-500-50']!;
const orbits: Record<string, { el: InventedElements; irez: number }> = {
  'geo-30w': { el: fleet['geo-30w']!, irez: 1 },
  'heo-12h': {
    el: { ...base, catalogNumber: 90021, inclinationDeg: 63.4, eccentricity: 0.72, argPerigeeDeg: 270, meanAnomalyDeg: 10, meanMotionRevPerDay: 2.0057, bstar: 1e-5 },
    irez: 2,
  },
  'meo-12h': { el: { ...base, catalogNumber: 90022, inclinationDeg: 55, eccentricity: 0.002, meanMotionRevPerDay: 2.0057, bstar: 0 }, irez: 0 },
  'meo-6h': { el: { ...base, catalogNumber: 90023, inclinationDeg: 30, eccentricity: 0.01, meanMotionRevPerDay: 4.0, bstar: 0 }, irez: 0 },
  'gso-eccentric': {
    el: { ...base, catalogNumber: 90024, inclinationDeg: 40, eccentricity: 0.3, argPerigeeDeg: 120, meanMotionRevPerDay: 1.0027, bstar: 0 },
    irez: 1,
  },
};

describe('sgp4DeepSpaceInto', () => {
  for (const [name, { el, irez }] of Object.entries(orbits)) {
    it(`equals satellite.js sgp4 bit for bit (${name})`, () => {
      const tle = makeTle(el);
      const a = twoline2satrec(tle.line1, tle.line2);
      const b = twoline2satrec(tle.line1, tle.line2);
      expect(a.method).toBe('d');
      expect(a.irez).toBe(irez);
      const track = newDeepSpaceTrack();
      const rnd = mulberry32(name.length * 104729);
      const out = new Float64Array(6);
      let ok = 0;
      for (let n = 0; n < 2000; n++) {
        // whole and fractional minutes, some exactly on the integrator's 720-min steps
        const t = n % 10 === 0 ? Math.round(rnd() * 28 - 14) * 720 : (rnd() * 20 - 10) * 1440;
        const code = sgp4DeepSpaceInto(a, t, out, track);
        const pv = sgp4(b, t);
        expect(a.error).toBe(b.error);
        if (pv === null) {
          expect(code).toBe(b.error);
          continue;
        }
        expect(code).toBe(0);
        const p = pv.position;
        const v = pv.velocity as { x: number; y: number; z: number };
        [p.x, p.y, p.z, v.x, v.y, v.z].forEach((x, i) => expect(Object.is(out[i], x), `${name} t ${t} [${i}]`).toBe(true));
        for (const k of ['aycof', 'xlcof', 'con41', 'x1mth2', 'x7thm1', 'tempa', 't'] as const) expect(Object.is(a[k], b[k]), `${name} t ${t} ${k}`).toBe(true);
        ok++;
      }
      expect(ok).toBeGreaterThan(1900);
    });
  }
});
