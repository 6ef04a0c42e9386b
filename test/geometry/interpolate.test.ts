// The Hermite state interpolator used for link sampling against direct propagation
// over a day, for the demo's invented LEO, 1,200 km, geostationary and lunar targets:
// position within 2 m (SGP4 itself is good to ~1 km; 2 m at the Moon is 3e-7 deg),
// velocity within 0.5 m/s (a Doppler error under 15 Hz at X-band; the direct
// velocities themselves carry ~0.1 m/s of jitter from the 40 us resolution of the
// Julian date used for sidereal time).
import { describe, it, expect } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { makeTarget } from '../../src/plan/contacts.js';
import { StateInterpolator, INTERPOLATION_NODE_STEP_S } from '../../src/geometry/interpolate.js';

const scenario = loadScenario(demoFiles());
const span = { startMs: scenario.span!.startMs, endMs: scenario.span!.startMs + 86_400_000 };
const twoMetresKm = 2e-3;
const halfMetrePerSKmS = 5e-4;

describe('StateInterpolator', () => {
  for (const id of ['KESTREL-1', 'PETREL-3', 'ANCHOR-G', 'MOONWREN']) {
    it(`${id}: interpolated state matches direct propagation`, () => {
      const sc = scenario.spacecraft.find((s) => s.id === id)!;
      const direct = makeTarget(sc, span);
      const interp = new StateInterpolator(makeTarget(sc, span), span.startMs);
      const a = new Float64Array(6);
      const b = new Float64Array(6);
      let maxPos = 0;
      let maxVel = 0;
      for (let t = span.startMs; t < span.endMs; t += 7_300) {
        expect(interp.stateAt(t, a)).toBe(true);
        direct.stateEcefAt(t, b);
        maxPos = Math.max(maxPos, Math.hypot(a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!));
        maxVel = Math.max(maxVel, Math.hypot(a[3]! - b[3]!, a[4]! - b[4]!, a[5]! - b[5]!));
      }
      expect(maxPos).toBeLessThan(twoMetresKm);
      expect(maxVel).toBeLessThan(halfMetrePerSKmS);
      // two propagations per node interval at most
      expect(interp.propagations).toBeLessThanOrEqual(2 * Math.ceil(86_400 / INTERPOLATION_NODE_STEP_S) + 2);
    });
  }
});
