/**
 * SGP4 mean elements from mean orbit parameters (an orbit before launch).
 *
 * Given a mean altitude or semi-major axis, eccentricity, inclination (or sun-synchronous)
 * and a right ascension of the ascending node (or a local time of the ascending node, LTAN),
 * returns the mean elements SGP4 takes (Kozai mean motion, as a TLE or OMM carries it).
 *
 * Method:
 * - Semi-major axis: SGP4 turns the Kozai mean motion of an element set into the Brouwer
 *   mean motion and semi-major axis a0'' (F. R. Hoots, R. L. Roehrich, "Spacetrack Report
 *   No. 3", 1980, section 6 (SGP4), the a1, delta1, a0, delta0 recovery; kept unchanged in
 *   D. A. Vallado et al., "Revisiting Spacetrack Report #3", AIAA 2006-6753, `initl`).
 *   Here the given semi-major axis is taken as that a0'' and the recovery is inverted by
 *   fixed-point iteration, so SGP4 reads back exactly the axis asked for (to 1e-12).
 * - Sun-synchronous inclination: the inclination at which SGP4's own secular node rate
 *   (J2, J2^2 and J4 terms, Hoots & Roehrich 1980 sec. 6) is one revolution per tropical
 *   year (365.2421897 d), so the node keeps its local time under the propagator used. It
 *   starts from, and stays within 0.05 deg of, the first-order J2 formula
 *   dOmega/dt = -3/2 n J2 (R/p)^2 cos i (Vallado, "Fundamentals of Astrodynamics and
 *   Applications", 4th ed., 2013, section 11.4, from memory).
 * - LTAN: RAAN = right ascension of the apparent Sun at the epoch + 15 deg per hour of
 *   (LTAN - 12 h) (geometry/sun-low-precision.ts, 0.01 deg).
 * - No drag: BSTAR, the mean-motion derivatives and the element numbers are 0.
 * Accuracy: as good as SGP4 itself for the orbit asked for; a planned orbit is a design, not
 * a measurement (after launch, use the published element sets).
 * Units: km, deg, hours, UTC epoch ms in; rev/day and deg out.
 */
import { sunRightAscensionDeg } from './sun-low-precision.js';

/** SGP4's WGS-72 constants (Vallado et al. AIAA 2006-6753, `getgravconst('wgs72')`), as satellite.js uses them. */
export const SGP4_WGS72_RADIUS_KM = 6378.135;
export const SGP4_WGS72_MU_KM3_S2 = 398600.8;
export const SGP4_WGS72_J2 = 0.001082616;
export const SGP4_WGS72_J4 = -0.00000165597;
/** sqrt(mu) in Earth radii^1.5 per minute. */
export const SGP4_WGS72_XKE_PER_MIN = 60 / Math.sqrt((SGP4_WGS72_RADIUS_KM ** 3) / SGP4_WGS72_MU_KM3_S2);
/** Tropical year, days (IERS conventions, mean value at J2000, from memory). */
export const TROPICAL_YEAR_DAYS = 365.2421897;

const DEG = Math.PI / 180;
const MIN_PER_DAY = 1440;

export interface MeanOrbitParameters {
  /** Mean semi-major axis (Brouwer, as SGP4 recovers it), km. */
  semiMajorAxisKm: number;
  eccentricity: number;
  /** Inclination, deg; absent with sunSynchronous. */
  inclinationDeg?: number;
  sunSynchronous?: boolean;
  /** RAAN, deg; or ltanHours (0..24), the local apparent solar time of the ascending node. */
  raanDeg?: number;
  ltanHours?: number;
  argPerigeeDeg: number;
  meanAnomalyDeg: number;
  epochMs: number;
}

export interface Sgp4MeanElements {
  /** Kozai mean motion, rev/day (what a TLE or OMM carries). */
  meanMotionRevPerDay: number;
  eccentricity: number;
  inclinationDeg: number;
  raanDeg: number;
  argPerigeeDeg: number;
  meanAnomalyDeg: number;
}

/** Brouwer mean motion (rad/min) SGP4 would recover from Kozai mean motion `noKozai` (Hoots & Roehrich 1980, sec. 6). */
export function sgp4BrouwerMeanMotion(noKozaiRadMin: number, eccentricity: number, inclinationDeg: number): number {
  const cosI = Math.cos(inclinationDeg * DEG);
  const omeosq = 1 - eccentricity * eccentricity;
  const d1 = (0.75 * SGP4_WGS72_J2 * (3 * cosI * cosI - 1)) / (Math.sqrt(omeosq) * omeosq);
  const ak = (SGP4_WGS72_XKE_PER_MIN / noKozaiRadMin) ** (2 / 3);
  let del = d1 / (ak * ak);
  const adel = ak * (1 - del * del - del * (1 / 3 + (134 * del * del) / 81));
  del = d1 / (adel * adel);
  return noKozaiRadMin / (1 + del);
}

/**
 * Sun-synchronous inclination for a mean semi-major axis and eccentricity, deg: the one at
 * which SGP4's secular node rate is one turn per tropical year; undefined when none is
 * (semi-major axis above about 12,350 km).
 */
export function sunSynchronousInclinationDeg(semiMajorAxisKm: number, eccentricity: number): number | undefined {
  const aEr = semiMajorAxisKm / SGP4_WGS72_RADIUS_KM;
  const nRadMin = SGP4_WGS72_XKE_PER_MIN * aEr ** -1.5;
  const pEr = aEr * (1 - eccentricity * eccentricity);
  const pinvsq = 1 / (pEr * pEr);
  const sunRateRadMin = (2 * Math.PI) / (TROPICAL_YEAR_DAYS * MIN_PER_DAY);
  // SGP4's secular node rate (Hoots & Roehrich 1980 sec. 6; Vallado et al. 2006 sgp4init):
  // cos i (-3/2 J2 n / p^2 + temp2 (4 - 19 cos^2 i) / 2 + 2 temp3 (3 - 7 cos^2 i)) = c (A + B c^2)
  const temp1 = 1.5 * SGP4_WGS72_J2 * pinvsq * nRadMin;
  const temp2 = 0.5 * temp1 * SGP4_WGS72_J2 * pinvsq;
  const temp3 = -0.46875 * SGP4_WGS72_J4 * pinvsq * pinvsq * nRadMin;
  const A = -temp1 + 2 * temp2 + 6 * temp3;
  const B = -9.5 * temp2 - 14 * temp3;
  // first-order J2 start (dOmega/dt = -3/2 n J2 (R/p)^2 cos i), then Newton on c (A + B c^2) = rate
  let c = sunRateRadMin / -temp1;
  if (!(c >= -1)) return undefined;
  for (let k = 0; k < 20; k++) c -= (c * (A + B * c * c) - sunRateRadMin) / (A + 3 * B * c * c);
  return c >= -1 && c <= 1 ? Math.acos(c) / DEG : undefined;
}

/** RAAN that puts the ascending node at local apparent solar time ltanHours at the epoch, deg 0..360. */
export function raanForLtanDeg(ltanHours: number, epochMs: number): number {
  const raan = sunRightAscensionDeg(epochMs) + 15 * (ltanHours - 12);
  return ((raan % 360) + 360) % 360;
}

/** The SGP4 mean elements; throws RangeError for a sun-synchronous orbit no inclination can give (callers check first). */
export function sgp4MeanElements(p: MeanOrbitParameters): Sgp4MeanElements {
  const inclinationDeg = p.sunSynchronous ? sunSynchronousInclinationDeg(p.semiMajorAxisKm, p.eccentricity) : p.inclinationDeg;
  if (inclinationDeg === undefined) throw new RangeError('sgp4MeanElements: no sun-synchronous inclination for this orbit');
  const raanDeg = p.ltanHours !== undefined ? raanForLtanDeg(p.ltanHours, p.epochMs) : (p.raanDeg ?? 0);
  const targetBrouwer = SGP4_WGS72_XKE_PER_MIN * (p.semiMajorAxisKm / SGP4_WGS72_RADIUS_KM) ** -1.5;
  // invert the Kozai -> Brouwer recovery: n_k = n_b * n_k / f(n_k), a contraction (delta ~ 1e-3)
  let noKozai = targetBrouwer;
  for (let i = 0; i < 50; i++) {
    const next = noKozai * (targetBrouwer / sgp4BrouwerMeanMotion(noKozai, p.eccentricity, inclinationDeg));
    if (Math.abs(next - noKozai) <= 1e-15 * targetBrouwer) {
      noKozai = next;
      break;
    }
    noKozai = next;
  }
  return {
    meanMotionRevPerDay: (noKozai * MIN_PER_DAY) / (2 * Math.PI),
    eccentricity: p.eccentricity,
    inclinationDeg,
    raanDeg,
    argPerigeeDeg: p.argPerigeeDeg,
    meanAnomalyDeg: p.meanAnomalyDeg,
  };
}
