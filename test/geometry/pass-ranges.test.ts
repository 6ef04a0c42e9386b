/**
 * findPassesWithRanges (src/geometry/passes.ts), whose AOS/TCA/LOS slant ranges replace the
 * contact's own light-time evaluations (src/plan/contacts.ts transmitTimes). Reference:
 * the previous implementation's path, a fresh SGP4 target's state at exactly each time
 * through lookFrom: every range the search gives must be that number, bit for bit, and the
 * windows must be those of findPasses. Invented orbits and sites (test/fixtures/orbits.ts),
 * three days; the decaying orbit's track ends inside them.
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { findPasses, findPassesWithRanges } from '../../src/geometry/passes.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import type { Site } from '../../src/geometry/types.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import type { Mask } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, inventedFleet, inventedSites, makeTle, type InventedElements } from '../fixtures/orbits.js';

const orbits: Record<string, InventedElements> = { ...inventedFleet(), decaying: inventedDecayingOrbit() };

describe('findPassesWithRanges', () => {
  const sites: Site[] = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = inventedSites.map((s) => prepareMask(s.mask as Mask));
  const span = { startMs: FIXTURE_EPOCH_MS + 3_600_000, endMs: FIXTURE_EPOCH_MS + 3 * 86_400_000 };
  for (const name of Object.keys(orbits)) {
    it(`gives the ranges a fresh evaluation gives, bit for bit (${name})`, () => {
      const set = () => [elementSetFromTle(makeTle(orbits[name]!), `fixture ${name}`)];
      const found = findPassesWithRanges(makeSgp4Target(name, set()), sites, masks, span, DEFAULT_SEARCH);
      expect(found.passes).toEqual(findPasses(makeSgp4Target(name, set()), sites, masks, span, DEFAULT_SEARCH));
      const fresh = makeSgp4Target(name, set());
      const state = new Float64Array(6);
      const look = newLook();
      let known = 0;
      let all = 0;
      for (const p of found.passes) {
        const site = sites.find((s) => s.stationId === p.stationId)!;
        const r = found.rangesKm.get(p)!;
        [p.aosMs, p.tcaMs, p.losMs].forEach((t, j) => {
          all++;
          if (Number.isNaN(r[j]!)) return;
          known++;
          expect(fresh.stateEcefAt(t, state)).toBe(true);
          expect(r[j]).toBe(lookFrom(site, state, look).rangeKm);
        });
      }
      expect(all).toBeGreaterThan(0);
      expect(known).toBeGreaterThan(0.9 * all);
    });
  }
});
