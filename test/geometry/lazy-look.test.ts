/**
 * The contact search's elevation-only refinement (src/geometry/passes.ts lazyLook: with
 * constant masks and no further condition of sight, g needs no azimuth, so a refinement
 * evaluates the elevation alone and makes the azimuth and range of the memo's position only
 * where they are read) against its full path: the same sites with each constant mask given
 * as a flat profile of the same elevation (the mask's value there is c + w * 0 = c), which
 * evaluates every look angle through lookFrom at every step. Every window, angle and range
 * must be the same number, bit for bit (Object.is). Invented orbits and sites
 * (test/fixtures/orbits.ts), three days; the decaying orbit's track ends inside them.
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { findPassesWithRanges } from '../../src/geometry/passes.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import type { Site } from '../../src/geometry/types.js';
import { DEFAULT_SEARCH } from '../../src/geometry/types.js';
import type { Mask } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, inventedFleet, inventedSites, makeTle, type InventedElements } from '../fixtures/orbits.js';

const orbits: Record<string, InventedElements> = { ...inventedFleet(), decaying: inventedDecayingOrbit() };

describe('contact search, elevation-only refinement', () => {
  const constant = inventedSites.filter((s) => (s.mask as Mask).kind === 'constant');
  const sites: Site[] = constant.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
  const masks = constant.map((s) => prepareMask(s.mask as Mask));
  const flat = constant.map((s) => {
    const c = (s.mask as Mask & { kind: 'constant' }).elevationDeg;
    return prepareMask({ kind: 'profile', azimuthDeg: [0, 120, 240], elevationDeg: [c, c, c] });
  });
  const span = { startMs: FIXTURE_EPOCH_MS + 3_600_000, endMs: FIXTURE_EPOCH_MS + 3 * 86_400_000 };
  for (const name of Object.keys(orbits)) {
    it(`gives the full path's windows, angles and ranges bit for bit (${name})`, () => {
      const set = () => [elementSetFromTle(makeTle(orbits[name]!), `fixture ${name}`)];
      const lazy = findPassesWithRanges(makeSgp4Target(name, set()), sites, masks, span, DEFAULT_SEARCH);
      const full = findPassesWithRanges(makeSgp4Target(name, set()), sites, flat, span, DEFAULT_SEARCH);
      expect(lazy.passes.length).toBeGreaterThan(0);
      expect(lazy.passes.length).toBe(full.passes.length);
      lazy.passes.forEach((p, n) => {
        const q = full.passes[n]!;
        for (const key of Object.keys(q) as (keyof typeof q)[]) {
          expect(Object.is(p[key], q[key]), `${name} pass ${n} ${key}: ${String(p[key])} vs ${String(q[key])}`).toBe(true);
        }
        const a = lazy.rangesKm.get(p)!;
        const b = full.rangesKm.get(q)!;
        for (let j = 0; j < 3; j++) expect(Object.is(a[j], b[j]), `${name} pass ${n} range ${j}`).toBe(true);
      });
    });
  }
});
