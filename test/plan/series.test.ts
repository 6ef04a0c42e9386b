// Contact series (src/plan/series.ts) against the plan's own results, which
// come from a separate path (the shared-grid link engine of src/plan/link.ts):
// - the trapezoid integral of the series rate over a 1 s series equals the
//   contact's volume from the plan at 1 s within 0.5 % (the same acceptance
//   figure as the volume test: the two grids are offset, so ACM steps fall
//   differently);
// - the series' highest elevation equals the contact's max elevation within
//   0.05 deg (1 s sampling of a LEO peak; the pass search refines the peak to 0.1 s);
// - at AOS and LOS the elevation is the station's constant mask (demo network
//   file: ALK 5 deg, MDL 7 deg) within 0.01 deg (edge tolerance 0.01 s x
//   < 0.5 deg/s elevation rate of a LEO near the horizon).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { highestVolumeContacts, seriesForContacts, seriesStepS } from '../../src/plan/series.js';

const scenario = loadScenario(demoFiles());
const start = scenario.span!.startMs;
const span = { startMs: start, endMs: start + 6 * 3_600_000 };
const plan = runPlan(scenario, span, { linkStepS: 1 });
const MASK_DEG: Record<string, number> = { ALK: 5, MDL: 7 };

const leo = plan.contacts.filter(
  (c) => ['KESTREL-1', 'HERON-2', 'PETREL-3'].includes(c.spacecraftId) && c.stationId in MASK_DEG && !c.aosClipped && !c.losClipped && (c.link?.volumeBits ?? 0) > 0,
);

describe('sampleContact on demo LEO contacts (first 6 h)', () => {
  it('has LEO contacts at the constant-mask stations', () => {
    expect(leo.length).toBeGreaterThanOrEqual(4);
  });

  const series = seriesForContacts(scenario, span, leo, 100_000); // 1 s steps

  it('integrates to the plan volume within 0.5 %', () => {
    let worst = 0;
    series.forEach((s, i) => {
      expect(s.stepS).toBe(1);
      let bits = 0;
      for (let k = 1; k < s.tMs.length; k++) bits += 0.5 * (s.rateBps[k - 1]! + s.rateBps[k]!) * ((s.tMs[k]! - s.tMs[k - 1]!) / 1000);
      const rel = Math.abs(bits - leo[i]!.link!.volumeBits) / leo[i]!.link!.volumeBits;
      worst = Math.max(worst, rel);
    });
    expect(worst).toBeLessThan(0.005);
  });

  it('peaks at the contact max elevation and starts and ends on the mask', () => {
    series.forEach((s, i) => {
      const c = leo[i]!;
      expect(s.tMs[0]).toBe(c.aosMs);
      expect(s.tMs[s.tMs.length - 1]).toBe(c.losMs);
      expect(Math.abs(Math.max(...s.elevationDeg) - c.maxElevationDeg)).toBeLessThan(0.05);
      expect(Math.abs(s.elevationDeg[0]! - MASK_DEG[c.stationId]!)).toBeLessThan(0.01);
      expect(Math.abs(s.elevationDeg[s.elevationDeg.length - 1]! - MASK_DEG[c.stationId]!)).toBeLessThan(0.01);
      // no data before AOS + acquisition time (10 s in the demo fleet file)
      for (let k = 0; k < s.tMs.length && s.tMs[k]! < c.aosMs + 10_000; k++) expect(s.rateBps[k]).toBe(0);
      for (const v of [...s.elevationDeg, ...s.rateBps, ...s.marginDb]) expect(Number.isFinite(v)).toBe(true);
    });
  });

  it('keeps charts small: at most maxPoints intervals, whole-second steps', () => {
    expect(seriesStepS(600, 240)).toBe(3);
    expect(seriesStepS(7 * 86_400, 240)).toBe(2520);
    const [s] = seriesForContacts(scenario, span, highestVolumeContacts(plan).slice(0, 1), 240);
    expect(s!.tMs.length).toBeLessThanOrEqual(241 + 1);
  });
});
