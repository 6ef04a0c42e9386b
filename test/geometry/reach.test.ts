/**
 * The reach bound (src/geometry/reach.ts) and its use in the contact search.
 * 1. Against satellite.js 7.1.0 directly (`sgp4` on twoline2satrec, TEME turned Earth-fixed
 *    by the GMST rotation with `gstime`): over |t - t0| <= tau, sampled every second, the
 *    orbiter never leaves the tube lineDeviationKm gives about its tangent line, and its elevation from the invented sites stays inside
 *    elevationBoundsDeg (invented LEO, GEO, HEO and decaying orbits of
 *    test/fixtures/orbits.ts, seeded times).
 * 2. Against the previous implementation's path: the same search over a plain Target that
 *    wraps the same SGP4 target (no bound applies to it, so every refinement runs as
 *    before) finds exactly the same windows, value for value, with fewer SGP4 calls for
 *    the bounded search.
 */
import { gstime, sgp4, twoline2satrec } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { findPasses } from '../../src/geometry/passes.js';
import { elevationBoundsDeg, lineDeviationKm } from '../../src/geometry/reach.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import type { Site, Target } from '../../src/geometry/types.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import type { Mask } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, inventedFleet, inventedSites, makeTle, type InventedElements } from '../fixtures/orbits.js';
import { mulberry32 } from '../fixtures/prng.js';
import { plainTarget } from '../fixtures/plain-target.js';

const W = 7.292115e-5;

/** Earth-fixed state from satellite.js alone, or undefined on an SGP4 error. */
function ecefOf(rec: ReturnType<typeof twoline2satrec>, tMs: number, epochMs: number): Float64Array | undefined {
  const pv = sgp4(rec, (tMs - epochMs) / 60_000);
  if (!pv || typeof pv.position !== 'object') return undefined;
  const g = gstime(tMs / 86_400_000 + 2_440_587.5);
  const c = Math.cos(g);
  const s = Math.sin(g);
  const p = pv.position;
  const v = pv.velocity as { x: number; y: number; z: number };
  const x = c * p.x + s * p.y;
  const y = -s * p.x + c * p.y;
  return Float64Array.of(x, y, p.z, c * v.x + s * v.y + W * y, -s * v.x + c * v.y - W * x, v.z);
}

const fleet = inventedFleet();
const heo: InventedElements = { ...fleet['sso-550']!, catalogNumber: 90010, eccentricity: 0.7, meanMotionRevPerDay: 2.006, inclinationDeg: 63.4, bstar: 1e-5 };
const orbits: Record<string, InventedElements> = { ...fleet, heo, decaying: inventedDecayingOrbit() };

describe('lineDeviationKm and elevationBoundsDeg', () => {
  it('keeps the track near its tangent line and its elevation inside elevationBoundsDeg (satellite.js, 1 s sampling)', () => {
    const rnd = mulberry32(777);
    const sites: Site[] = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
    const look = newLook();
    const bounds = new Float64Array(2);
    let bounded = 0;
    let tight = 0;
    for (const [name, el] of Object.entries(orbits)) {
      const tle = makeTle(el);
      const rec = twoline2satrec(tle.line1, tle.line2);
      for (let n = 0; n < 40; n++) {
        const t0 = FIXTURE_EPOCH_MS + rnd() * 40 * 3_600_000;
        const tauS = 10 + rnd() * 140;
        const s0 = ecefOf(rec, t0, el.epochMs);
        if (!s0) continue;
        const dev = lineDeviationKm(s0, tauS);
        const site = sites[n % sites.length]!;
        const ok = elevationBoundsDeg(site, s0, tauS, bounds);
        if (!(dev >= 0)) {
          expect(ok).toBe(false);
          continue;
        }
        let worstKm = 0;
        let lo = Infinity;
        let hi = -Infinity;
        for (let dt = -tauS; dt <= tauS; dt += 1) {
          const s = ecefOf(rec, t0 + dt * 1000, el.epochMs);
          if (!s) continue;
          const off = [0, 1, 2].map((i) => s[i]! - (s0[i]! + s0[i + 3]! * dt));
          worstKm = Math.max(worstKm, Math.hypot(off[0]!, off[1]!, off[2]!));
          const e = lookFrom(site, s, look).elevationDeg;
          lo = Math.min(lo, e);
          hi = Math.max(hi, e);
        }
        expect(worstKm, `${name} at ${t0} tau ${tauS}`).toBeLessThanOrEqual(dev);
        if (!ok) continue;
        bounded++;
        expect(lo, `${name} at ${t0} tau ${tauS} from ${site.stationId}`).toBeGreaterThanOrEqual(bounds[0]!);
        expect(hi, `${name} at ${t0} tau ${tauS} from ${site.stationId}`).toBeLessThanOrEqual(bounds[1]!);
        if (bounds[1]! - bounds[0]! < hi - lo + 10) tight++;
      }
    }
    expect(bounded).toBeGreaterThan(150);
    expect(tight).toBeGreaterThan(0.5 * bounded); // a bound that says something
  });

  it('gives no bound below the Earth or at absurd speed', () => {
    expect(lineDeviationKm(Float64Array.of(6000, 0, 0, 0, 7.5, 0), 60)).toBeNaN();
    expect(lineDeviationKm(Float64Array.of(7000, 0, 0, 0, 300, 0), 60)).toBeNaN();
  });
});

const plain = plainTarget;

describe('the contact search with the reach bound', () => {
  const sites: Site[] = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = inventedSites.map((s) => prepareMask(s.mask as Mask));
  const span = { startMs: FIXTURE_EPOCH_MS, endMs: FIXTURE_EPOCH_MS + 3 * 86_400_000 };
  for (const name of Object.keys(orbits)) {
    it(`finds exactly the windows of the unbounded search (${name})`, () => {
      const set = () => [elementSetFromTle(makeTle(orbits[name]!), `fixture ${name}`)];
      const bounded = makeSgp4Target(name, set());
      const reference = makeSgp4Target(name, set());
      const a = findPasses(bounded, sites, masks, span, DEFAULT_SEARCH);
      const b = findPasses(plain(reference), sites, masks, span, DEFAULT_SEARCH);
      expect(a).toEqual(b);
      expect(bounded.failedAtMs).toBe(reference.failedAtMs);
      expect(bounded.evaluations).toBeLessThanOrEqual(reference.evaluations);
      if (name === 'leo-500-50') expect(bounded.evaluations).toBeLessThan(reference.evaluations);
    });
  }
});
