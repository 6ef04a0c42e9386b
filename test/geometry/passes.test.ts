/**
 * Contact-window search against the slow obvious one (STYLE.md 12): the fast search must
 * find the same windows as a 1 s brute-force scan of the same targets (none missed, none
 * extra), with edges within the scan's 1 s resolution, and satisfy the invariants of
 * STYLE.md 11. Orbits and sites are invented (test/fixtures/orbits.ts).
 */
import { describe, expect, it } from 'vitest';
import { findPassesBruteForce } from '../../src/geometry/bruteforce.js';
import { makeSite } from '../../src/geometry/earth.js';
import { maskElevationDeg, prepareMask } from '../../src/geometry/mask.js';
import { findPasses } from '../../src/geometry/passes.js';
import { makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import type { Pass, Site, Target } from '../../src/geometry/types.js';
import type { ElementSet, Mask, Span } from '../../src/scenario/types.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedDecayingOrbit, inventedFleet, inventedSites, makeTle } from '../fixtures/orbits.js';

const sites: Site[] = inventedSites.map((s) => makeSite(s.id, s.latitudeDeg, s.longitudeDeg, s.heightKm));
const masks: Mask[] = inventedSites.map((s) =>
  s.mask.kind === 'constant'
    ? { kind: 'constant', elevationDeg: s.mask.elevationDeg }
    : { kind: 'profile', azimuthDeg: [...s.mask.azimuthDeg], elevationDeg: [...s.mask.elevationDeg] },
);
const prepared = masks.map(prepareMask);
const SPAN: Span = { startMs: FIXTURE_EPOCH_MS + 6 * 3_600_000, endMs: FIXTURE_EPOCH_MS + 6 * 3_600_000 + 2 * 86_400_000 };
const ONE_SECOND_MS = 1000; // the brute-force scan's resolution

function setOf(name: string): ElementSet {
  return elementSetFromTle(makeTle(inventedFleet()[name]!), `fixture ${name}`);
}

/** g = elevation - mask at t for a site, from a fresh evaluation. */
function gAt(target: Target, siteIdx: number, tMs: number): { g: number; el: number } {
  const s = new Float64Array(6);
  if (!target.stateEcefAt(tMs, s)) return { g: Number.NaN, el: Number.NaN };
  const look = lookFrom(sites[siteIdx]!, s, newLook());
  return { g: look.elevationDeg - maskElevationDeg(prepared[siteIdx]!, look.azimuthDeg), el: look.elevationDeg };
}

function compare(name: string, fast: Pass[], slow: Pass[]): void {
  for (const site of sites) {
    const f = fast.filter((p) => p.stationId === site.stationId);
    const s = slow.filter((p) => p.stationId === site.stationId);
    expect(f.length, `${name} over ${site.stationId}: window count`).toBe(s.length);
    for (let i = 0; i < s.length; i++) {
      const a = f[i]!;
      const b = s[i]!;
      // brute AOS is the first visible sample: the true AOS lies within the second before it
      expect(b.aosMs - a.aosMs, `${name}/${site.stationId}#${i} AOS`).toBeGreaterThanOrEqual(0);
      expect(b.aosMs - a.aosMs).toBeLessThan(ONE_SECOND_MS);
      expect(a.losMs - b.losMs, `${name}/${site.stationId}#${i} LOS`).toBeGreaterThanOrEqual(0);
      expect(a.losMs - b.losMs).toBeLessThan(ONE_SECOND_MS);
      expect(a.aosClipped).toBe(b.aosClipped);
      expect(a.losClipped).toBe(b.losClipped);
      // the refined peak is at least as high as every sample (less 1e-5 deg: a 0.1 s peak-time
      // tolerance on a LEO peak, 0.5 el'' dt^2), and not higher than the elevation rate
      // allows within half a second of the best sample (LEO < 1 deg/s)
      expect(a.maxElevationDeg).toBeGreaterThanOrEqual(b.maxElevationDeg - 1e-5);
      expect(a.maxElevationDeg - b.maxElevationDeg).toBeLessThan(0.5);
    }
  }
}

function checkInvariants(name: string, target: Target, passes: Pass[], span: Span): void {
  const tolMs = 20; // 2 x edgeToleranceS
  for (const p of passes) {
    const i = sites.findIndex((s) => s.stationId === p.stationId);
    const tag = `${name}/${p.stationId} ${new Date(p.aosMs).toISOString()}`;
    expect(p.aosMs, tag).toBeGreaterThanOrEqual(span.startMs);
    expect(p.losMs, tag).toBeLessThanOrEqual(span.endMs);
    expect(p.losMs, tag).toBeGreaterThan(p.aosMs);
    expect(p.tcaMs).toBeGreaterThanOrEqual(p.aosMs);
    expect(p.tcaMs).toBeLessThanOrEqual(p.losMs);
    if (!p.aosClipped) {
      expect(gAt(target, i, p.aosMs).g, `${tag}: visible at AOS`).toBeGreaterThan(0);
      expect(gAt(target, i, p.aosMs - tolMs).g, `${tag}: hidden just before AOS`).toBeLessThanOrEqual(0);
    }
    if (!p.losClipped && !p.losTrackEnded) {
      expect(gAt(target, i, p.losMs).g, `${tag}: visible at LOS`).toBeGreaterThan(0);
      expect(gAt(target, i, p.losMs + tolMs).g, `${tag}: hidden just after LOS`).toBeLessThanOrEqual(0);
    }
    // max elevation is a local maximum (within the window) and matches its own time
    expect(gAt(target, i, p.tcaMs).el).toBeCloseTo(p.maxElevationDeg, 9);
    for (const dMs of [-1000, -200, 200, 1000]) {
      const t = p.tcaMs + dMs;
      if (t >= p.aosMs && t <= p.losMs) expect(gAt(target, i, t).el, `${tag}: peak`).toBeLessThanOrEqual(p.maxElevationDeg + 1e-6);
    }
  }
  for (const site of sites) {
    const mine = passes.filter((p) => p.stationId === site.stationId);
    for (let k = 1; k < mine.length; k++) expect(mine[k]!.aosMs, `${name}/${site.stationId}: no overlap`).toBeGreaterThan(mine[k - 1]!.losMs);
  }
  for (let k = 1; k < passes.length; k++) expect(passes[k]!.aosMs).toBeGreaterThanOrEqual(passes[k - 1]!.aosMs);
}

describe('findPasses vs 1 s brute force (invented LEO/GEO fleet, 4 sites, 2 days)', () => {
  for (const name of ['sso-550', 'leo-500-50', 'leo-1200-70', 'geo-30w']) {
    it(`finds the same windows for ${name}`, () => {
      const fastTarget = makeSgp4Target(name, [setOf(name)]);
      const fast = findPasses(fastTarget, sites, masks, SPAN);
      const slowTarget = makeSgp4Target(name, [setOf(name)]);
      const slow = findPassesBruteForce(slowTarget, sites, masks, SPAN, 1);
      console.log(`${name}: ${fast.length} windows; evaluations fast ${fastTarget.evaluations}, brute ${slowTarget.evaluations} (scan step ${fastTarget.scanStepS.toFixed(1)} s)`);
      expect(slow.length).toBeGreaterThan(0);
      compare(name, fast, slow);
      checkInvariants(name, makeSgp4Target(name, [setOf(name)]), fast, SPAN);
      // the fast path really ran: far fewer propagations than the scan
      expect(fastTarget.evaluations).toBeLessThan(slowTarget.evaluations / 20);
    });
  }

  it('gives a geostationary satellite one window spanning the whole span where it is up', () => {
    const fast = findPasses(makeSgp4Target('geo', [setOf('geo-30w')]), sites, masks, SPAN);
    const eq = fast.filter((p) => p.stationId === 'equator');
    expect(eq).toHaveLength(1);
    expect(eq[0]).toMatchObject({ aosMs: SPAN.startMs, losMs: SPAN.endMs, aosClipped: true, losClipped: true });
    expect(fast.filter((p) => p.stationId === 'south')).toHaveLength(0); // 170 E cannot see 30 W
  });

  it('marks windows cut by the span edges as clipped', () => {
    // a span starting and ending inside windows of the 1200 km orbit over the far-north site
    const name = 'leo-1200-70';
    const all = findPasses(makeSgp4Target(name, [setOf(name)]), sites, masks, SPAN).filter((p) => p.stationId === 'far-north');
    const w1 = all[2]!;
    const w2 = all[5]!;
    const cut: Span = { startMs: 0.5 * (w1.aosMs + w1.losMs), endMs: 0.5 * (w2.aosMs + w2.losMs) };
    const inner = findPasses(makeSgp4Target(name, [setOf(name)]), sites, masks, cut).filter((p) => p.stationId === 'far-north');
    expect(inner).toHaveLength(4);
    expect(inner[0]).toMatchObject({ aosMs: cut.startMs, aosClipped: true, losClipped: false });
    expect(Math.abs(inner[0]!.losMs - w1.losMs)).toBeLessThan(20);
    expect(inner[3]).toMatchObject({ losMs: cut.endMs, losClipped: true, aosClipped: false });
  });
});

describe('a decaying orbit', () => {
  it('ends its track with an SGP4 failure reason instead of throwing, and its windows end there', () => {
    const set = elementSetFromTle(makeTle(inventedDecayingOrbit()), 'fixture decaying');
    const target = makeSgp4Target('decay', [set]);
    const fast = findPasses(target, sites, masks, SPAN);
    expect(target.failedAtMs).toBeDefined();
    expect(target.failedAtMs!).toBeGreaterThan(SPAN.startMs);
    expect(target.failedAtMs!).toBeLessThan(SPAN.endMs);
    expect(target.failureReason).toMatch(/SGP4 error 6 \(orbit decayed/);
    const s = new Float64Array(6);
    expect(target.stateEcefAt(target.failedAtMs! + 60_000, s)).toBe(false);
    for (const p of fast) expect(p.losMs).toBeLessThanOrEqual(target.failedAtMs!);
    const slowTarget = makeSgp4Target('decay', [set]);
    const slow = findPassesBruteForce(slowTarget, sites, masks, SPAN, 1);
    expect(Math.abs(slowTarget.failedAtMs! - target.failedAtMs!)).toBeLessThan(ONE_SECOND_MS);
    compare('decay', fast, slow);
  });
});
