/**
 * SGP4 target behaviour: nearest-epoch set selection and the element-age warning
 * (DESIGN.md: warn when an element set is more than 14 days from the span; common practice).
 */
import { describe, expect, it } from 'vitest';
import { elementAgeWarning, makeSgp4Target } from '../../src/geometry/targets/sgp4.js';
import { elementSetFromTle, FIXTURE_EPOCH_MS, inventedFleet, makeTle } from '../fixtures/orbits.js';

const DAY_MS = 86_400_000;
const base = inventedFleet()['leo-500-50']!;
const setA = elementSetFromTle(makeTle(base), 'set A');
// a second, later set of the same spacecraft with a slightly different mean anomaly
const setB = elementSetFromTle(makeTle({ ...base, epochMs: FIXTURE_EPOCH_MS + 4 * DAY_MS, meanAnomalyDeg: 100 }), 'set B');

describe('SGP4 target with several element sets', () => {
  it('uses at each time the set whose epoch is nearest (switch at the midpoint)', () => {
    const both = makeSgp4Target('x', [setB, setA]);
    const onlyA = makeSgp4Target('a', [setA]);
    const onlyB = makeSgp4Target('b', [setB]);
    const s = new Float64Array(6);
    const r = new Float64Array(6);
    for (const [t, ref] of [
      [FIXTURE_EPOCH_MS + 1 * DAY_MS, onlyA],
      [FIXTURE_EPOCH_MS + 2 * DAY_MS - 1, onlyA],
      [FIXTURE_EPOCH_MS + 2 * DAY_MS + 1, onlyB],
      [FIXTURE_EPOCH_MS + 5 * DAY_MS, onlyB],
      [FIXTURE_EPOCH_MS - 1 * DAY_MS, onlyA],
    ] as const) {
      both.stateEcefAt(t, s);
      ref.stateEcefAt(t, r);
      expect(Array.from(s)).toEqual(Array.from(r));
    }
    expect(both.evaluations).toBe(5);
  });

  it('warns once when the span reaches more than 14 days from every element set', () => {
    expect(elementAgeWarning([setA], { startMs: FIXTURE_EPOCH_MS, endMs: FIXTURE_EPOCH_MS + 7 * DAY_MS })).toBeUndefined();
    const w = elementAgeWarning([setA], { startMs: FIXTURE_EPOCH_MS + 10 * DAY_MS, endMs: FIXTURE_EPOCH_MS + 17 * DAY_MS });
    expect(w).toMatch(/set A: .* 17\.0 days .*limit 14 days/);
    // two sets 20 days apart: the middle of the gap is 10 days from each, no warning
    const late = elementSetFromTle(makeTle({ ...base, epochMs: FIXTURE_EPOCH_MS + 20 * DAY_MS }), 'set C');
    expect(elementAgeWarning([setA, late], { startMs: FIXTURE_EPOCH_MS, endMs: FIXTURE_EPOCH_MS + 20 * DAY_MS })).toBeUndefined();
  });
});
