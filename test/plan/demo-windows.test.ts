// The contact search on the whole demo week (8 invented spacecraft: LEO, a lunar orbiter
// and a lunar surface site, geostationary, deep space fixed and from an OEM file; 6
// invented stations, one with a terrain horizon)
// against the slow, obvious 1 s brute-force scan: the same windows (none missed,
// none extra), AOS/LOS within 1 s of the scan, and the invariants of every window.
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { prepareGeometry, findContacts, makeTarget } from '../../src/plan/contacts.js';
import { findPassesBruteForce } from '../../src/geometry/bruteforce.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { maskElevationDeg } from '../../src/geometry/mask.js';
import type { Pass } from '../../src/geometry/types.js';

const scenario = loadScenario(demoFiles());
const span = scenario.span!;
const geometry = prepareGeometry(scenario, span);
const fast = findContacts(scenario, geometry, span).contacts;

describe('demo week: fast contact search vs 1 s brute force', () => {
  const slow: Pass[] = [];
  let bruteEvaluations = 0;
  for (const sc of scenario.spacecraft) {
    const target = makeTarget(sc, span);
    slow.push(...findPassesBruteForce(target, geometry.sites, geometry.masks, span, 1));
    bruteEvaluations += target.evaluations;
  }
  const key = (p: Pass) => `${p.spacecraftId}|${p.stationId}`;

  it('finds the same windows, edges within 1 s', () => {
    const groups = new Map<string, { f: Pass[]; s: Pass[] }>();
    for (const p of fast) (groups.get(key(p)) ?? groups.set(key(p), { f: [], s: [] }).get(key(p))!).f.push(p);
    for (const p of slow) (groups.get(key(p)) ?? groups.set(key(p), { f: [], s: [] }).get(key(p))!).s.push(p);
    let maxEdgeS = 0;
    for (const [k, g] of groups) {
      g.f.sort((a, b) => a.aosMs - b.aosMs);
      g.s.sort((a, b) => a.aosMs - b.aosMs);
      expect(g.f.length, `window count for ${k}`).toBe(g.s.length);
      g.f.forEach((p, i) => {
        const q = g.s[i]!;
        const d = Math.max(Math.abs(p.aosMs - q.aosMs), Math.abs(p.losMs - q.losMs)) / 1000;
        maxEdgeS = Math.max(maxEdgeS, d);
        expect(p.aosClipped).toBe(q.aosClipped);
        expect(p.losClipped).toBe(q.losClipped);
      });
    }
    expect(maxEdgeS).toBeLessThan(1);
    expect(fast.length).toBeGreaterThan(500);
  });

  it('needs far fewer propagations than the brute force', () => {
    let fastEvaluations = 0;
    for (const t of geometry.targets.values()) fastEvaluations += t.evaluations;
    expect(fastEvaluations * 20).toBeLessThan(bruteEvaluations);
  });

  it('holds the invariants on every window', () => {
    const state = new Float64Array(6);
    const look = newLook();
    const g = (p: Pass, tMs: number) => {
      const i = geometry.sites.findIndex((s) => s.stationId === p.stationId);
      const target = geometry.targets.get(p.spacecraftId)!;
      expect(target.stateEcefAt(tMs, state)).toBe(true);
      lookFrom(geometry.sites[i]!, state, look);
      const gMask = look.elevationDeg - maskElevationDeg(geometry.masks[i]!, look.azimuthDeg);
      const gSight = target.sightMarginDeg ? target.sightMarginDeg(geometry.sites[i]!.ecefKm) : Infinity;
      return { g: Math.min(gMask, gSight), el: look.elevationDeg };
    };
    const byPair = new Map<string, Pass[]>();
    for (const p of fast) {
      expect(p.aosMs).toBeGreaterThanOrEqual(span.startMs);
      expect(p.losMs).toBeLessThanOrEqual(span.endMs);
      expect(p.losMs).toBeGreaterThan(p.aosMs);
      expect(p.tcaMs).toBeGreaterThanOrEqual(p.aosMs);
      expect(p.tcaMs).toBeLessThanOrEqual(p.losMs);
      // AOS an upward crossing of the mask, LOS a downward one (0.5 s either side)
      if (!p.aosClipped) {
        expect(g(p, p.aosMs - 500).g).toBeLessThan(0);
        expect(g(p, p.aosMs + 500).g).toBeGreaterThan(0);
      }
      if (!p.losClipped) {
        expect(g(p, p.losMs - 500).g).toBeGreaterThan(0);
        expect(g(p, p.losMs + 500).g).toBeLessThan(0);
      }
      // the maximum is a local maximum (5 s either side), unless at a clipped edge
      if (p.tcaMs - 5000 > p.aosMs && p.tcaMs + 5000 < p.losMs) {
        const top = g(p, p.tcaMs).el;
        expect(Math.abs(top - p.maxElevationDeg)).toBeLessThan(1e-6);
        expect(g(p, p.tcaMs - 5000).el).toBeLessThanOrEqual(top + 1e-9);
        expect(g(p, p.tcaMs + 5000).el).toBeLessThanOrEqual(top + 1e-9);
      }
      byPair.set(key(p), [...(byPair.get(key(p)) ?? []), p]);
    }
    // no overlapping or doubled windows per pair
    for (const list of byPair.values()) {
      list.sort((a, b) => a.aosMs - b.aosMs);
      for (let i = 1; i < list.length; i++) expect(list[i]!.aosMs).toBeGreaterThan(list[i - 1]!.losMs);
    }
  });

  // Issue: the refinement memo was keyed by time only, so a window cut by the span edge
  // read another station's look angles at that instant. Check every window (clipped ones
  // included) against a direct evaluation of lookFrom (topocentric.ts, itself checked
  // against astronomy-engine in test/geometry/look.test.ts) for its own station, and the
  // maximum against a scan of the window refined by golden-section search. Tolerance 0.01 deg (the printed precision).
  it('reports each window with its own station\'s look angles at AOS, LOS and the maximum (0.01 deg)', () => {
    const state = new Float64Array(6);
    const look = newLook();
    const at = (p: Pass, tMs: number) => {
      const i = geometry.sites.findIndex((s) => s.stationId === p.stationId);
      expect(geometry.targets.get(p.spacecraftId)!.stateEcefAt(tMs, state)).toBe(true);
      lookFrom(geometry.sites[i]!, state, look);
      return { az: look.azimuthDeg, el: look.elevationDeg };
    };
    const azDiff = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
    let clipped = 0;
    for (const p of fast) {
      if (p.aosClipped || p.losClipped) clipped++;
      const a = at(p, p.aosMs);
      const l = at(p, p.losMs);
      expect(azDiff(p.aosAzimuthDeg, a.az), `AOS azimuth ${p.spacecraftId}/${p.stationId} ${p.aosMs}`).toBeLessThan(0.01);
      expect(azDiff(p.losAzimuthDeg, l.az), `LOS azimuth ${p.spacecraftId}/${p.stationId} ${p.losMs}`).toBeLessThan(0.01);
      expect(Math.abs(p.aosElevationDeg! - a.el), `AOS elevation ${p.spacecraftId}/${p.stationId}`).toBeLessThan(0.01);
      expect(Math.abs(p.losElevationDeg! - l.el), `LOS elevation ${p.spacecraftId}/${p.stationId}`).toBeLessThan(0.01);
      expect(Math.abs(p.maxElevationDeg - at(p, p.tcaMs).el), `max at TCA ${p.spacecraftId}/${p.stationId}`).toBeLessThan(0.01);
      // scan (1 s, or 1/2000 of a long window), then golden-section around the best sample
      const stepMs = Math.max(1000, (p.losMs - p.aosMs) / 2000);
      let bestT = p.aosMs;
      let best = -Infinity;
      for (let t = p.aosMs; t <= p.losMs; t += stepMs) {
        const e = at(p, t).el;
        if (e > best) [best, bestT] = [e, t];
      }
      let lo = Math.max(p.aosMs, bestT - stepMs);
      let hi = Math.min(p.losMs, bestT + stepMs);
      const gr = (Math.sqrt(5) - 1) / 2;
      while (hi - lo > 1) {
        const x1 = hi - gr * (hi - lo);
        const x2 = lo + gr * (hi - lo);
        if (at(p, x1).el >= at(p, x2).el) hi = x2;
        else lo = x1;
      }
      const scanMax = Math.max(a.el, l.el, best, at(p, 0.5 * (lo + hi)).el);
      expect(Math.abs(p.maxElevationDeg - scanMax), `max vs scan ${p.spacecraftId}/${p.stationId}`).toBeLessThan(0.01);
    }
    expect(clipped).toBeGreaterThan(10);
  });

  it('gives the geostationary craft one window spanning the week where it is visible', () => {
    const geo = fast.filter((p) => p.spacecraftId === 'ANCHOR-G');
    expect(geo.length).toBeGreaterThan(0);
    for (const p of geo) {
      expect(p.aosMs).toBe(span.startMs);
      expect(p.losMs).toBe(span.endMs);
      expect(p.aosClipped && p.losClipped).toBe(true);
    }
  });
});
