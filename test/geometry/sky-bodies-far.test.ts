/**
 * SkyBodies.farFromBoth, the link sampler's quick "no Sun or Moon noise in this beam"
 * test (src/plan/link.ts sampleBodyTempK). Reference: the previous implementation's
 * exact path, SkyBodies.angles (topocentric offsets and radii) into discAntennaTempK
 * (link/body-noise.ts), which must give exactly 0 K wherever farFromBoth says far.
 * Boresights are drawn around the Sun and the Moon, from just inside to well beyond the
 * cut-off, at stations all over the Earth, over two weeks (seeded, test/fixtures/prng.ts).
 */
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { FAR_MOON_MARGIN_DEG, FAR_SUN_MARGIN_DEG, farCosLimit, newBodyAngles, SkyBodies } from '../../src/geometry/sky-bodies.js';
import { BODY_NOISE_CUTOFF_BEAMWIDTHS, discAntennaTempK } from '../../src/link/body-noise.js';
import { mulberry32 } from '../fixtures/prng.js';

const span = { startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 2, 15) };
const sky = new SkyBodies(span);

/** A unit vector offDeg from unit vector u, in a random direction. */
function tilt(u: number[], offDeg: number, rnd: () => number): number[] {
  const a = Math.abs(u[0]!) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const p = [u[1]! * a[2]! - u[2]! * a[1]!, u[2]! * a[0]! - u[0]! * a[2]!, u[0]! * a[1]! - u[1]! * a[0]!];
  const pn = Math.hypot(p[0]!, p[1]!, p[2]!);
  const q = [u[1]! * p[2]! - u[2]! * p[1]!, u[2]! * p[0]! - u[0]! * p[2]!, u[0]! * p[1]! - u[1]! * p[0]!];
  const qn = Math.hypot(q[0]!, q[1]!, q[2]!);
  const phi = 2 * Math.PI * rnd();
  const t = (offDeg * Math.PI) / 180;
  return [0, 1, 2].map((i) => Math.cos(t) * u[i]! + Math.sin(t) * (Math.cos(phi) * (p[i]! / pn) + Math.sin(phi) * (q[i]! / qn)));
}

describe('SkyBodies.farFromBoth', () => {
  it('says far only where the disc noise of both bodies is exactly 0 K, and says it for most clearly far beams', () => {
    const rnd = mulberry32(20260301);
    const angles = newBodyAngles();
    let far = 0;
    let clearlyFar = 0;
    let clearlyFarSaid = 0;
    for (let n = 0; n < 20000; n++) {
      const site = makeSite('S', -70 + 140 * rnd(), -180 + 360 * rnd(), 3 * rnd());
      const tMs = span.startMs + rnd() * (span.endMs - span.startMs);
      sky.at(tMs);
      const hpbw = 0.05 + 3 * rnd();
      const reach = 0.3 + BODY_NOISE_CUTOFF_BEAMWIDTHS * hpbw;
      const body = rnd() < 0.5 ? sky.sunEcefKm : sky.moonEcefKm;
      const s = site.ecefKm;
      const d = [body[0]! - s[0], body[1]! - s[1], body[2]! - s[2]];
      const dn = Math.hypot(d[0]!, d[1]!, d[2]!);
      const off = Math.max(0, reach - 2 + 6 * rnd()); // around the cut-off, both sides
      const rangeKm = 400 + 4e5 * rnd();
      const b = tilt([d[0]! / dn, d[1]! / dn, d[2]! / dn], off, rnd).map((x) => x * rangeKm);
      const target = [s[0] + b[0]!, s[1] + b[1]!, s[2] + b[2]!];
      const isFar = sky.farFromBoth(b[0]!, b[1]!, b[2]!, rangeKm, farCosLimit(reach, FAR_SUN_MARGIN_DEG), farCosLimit(reach, FAR_MOON_MARGIN_DEG));
      const a = sky.angles(site, target, angles);
      const sunK = discAntennaTempK(11000, a.sunRadiusDeg, a.sunOffsetDeg, hpbw);
      const moonK = discAntennaTempK(240, a.moonRadiusDeg, a.moonOffsetDeg, hpbw);
      if (isFar) {
        far++;
        expect(sunK).toBe(0);
        expect(moonK).toBe(0);
      }
      if (Math.min(a.sunOffsetDeg, a.moonOffsetDeg) > reach + 2 * FAR_MOON_MARGIN_DEG + 0.1) {
        clearlyFar++;
        if (isFar) clearlyFarSaid++;
      }
    }
    expect(far).toBeGreaterThan(2000);
    // beyond reach + twice the Moon's margin (parallax one way, the margin itself) every beam is said far
    expect(clearlyFarSaid).toBe(clearlyFar);
  });

  it('never says far for a beam of 45 deg or more (the limit angle passes 179 deg)', () => {
    expect(farCosLimit(0.3 + BODY_NOISE_CUTOFF_BEAMWIDTHS * 45, FAR_SUN_MARGIN_DEG)).toBe(-2);
  });
});
