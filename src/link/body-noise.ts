/**
 * Antenna noise temperature added by a bright disc (the Sun, the Moon) near boresight.
 *
 * Model: T_A = (1 / Omega_A) integral over the disc of T_b G_n(theta) dOmega, with a
 * uniformly bright disc of angular radius rho at angular offset d from boresight and a
 * Gaussian main lobe G_n(theta) = exp(-a theta^2), a = 4 ln 2 / theta3^2 (theta3 the
 * half-power beamwidth), Omega_A = pi / a its solid angle (small angles; sidelobes and
 * the rest of the pattern are not modelled: a far sidelobe adds a few K at most, which
 * the station's antennaNoiseK covers). Source: J. D. Kraus, "Radio Astronomy", 2nd ed.
 * (1986), sec. 3-17 (antenna temperature of a source), and the Gaussian-beam
 * approximation of the main lobe (common practice).
 * The azimuthal integral over the disc is analytic (modified Bessel I0), leaving
 *   T_A = T_b 2 a integral_0^rho exp(-a (d - r)^2) I0e(2 a d r) r dr,
 * taken by Gauss-Legendre quadrature (two panels of BODY_NOISE_NODES nodes over the radii within
 * 5 sigma of the offset; I0e = exp(-x) I0(x) by
 * Abramowitz & Stegun 9.8.1-9.8.2, |error| < 2e-7 relative). Centred (d = 0) it reduces
 * to T_b (1 - exp(-a rho^2)): a disc filling the beam gives T_b, a small one
 * T_b Omega_s / Omega_A. Beyond d - rho > BODY_NOISE_CUTOFF_BEAMWIDTHS theta3 it is 0.
 * Units: degrees, K.
 */
export const BODY_NOISE_CUTOFF_BEAMWIDTHS = 4;
const LN2 = Math.LN2;

/** Gauss-Legendre nodes and weights on [-1, 1], 16 points (Abramowitz & Stegun Table 25.4). */
const GL_X = [
  -0.9894009349916499, -0.9445750230732326, -0.8656312023878318, -0.755404408355003, -0.6178762444026438, -0.4580167776572274,
  -0.2816035507792589, -0.0950125098376374, 0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438,
  0.755404408355003, 0.8656312023878318, 0.9445750230732326, 0.9894009349916499,
];
const GL_W = [
  0.0271524594117541, 0.0622535239386479, 0.0951585116824928, 0.1246289712555339, 0.1495959888165767, 0.1691565193950025,
  0.1826034150449236, 0.1894506104550685, 0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767,
  0.1246289712555339, 0.0951585116824928, 0.0622535239386479, 0.0271524594117541,
];
export const BODY_NOISE_NODES = GL_X.length;

/** exp(-x) I0(x), x >= 0 (Abramowitz & Stegun 9.8.1 for x <= 3.75, 9.8.2 above). */
export function besselI0e(x: number): number {
  if (x <= 3.75) {
    const t = (x / 3.75) ** 2;
    const i0 = 1 + t * (3.5156229 + t * (3.0899424 + t * (1.2067492 + t * (0.2659732 + t * (0.0360768 + t * 0.0045813)))));
    return i0 * Math.exp(-x);
  }
  const u = 3.75 / x;
  const p =
    0.39894228 +
    u * (0.01328592 + u * (0.00225319 + u * (-0.00157565 + u * (0.00916281 + u * (-0.02057706 + u * (0.02635537 + u * (-0.01647633 + u * 0.00392377)))))));
  return p / Math.sqrt(x);
}

/**
 * Antenna temperature from a uniform disc of brightness brightnessK, radius radiusDeg, at
 * offsetDeg from boresight, for a half-power beamwidth hpbwDeg, K. Allocation-free.
 */
export function discAntennaTempK(brightnessK: number, radiusDeg: number, offsetDeg: number, hpbwDeg: number): number {
  if (!(hpbwDeg > 0) || !(radiusDeg > 0)) return 0;
  if (offsetDeg - radiusDeg > BODY_NOISE_CUTOFF_BEAMWIDTHS * hpbwDeg) return 0;
  const a = (4 * LN2) / (hpbwDeg * hpbwDeg);
  const d = offsetDeg;
  if (d === 0) return brightnessK * (1 - Math.exp(-a * radiusDeg * radiusDeg));
  // only radii within w of the offset matter (exp(-a (d - r)^2) < e^-25 beyond): integrate there,
  // in two panels of BODY_NOISE_NODES points
  const w = Math.sqrt(25 / a);
  const lo = Math.max(0, d - w);
  const hi = Math.min(radiusDeg, d + w);
  if (!(hi > lo)) return 0;
  const panel = 0.5 * (hi - lo);
  let sum = 0;
  for (let p = 0; p < 2; p++) {
    const c = lo + panel * (p + 0.5);
    for (let i = 0; i < BODY_NOISE_NODES; i++) {
      const r = c + 0.5 * panel * GL_X[i]!;
      const dr = d - r;
      sum += GL_W[i]! * Math.exp(-a * dr * dr) * besselI0e(2 * a * d * r) * r;
    }
  }
  return brightnessK * 2 * a * 0.5 * panel * sum;
}

/** Sun and Moon angles against the boresight (geometry/sky-bodies.ts BodyAngles), deg. */
export interface BeamBodyAngles {
  sunOffsetDeg: number;
  sunRadiusDeg: number;
  moonOffsetDeg: number;
  moonRadiusDeg: number;
}

/** Antenna temperature the Sun and the Moon add to a station's beam, K (before the atmosphere). */
export function beamBodiesTempK(sunBrightnessK: number, moonBrightnessK: number, hpbwDeg: number, a: BeamBodyAngles): number {
  return (
    discAntennaTempK(sunBrightnessK, a.sunRadiusDeg, a.sunOffsetDeg, hpbwDeg) + discAntennaTempK(moonBrightnessK, a.moonRadiusDeg, a.moonOffsetDeg, hpbwDeg)
  );
}
