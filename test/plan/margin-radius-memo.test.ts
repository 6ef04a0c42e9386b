// maxGeocentricRadiusKm takes the distances of the samples the link stage's interpolator
// already propagated (geometry/interpolate.ts knownNodeRadiusKm) instead of propagating
// them again: the answer must be the unmemoised search's, bit for bit (the reference is
// the same search on a fresh target, which has no memo), and the memo must have served.
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { makeTarget } from '../../src/plan/contacts.js';
import { StateInterpolator } from '../../src/geometry/interpolate.js';
import { maxGeocentricRadiusKm } from '../../src/plan/margin.js';
import type { Target } from '../../src/geometry/types.js';

const scenario = loadScenario(demoFiles());
const span = { startMs: scenario.span!.startMs, endMs: scenario.span!.startMs + 86_400_000 };

/** Counts the target's own propagations. */
function counted(t: Target): { target: Target; calls: () => number } {
  let n = 0;
  const own = t.stateEcefAt.bind(t);
  (t as { stateEcefAt: Target['stateEcefAt'] }).stateEcefAt = (tMs, out) => {
    n++;
    return own(tMs, out);
  };
  return { target: t, calls: () => n };
}

describe('maxGeocentricRadiusKm with the interpolator nodes', () => {
  for (const id of ['KESTREL-1', 'PETREL-3', 'ANCHOR-G', 'MOONWREN']) {
    for (const cover of ['whole day', 'three hours'] as const) {
      it(`${id}, nodes over ${cover}: the fresh target's answer bit for bit, with fewer propagations`, () => {
        const sc = scenario.spacecraft.find((s) => s.id === id)!;
        const fresh = counted(makeTarget(sc, span));
        const expected = maxGeocentricRadiusKm(fresh.target, span)!;
        const used = makeTarget(sc, span);
        const interp = new StateInterpolator(used, span.startMs);
        const state = new Float64Array(6);
        const endMs = cover === 'whole day' ? span.endMs : span.startMs + 3 * 3_600_000;
        for (let t = span.startMs; t < endMs; t += 30_000) interp.stateAt(t, state);
        const memo = counted(used);
        const got = maxGeocentricRadiusKm(memo.target, span)!;
        expect(Object.is(got.radiusKm, expected.radiusKm)).toBe(true);
        expect(Object.is(got.atMs, expected.atMs)).toBe(true);
        expect(memo.calls()).toBeLessThan(fresh.calls());
      });
    }
  }
});
