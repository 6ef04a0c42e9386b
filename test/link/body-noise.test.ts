/**
 * Sun and Moon in the beam (src/link/body-noise.ts, src/link/body-brightness.ts).
 * References: the closed form of a centred disc in a Gaussian beam, T_b (1 - exp(-4 ln2
 * rho^2 / theta3^2)) (integral of the Gaussian, Kraus "Radio Astronomy" sec. 3-17); a
 * brute-force 2-D sum over the disc at 0.001-beamwidth cells; the quiet-Sun spectrum of
 * Zirin, Baumert & Hurford, ApJ 370:779 (1991) (fit coefficients from memory) and
 * 8,100 +- 300 K at 8 mm (Kallunki & Tornikoski, Solar Physics 293:156, 2018).
 */
import { describe, expect, it } from 'vitest';
import { besselI0e, discAntennaTempK } from '../../src/link/body-noise.js';
import { MOON_BRIGHTNESS_K, quietSunBrightnessK } from '../../src/link/body-brightness.js';

function bruteForceK(tb: number, rho: number, d: number, hpbw: number): number {
  const a = (4 * Math.LN2) / (hpbw * hpbw);
  const cell = Math.min(rho, hpbw) / 400;
  let sum = 0;
  for (let x = -rho; x <= rho; x += cell) {
    for (let y = -rho; y <= rho; y += cell) {
      if (x * x + y * y > rho * rho) continue;
      const dx = x + d;
      sum += Math.exp(-a * (dx * dx + y * y)) * cell * cell;
    }
  }
  return (tb * sum) / (Math.PI / a);
}

describe('disc in a Gaussian main lobe', () => {
  it('I0e against known values (A&S Table 9.8: e^-1 I0(1) = 0.4657596, e^-5 I0(5) = 0.1835408)', () => {
    expect(besselI0e(1)).toBeCloseTo(0.4657596, 6);
    expect(besselI0e(5)).toBeCloseTo(0.1835408, 6);
  });
  it('centred disc: the closed form T_b (1 - exp(-a rho^2))', () => {
    for (const [rho, hpbw] of [
      [0.26, 0.08],
      [0.26, 0.36],
      [0.26, 2.0],
    ] as const) {
      const a = (4 * Math.LN2) / (hpbw * hpbw);
      const want = 1000 * (1 - Math.exp(-a * rho * rho));
      expect(discAntennaTempK(1000, rho, 1e-9, hpbw)).toBeCloseTo(want, 3);
      expect(discAntennaTempK(1000, rho, 0, hpbw)).toBeCloseTo(want, 9);
    }
  });
  it('offset disc: against a brute-force 2-D sum (0.5 % or 0.5 K)', () => {
    for (const [rho, d, hpbw] of [
      [0.267, 0.08, 0.08],
      [0.267, 0.3, 0.08],
      [0.26, 0.2, 0.36],
      [0.26, 0.7, 0.36],
      [0.267, 1.5, 1.0],
    ] as const) {
      const got = discAntennaTempK(1000, rho, d, hpbw);
      const want = bruteForceK(1000, rho, d, hpbw);
      expect(Math.abs(got - want)).toBeLessThan(Math.max(0.005 * want, 0.5));
    }
  });
  it('a 7 m X-band beam on the Moon adds 150..230 K (the issue\'s estimate); a 34 m Ka beam centred on the Sun sees the quiet Sun itself', () => {
    const hpbw7mX = (70 * (299_792_458 / 8.45e9)) / 7; // 70 lambda / D (antenna.ts)
    const t = discAntennaTempK(MOON_BRIGHTNESS_K, 0.259, 0, hpbw7mX);
    expect(t).toBeGreaterThan(150);
    expect(t).toBeLessThan(230);
    const hpbw34mKa = (70 * (299_792_458 / 32e9)) / 34;
    const sun = discAntennaTempK(quietSunBrightnessK(32e9), 0.267, 0, hpbw34mKa);
    expect(Math.abs(sun / quietSunBrightnessK(32e9) - 1)).toBeLessThan(1e-6);
  });
});

describe('quiet-Sun brightness temperature', () => {
  it('follows the Zirin et al. (1991) fit inside 1.4..18 GHz', () => {
    for (const f of [1.4, 2.3, 8.4, 15]) expect(quietSunBrightnessK(f * 1e9)).toBeCloseTo(140_077 * f ** -2.1 + 10_880, 6);
    expect(quietSunBrightnessK(8.4e9)).toBeGreaterThan(12_000);
    expect(quietSunBrightnessK(8.4e9)).toBeLessThan(13_000);
  });
  it('is 8,100 K at 8 mm (Kallunki & Tornikoski 2018) and falls monotonically from 1 to 37 GHz', () => {
    expect(quietSunBrightnessK(37.5e9)).toBeCloseTo(8100, 6);
    let prev = Infinity;
    for (let f = 1; f <= 37; f += 0.5) {
      const t = quietSunBrightnessK(f * 1e9);
      expect(t).toBeLessThan(prev);
      prev = t;
    }
  });
});
