/**
 * Earth model: WGS-84 ellipsoid and rotation rate, geodetic -> ECEF, and ground sites
 * prepared for topocentric transforms.
 *
 * Source: NIMA TR8350.2, "Department of Defense World Geodetic System 1984", 3rd edition
 * (amendment 1, 2000), Table 3.1 (defining parameters a, 1/f, omega) and section 4.1,
 * equation 4-14 (geodetic to Cartesian coordinates).
 * Valid range: latitude -90..90 deg, longitude -180..360 deg, height -0.5..9 km
 * (ground stations; the formula itself holds at any height).
 * Units: degrees and km in, km out. This is the one home of Earth constants in the project.
 * (SGP4 carries its own WGS-72 constants inside satellite.js, as the theory requires.)
 */
import { ModelRangeError } from '../errors.js';
import type { Site } from './types.js';

/** Semi-major (equatorial) axis, km. NIMA TR8350.2 3rd ed., Table 3.1. */
export const WGS84_EQUATORIAL_RADIUS_KM = 6378.137;
/** Flattening 1/298.257223563. NIMA TR8350.2 3rd ed., Table 3.1. */
export const WGS84_FLATTENING = 1 / 298.257223563;
/** First eccentricity squared, e^2 = f (2 - f). NIMA TR8350.2 3rd ed., Table 3.3 (derived). */
export const WGS84_ECCENTRICITY_SQUARED = WGS84_FLATTENING * (2 - WGS84_FLATTENING);
/** Polar radius b = a (1 - f), km. NIMA TR8350.2 3rd ed., Table 3.3 (derived). */
export const WGS84_POLAR_RADIUS_KM = WGS84_EQUATORIAL_RADIUS_KM * (1 - WGS84_FLATTENING);
/**
 * Effective Earth radius for tropospheric paths (k = 4/3 of a 6,375 km Earth), km:
 * the value ITU-R P.618-14 sec. 2.2.1.1 (step 2) and P.676-13 Annex 2 use.
 */
export const ITU_EFFECTIVE_EARTH_RADIUS_KM = 8500;
/** Earth's gravitational constant GM (with atmosphere), km^3/s^2. NIMA TR8350.2 3rd ed., Table 3.1. */
export const WGS84_GM_KM3_S2 = 398_600.4418;
/** Nominal mean angular velocity of the Earth, rad/s. NIMA TR8350.2 3rd ed., Table 3.1. */
export const WGS84_EARTH_ROTATION_RAD_S = 7.292115e-5;

const DEG_TO_RAD = Math.PI / 180;

/**
 * Geodetic latitude/longitude/height to ECEF (NIMA TR8350.2 eq. 4-14), written into
 * out[0..2] in km. Allocation-free.
 */
export function geodeticToEcefKm(
  latitudeDeg: number,
  longitudeDeg: number,
  heightKm: number,
  out: Float64Array | number[],
): void {
  const latRad = latitudeDeg * DEG_TO_RAD;
  const lonRad = longitudeDeg * DEG_TO_RAD;
  const sinLat = Math.sin(latRad);
  const cosLat = Math.cos(latRad);
  const primeVerticalKm =
    WGS84_EQUATORIAL_RADIUS_KM / Math.sqrt(1 - WGS84_ECCENTRICITY_SQUARED * sinLat * sinLat);
  out[0] = (primeVerticalKm + heightKm) * cosLat * Math.cos(lonRad);
  out[1] = (primeVerticalKm + heightKm) * cosLat * Math.sin(lonRad);
  out[2] = (primeVerticalKm * (1 - WGS84_ECCENTRICITY_SQUARED) + heightKm) * sinLat;
}

function checkRange(field: string, value: number, lo: number, hi: number): void {
  if (!Number.isFinite(value) || value < lo || value > hi) {
    throw new ModelRangeError('geometry/earth (WGS-84 site)', field, value, `${lo}..${hi}`);
  }
}

/**
 * A ground site: ECEF position and the rows of the ECEF -> east/north/up rotation
 * (geodetic normal as "up").
 */
export function makeSite(
  stationId: string,
  latitudeDeg: number,
  longitudeDeg: number,
  heightKm: number,
): Site {
  checkRange('latitudeDeg', latitudeDeg, -90, 90);
  checkRange('longitudeDeg', longitudeDeg, -180, 360);
  checkRange('heightKm', heightKm, -0.5, 9);
  const ecef = [0, 0, 0];
  geodeticToEcefKm(latitudeDeg, longitudeDeg, heightKm, ecef);
  const latRad = latitudeDeg * DEG_TO_RAD;
  const lonRad = longitudeDeg * DEG_TO_RAD;
  const sinLat = Math.sin(latRad);
  const cosLat = Math.cos(latRad);
  const sinLon = Math.sin(lonRad);
  const cosLon = Math.cos(lonRad);
  return {
    stationId,
    latitudeDeg,
    longitudeDeg,
    heightKm,
    ecefKm: [ecef[0]!, ecef[1]!, ecef[2]!],
    east: [-sinLon, cosLon, 0],
    north: [-sinLat * cosLon, -sinLat * sinLon, cosLat],
    up: [cosLat * cosLon, cosLat * sinLon, sinLat],
  };
}
