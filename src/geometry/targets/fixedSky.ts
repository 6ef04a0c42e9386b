/**
 * Fixed-sky target: a deep-space craft modelled as a fixed direction in the sky (right
 * ascension and declination, J2000 mean equator and equinox) at a fixed geocentric
 * range. Over a week a craft beyond the Moon moves little against the stars; its
 * apparent motion is the Earth's rotation.
 *
 * Model: unit vector (cos d cos a, cos d sin a, sin d) times range in EQJ, rotated once
 * per span to the true equator of date with astronomy-engine 2.1.19 `Rotation_EQJ_EQD`
 * at mid-span (precession over a week is ~1 arcsec: neglected), then per call by GAST
 * (GMST + the equation of the equinoxes at mid-span) to Earth-fixed axes (frames.ts);
 * velocity is only the Earth-rotation term -omega x r.
 * Valid range: rightAscensionDeg 0..360, declinationDeg -90..90, rangeKm >= 10,000
 * (a direction model needs range >> Earth radius for parallax-free use; topocentric
 * parallax is still computed exactly by lookFrom). Units: degrees, km, km/s, epoch ms.
 */
import { ModelRangeError } from '../../errors.js';
import type { Span } from '../../scenario/types.js';
import { gmstRadAt, inertialOfDateToEcef } from '../frames.js';
import type { Target } from '../types.js';
import { eqjToEqdMatrix, rotate3, siderealOffsetRad } from './ofDate.js';

/** Scan step for a fixed-sky target, s: it rises and sets at the sidereal rate. */
export const FIXED_SKY_SCAN_STEP_S = 600;
const MODEL = 'geometry/targets/fixedSky';
const DEG_TO_RAD = Math.PI / 180;

class FixedSkyTarget implements Target {
  readonly spacecraftId: string;
  readonly scanStepS = FIXED_SKY_SCAN_STEP_S;
  evaluations = 0;
  readonly failedAtMs: number | undefined = undefined;
  readonly failureReason: string | undefined = undefined;
  private readonly rOfDate = new Float64Array(3);
  private readonly zero = new Float64Array(3);
  private readonly offsetRad: number;

  constructor(spacecraftId: string, rightAscensionDeg: number, declinationDeg: number, rangeKm: number, span: Span) {
    this.spacecraftId = spacecraftId;
    const a = rightAscensionDeg * DEG_TO_RAD;
    const d = declinationDeg * DEG_TO_RAD;
    const eqj = [rangeKm * Math.cos(d) * Math.cos(a), rangeKm * Math.cos(d) * Math.sin(a), rangeKm * Math.sin(d)];
    const midMs = 0.5 * (span.startMs + span.endMs);
    const m = new Float64Array(9);
    eqjToEqdMatrix(midMs, m);
    rotate3(m, eqj, this.rOfDate);
    this.offsetRad = siderealOffsetRad(midMs);
  }

  stateEcefAt(tMs: number, out: Float64Array): boolean {
    this.evaluations++;
    inertialOfDateToEcef(this.rOfDate, this.zero, gmstRadAt(tMs) + this.offsetRad, out);
    return true;
  }
}

/** A Target fixed in the sky (J2000 RA/Dec, deg) at a geocentric range (km), for `span`. */
export function makeFixedSkyTarget(
  spacecraftId: string,
  rightAscensionDeg: number,
  declinationDeg: number,
  rangeKm: number,
  span: Span,
): Target {
  if (!Number.isFinite(rightAscensionDeg) || rightAscensionDeg < 0 || rightAscensionDeg > 360) {
    throw new ModelRangeError(MODEL, 'rightAscensionDeg', rightAscensionDeg, '0..360 deg');
  }
  if (!Number.isFinite(declinationDeg) || declinationDeg < -90 || declinationDeg > 90) {
    throw new ModelRangeError(MODEL, 'declinationDeg', declinationDeg, '-90..90 deg');
  }
  if (!Number.isFinite(rangeKm) || rangeKm < 10_000) {
    throw new ModelRangeError(MODEL, 'rangeKm', rangeKm, '>= 10000 km');
  }
  return new FixedSkyTarget(spacecraftId, rightAscensionDeg, declinationDeg, rangeKm, span);
}
