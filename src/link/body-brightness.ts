/**
 * Disc-average brightness temperatures of the Sun and the Moon at microwave frequencies.
 *
 * Quiet Sun (the Sun at solar minimum, no active regions), by frequency f in GHz:
 * - 1.4..18 GHz: T_b = 140,077 f^-2.1 + 10,880 K, the fit of H. Zirin, B. M. Baumert,
 *   G. J. Hurford, "The microwave brightness temperature spectrum of the quiet Sun",
 *   ApJ 370:779-783 (1991), to their Owens Valley spectrum (coefficients from memory);
 * - 18..37.5 GHz: log-log interpolation from the fit's value at 18 GHz (11,200 K) to
 *   8,100 K at 8 mm (37.5 GHz), J. Kallunki, M. Tornikoski, "Measurements of the
 *   quiet-Sun level brightness temperature at 8 mm", Solar Physics 293:156 (2018);
 * - above 37.5 GHz: 8,100 K held (the spectrum flattens towards ~7,000 K at 90 GHz);
 * - below 1.4 GHz: the fit extrapolated (the quiet corona reaches ~1e6 K near 100 MHz).
 * An active Sun is brighter (x1.5..3 at S/X band with large sunspot groups): the
 * figure is a floor, not a bound.
 * Moon: 225 K, the microwave disc average (the lunar thermal emission varies by less
 * than +-10 % with phase at centimetre wavelengths; S. A. Krotikov, V. S. Troitskii,
 * "Radio emission and nature of the Moon", Soviet Physics Uspekhi 6:841 (1964), from memory).
 * Units: Hz in, K out.
 */
export const MOON_BRIGHTNESS_K = 225;
/** Quiet-Sun brightness at 8 mm (Kallunki & Tornikoski 2018), K. */
const SUN_8MM_K = 8100;
const SUN_8MM_GHZ = 37.5;
const FIT_TOP_GHZ = 18;

function zirinFitK(fGhz: number): number {
  return 140_077 * fGhz ** -2.1 + 10_880;
}

/** Quiet-Sun disc-average brightness temperature, K, at freqHz (see the head comment). */
export function quietSunBrightnessK(freqHz: number): number {
  const f = freqHz / 1e9;
  if (f <= FIT_TOP_GHZ) return zirinFitK(f);
  if (f >= SUN_8MM_GHZ) return SUN_8MM_K;
  const top = zirinFitK(FIT_TOP_GHZ);
  const x = Math.log(f / FIT_TOP_GHZ) / Math.log(SUN_8MM_GHZ / FIT_TOP_GHZ);
  return Math.exp(Math.log(top) + x * (Math.log(SUN_8MM_K) - Math.log(top)));
}
