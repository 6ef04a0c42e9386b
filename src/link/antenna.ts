/**
 * Antenna models: parabolic-reflector gain and beamwidth, pointing loss, a
 * tabulated transmit pattern, and the off-boresight angle of a station seen
 * from a nadir-pointing spacecraft.
 *
 * Sources:
 * - Aperture gain G = eta (pi D / lambda)^2 = eta 4 pi A / lambda^2 (A physical area;
 *   eta A is the effective area): Pratt & Allnutt, Satellite Communications, 3rd ed.,
 *   ch. 4 (Ex. 4.2 uses G = 4 pi Ae / lambda^2); Maral & Bousquet, Satellite
 *   Communications Systems, ch. 5. Valid for D >> lambda.
 * - 3 dB beamwidth theta3 ~ 70 lambda / D degrees for a typical tapered feed (Maral &
 *   Bousquet; common practice). Expressed through the gain: theta3 = 70 pi sqrt(eta / G).
 * - Pointing loss 12 (theta / theta3)^2 dB: parabolic approximation of the main lobe
 *   (Maral & Bousquet, ch. 5; the same main-lobe parabola underlies ITU-R S.465/S.580
 *   earth-station envelopes). Common practice; valid for theta <= theta3 (loss <= 12 dB),
 *   beyond which the main lobe no longer follows the parabola: a ModelRangeError.
 * - Off-boresight (nadir) angle from a nadir-pointing spacecraft: plane triangle of Earth
 *   centre O, station S and spacecraft P (law of cosines), see offNadirAngleDeg.
 * Angles in degrees at every boundary.
 */
import { ModelRangeError } from '../errors.js';
import { linearToDb, dbToLinear, wavelengthM } from './units.js';

const DEG = Math.PI / 180;

/** Beamwidth factor k in theta3 = k lambda / D, deg (Maral & Bousquet; common practice). */
export const BEAMWIDTH_FACTOR_DEG = 70;
/** Pointing-loss parabola coefficient, dB: L = 12 (theta/theta3)^2 (common practice). */
export const POINTING_LOSS_COEFF_DB = 12;
/** Aperture efficiency assumed when none is given (common practice; Maral & Bousquet give 0.55..0.75). */
export const DEFAULT_APERTURE_EFFICIENCY = 0.6;

/** Parabolic-reflector gain, dBi: eta (pi D / lambda)^2. */
export function parabolicGainDbi(diameterM: number, freqHz: number, apertureEfficiency: number): number {
  if (!(diameterM > 0)) throw new ModelRangeError('parabolic gain', 'dishDiameterM', diameterM, '> 0');
  if (!(apertureEfficiency > 0 && apertureEfficiency <= 1)) {
    throw new ModelRangeError('parabolic gain', 'apertureEfficiency', apertureEfficiency, '(0, 1]');
  }
  const x = (Math.PI * diameterM) / wavelengthM(freqHz);
  return linearToDb(apertureEfficiency * x * x);
}

/** Gain of an aperture of effective area effectiveAreaM2, dBi: 4 pi Ae / lambda^2. */
export function effectiveAreaGainDbi(effectiveAreaM2: number, freqHz: number): number {
  const lambdaM = wavelengthM(freqHz);
  return linearToDb((4 * Math.PI * effectiveAreaM2) / (lambdaM * lambdaM));
}

/** 3 dB beamwidth of a parabolic dish, deg: 70 lambda / D (common practice). */
export function halfPowerBeamwidthDeg(diameterM: number, freqHz: number): number {
  return (BEAMWIDTH_FACTOR_DEG * wavelengthM(freqHz)) / diameterM;
}

/**
 * 3 dB beamwidth from the gain, deg: eliminating D/lambda between G = eta (pi D/lambda)^2
 * and theta3 = 70 lambda/D gives theta3 = 70 pi sqrt(eta / G).
 */
export function beamwidthFromGainDeg(gainDbi: number, apertureEfficiency: number): number {
  return BEAMWIDTH_FACTOR_DEG * Math.PI * Math.sqrt(apertureEfficiency / dbToLinear(gainDbi));
}

/** Main-lobe pointing loss, dB: 12 (theta / theta3)^2, valid for 0 <= theta <= theta3. */
export function pointingLossDb(pointingErrorDeg: number, beamwidth3DbDeg: number): number {
  if (!(pointingErrorDeg >= 0 && pointingErrorDeg <= beamwidth3DbDeg)) {
    throw new ModelRangeError(
      'pointing loss 12 (theta/theta3dB)^2',
      'pointingErrorDeg',
      pointingErrorDeg,
      `0..${beamwidth3DbDeg.toPrecision(4)} deg (the 3 dB beamwidth)`,
    );
  }
  const r = pointingErrorDeg / beamwidth3DbDeg;
  return POINTING_LOSS_COEFF_DB * r * r;
}

/**
 * Check a tabulated pattern once (at preparation): same lengths, at least 2 points,
 * angles strictly ascending from 0. Throws ModelRangeError naming the field.
 */
export function checkPattern(offBoresightDeg: readonly number[], gainDbi: readonly number[]): void {
  const model = 'transmit antenna pattern';
  if (offBoresightDeg.length !== gainDbi.length || offBoresightDeg.length < 2) {
    throw new ModelRangeError(model, 'gainDbi.length', gainDbi.length, `equal to offBoresightDeg.length (${offBoresightDeg.length}) and >= 2`);
  }
  if (offBoresightDeg[0] !== 0) throw new ModelRangeError(model, 'offBoresightDeg[0]', offBoresightDeg[0] ?? NaN, '0');
  for (let i = 1; i < offBoresightDeg.length; i++) {
    const a = offBoresightDeg[i] as number;
    const prev = offBoresightDeg[i - 1] as number;
    if (!(a > prev)) throw new ModelRangeError(model, `offBoresightDeg[${i}]`, a, `> ${prev} (strictly ascending)`);
  }
  for (let i = 0; i < gainDbi.length; i++) {
    if (!Number.isFinite(gainDbi[i])) throw new ModelRangeError(model, `gainDbi[${i}]`, gainDbi[i] ?? NaN, 'a finite number');
  }
}

/**
 * Gain of a tabulated pattern at an off-boresight angle, dBi: linear interpolation in
 * dB between points. Beyond the last tabulated angle the last gain is held (the caller
 * flags that; see LinkSample.outsidePattern). Allocates nothing.
 */
export function patternGainDbi(offBoresightDeg: readonly number[], gainDbi: readonly number[], angleDeg: number): number {
  const n = offBoresightDeg.length;
  if (angleDeg <= 0) return gainDbi[0] as number;
  if (angleDeg >= (offBoresightDeg[n - 1] as number)) return gainDbi[n - 1] as number;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((offBoresightDeg[mid] as number) <= angleDeg) lo = mid;
    else hi = mid;
  }
  const a0 = offBoresightDeg[lo] as number;
  const a1 = offBoresightDeg[hi] as number;
  const g0 = gainDbi[lo] as number;
  const g1 = gainDbi[hi] as number;
  return g0 + ((g1 - g0) * (angleDeg - a0)) / (a1 - a0);
}

/**
 * Angle at the spacecraft between its nadir (towards Earth centre) and the station, deg.
 *
 * Triangle O (Earth centre), S (station), P (spacecraft), with |OS| = stationRadiusKm
 * (geocentric distance of the station), |SP| = rangeKm (slant range) and the angle at S
 * between SO and SP equal to 90 deg + elevation. Law of cosines:
 *   |OP|^2 = rS^2 + d^2 - 2 rS d cos(90 + el) = rS^2 + d^2 + 2 rS d sin(el)
 *   cos(eta) = (|OP|^2 + d^2 - rS^2) / (2 |OP| d)
 * Assumption: the local vertical passes through Earth centre (spherical Earth at the
 * station); the geodetic/geocentric vertical differ by up to 0.19 deg, which shifts the
 * result by less than that. Valid for elevation -90..90 and rangeKm > 0.
 */
export function offNadirAngleDeg(rangeKm: number, elevationDeg: number, stationRadiusKm: number): number {
  const sinEl = Math.sin(elevationDeg * DEG);
  const spacecraftRadiusSq = stationRadiusKm * stationRadiusKm + rangeKm * rangeKm + 2 * stationRadiusKm * rangeKm * sinEl;
  const spacecraftRadiusKm = Math.sqrt(spacecraftRadiusSq);
  let c = (spacecraftRadiusSq + rangeKm * rangeKm - stationRadiusKm * stationRadiusKm) / (2 * spacecraftRadiusKm * rangeKm);
  if (c > 1) c = 1;
  else if (c < -1) c = -1;
  return Math.acos(c) / DEG;
}
