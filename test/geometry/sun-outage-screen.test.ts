/**
 * The Sun-outage search's screen (src/geometry/sun-outage.ts surelyClear), against the
 * previous implementation's path: the same search over a plain Target wrapping the same
 * SGP4 target (the screen applies to one-set SGP4 targets only, so over the wrapper every
 * contact is scanned as before) must give exactly the same windows, value for value, for
 * every contact of invented LEO and GEO orbits at invented sites over three days
 * (test/fixtures/orbits.ts), for beams from 0.1 deg to 30 deg (the wide ones do meet the Sun).
 * The screened search must also make fewer state evaluations (it does answer).
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { findPasses } from '../../src/geometry/passes.js';
import { SkyBodies } from '../../src/geometry/sky-bodies.js';
import { SunOutageSearch } from '../../src/geometry/sun-outage.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import type { Site, Target } from '../../src/geometry/types.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import type { Mask } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedFleet, inventedSites, makeTle } from '../fixtures/orbits.js';
import { plainTarget } from '../fixtures/plain-target.js';

const plain = plainTarget;

describe('the Sun-outage screen', () => {
  const sites: Site[] = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = inventedSites.map((s) => prepareMask(s.mask as Mask));
  const span = { startMs: FIXTURE_EPOCH_MS, endMs: FIXTURE_EPOCH_MS + 3 * 86_400_000 };
  const sky = new SkyBodies(span);
  const fleet = inventedFleet();
  for (const name of ['sso-550', 'leo-500-50', 'leo-1200-70', 'geo-30w']) {
    it(`gives exactly the windows of the unscreened search (${name})`, () => {
      const set = () => [elementSetFromTle(makeTle(fleet[name]!), `fixture ${name}`)];
      const screened = makeSgp4Target(name, set());
      const reference = makeSgp4Target(name, set());
      const passes = findPasses(makeSgp4Target(name, set()), sites, masks, span, DEFAULT_SEARCH);
      const a = new SunOutageSearch(screened, sky);
      const b = new SunOutageSearch(plain(reference), sky);
      let windows = 0;
      for (const p of passes) {
        const site = sites.find((s) => s.stationId === p.stationId)!;
        for (const hpbw of [0.1, 1, 8, 30]) {
          const wa = a.find(site, p.aosMs, p.losMs, hpbw, p.maxElevationDeg);
          const wb = b.find(site, p.aosMs, p.losMs, hpbw, p.maxElevationDeg);
          expect(wa).toEqual(wb);
          windows += wb.length;
        }
      }
      if (name !== 'geo-30w') expect(windows).toBeGreaterThan(0);
      expect(screened.evaluations).toBeLessThan(reference.evaluations);
    });
  }
});
