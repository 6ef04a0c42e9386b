/**
 * The reach bound (src/geometry/reach.ts) and its use in the contact search.
 * 1. Against satellite.js 7.1.0 directly (`sgp4` on twoline2satrec, TEME turned Earth-fixed
 *    by the GMST rotation with `gstime`): over |t - t0| <= tau, sampled every second, the
 *    orbiter never leaves the ball reachRadiusKm gives (invented LEO, HEO and decaying
 *    orbits of test/fixtures/orbits.ts, seeded times).
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
import { reachAngleDeg, reachRadiusKm } from '../../src/geometry/reach.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import type { Site, Target } from '../../src/geometry/types.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import type { Mask } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, inventedFleet, inventedSites, makeTle, type InventedElements } from '../fixtures/orbits.js';
import { mulberry32 } from '../fixtures/prng.js';

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

describe('reachRadiusKm', () => {
  it('holds the orbiter over |t - t0| <= tau (satellite.js, 1 s sampling), and gives a bound for LEO scan steps', () => {
    const rnd = mulberry32(424242);
    let bounded = 0;
    for (const [name, el] of Object.entries(orbits)) {
      const tle = makeTle(el);
      const rec = twoline2satrec(tle.line1, tle.line2);
      for (let n = 0; n < 40; n++) {
        const t0 = FIXTURE_EPOCH_MS + rnd() * 40 * 3_600_000;
        const tauS = 10 + rnd() * 290;
        const s0 = ecefOf(rec, t0, el.epochMs);
        if (!s0) continue;
        const rho = reachRadiusKm(s0, tauS);
        if (name.startsWith('leo') || name.startsWith('sso')) {
          if (tauS <= 120) expect(rho, `${name} tau ${tauS}`).toBeGreaterThan(0);
        }
        if (!(rho >= 0)) continue;
        bounded++;
        let worst = 0;
        for (let dt = -tauS; dt <= tauS; dt += 1) {
          const s = ecefOf(rec, t0 + dt * 1000, el.epochMs);
          if (!s) continue;
          worst = Math.max(worst, Math.hypot(s[0]! - s0[0]!, s[1]! - s0[1]!, s[2]! - s0[2]!));
        }
        expect(worst, `${name} at ${t0} tau ${tauS}`).toBeLessThanOrEqual(rho);
      }
    }
    expect(bounded).toBeGreaterThan(150);
  });

  it('gives no bound below the Earth or at absurd speed', () => {
    expect(reachRadiusKm(Float64Array.of(6000, 0, 0, 0, 7.5, 0), 60)).toBeNaN();
    expect(reachRadiusKm(Float64Array.of(7000, 0, 0, 0, 300, 0), 60)).toBeNaN();
    expect(reachAngleDeg(100, 50)).toBe(Number.POSITIVE_INFINITY);
    expect(reachAngleDeg(500, 1000)).toBeCloseTo(30, 12); // asin(1/2)
  });
});

/** A Target that only forwards to another (not an SGP4 target itself: the search applies no bound to it). */
function plain(t: Target): Target {
  return {
    spacecraftId: t.spacecraftId,
    scanStepS: t.scanStepS,
    stateEcefAt: (tMs, out) => t.stateEcefAt(tMs, out),
    get evaluations() {
      return t.evaluations;
    },
    get failedAtMs() {
      return t.failedAtMs;
    },
    get failureReason() {
      return t.failureReason;
    },
  };
}

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
