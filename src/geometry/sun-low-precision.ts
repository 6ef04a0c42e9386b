/**
 * The Sun's apparent right ascension, low-precision formula.
 *
 * Source: The Astronomical Almanac, section C, "Low precision formulas for the Sun"
 * (n = JD - 2451545.0; mean longitude L = 280.460 + 0.9856474 n deg; mean anomaly
 * g = 357.528 + 0.9856003 n deg; ecliptic longitude lambda = L + 1.915 sin g + 0.020 sin 2g;
 * obliquity epsilon = 23.439 - 0.0000004 n deg; alpha = atan2(cos epsilon sin lambda, cos lambda)),
 * stated there to 0.01 deg from 1950 to 2050.
 * Valid range: the program's dates (1957..2099); the precision degrades slowly outside 1950..2050.
 * Units: UTC epoch ms in (UT1 taken as UTC: under 1 s, 0.0001 deg of the Sun), degrees out, 0..360.
 */

const DEG = Math.PI / 180;
/** Julian date of the Unix epoch (1970-01-01T00:00Z). */
const JD_UNIX_EPOCH = 2440587.5;
const J2000_JD = 2451545.0;

/** Apparent right ascension of the Sun, true equator and equinox of date, deg in 0..360. */
export function sunRightAscensionDeg(tMs: number): number {
  const n = tMs / 86_400_000 + JD_UNIX_EPOCH - J2000_JD;
  const lDeg = 280.46 + 0.9856474 * n;
  const gRad = (357.528 + 0.9856003 * n) * DEG;
  const lambdaRad = (lDeg + 1.915 * Math.sin(gRad) + 0.02 * Math.sin(2 * gRad)) * DEG;
  const epsRad = (23.439 - 0.0000004 * n) * DEG;
  const alphaDeg = Math.atan2(Math.cos(epsRad) * Math.sin(lambdaRad), Math.cos(lambdaRad)) / DEG;
  return ((alphaDeg % 360) + 360) % 360;
}
