/**
 * Polarisation mismatch loss between the spacecraft's transmit polarisation and the
 * station's receive polarisation, dB.
 *
 * Sources and assumptions:
 * - Circular vs linear: half the power is lost, 10 log10 2 = 3.0103 dB (any
 *   antenna-theory text, e.g. Pratt & Allnutt, Satellite Communications, 3rd ed., ch. 5;
 *   ideal circular polarisation assumed).
 * - Same sense of circular polarisation: 0 dB (ideal axial ratio assumed).
 * - Opposite circular senses, and orthogonal linear (h vs v): the wanted signal arrives
 *   only through the cross-polar discrimination of the two antennas. We take
 *   CROSS_POLAR_LOSS_DB = 25 dB, the middle of the 20-30 dB cross-polar isolation usual
 *   for earth-station and spacecraft antennas (common practice, an assumption, not a
 *   published figure); in effect: the link does not close.
 * - Linear vs linear with the same label: 0 dB. A spacecraft's linear polarisation
 *   angle as seen by the station changes with geometry (and Faraday rotation below
 *   about 10 GHz); we assume the station tracks the polarisation angle, so "same
 *   label" means aligned. For a known misalignment angle use linearMismatchLossDb.
 */
import type { Polarization } from '../scenario/types.js';
import { amplitudeToDb } from './units.js';

/** Loss for opposite-sense / orthogonal polarisations, dB (assumed; see head comment). */
export const CROSS_POLAR_LOSS_DB = 25;
/** Loss between circular and linear polarisation, dB: 10 log10 2. */
export const CIRCULAR_TO_LINEAR_LOSS_DB = amplitudeToDb(Math.SQRT2);

function isCircular(p: Polarization): boolean {
  return p === 'RHCP' || p === 'LHCP';
}

/** Mismatch loss, dB, between a transmit and a receive polarisation. */
export function polarizationMismatchLossDb(tx: Polarization, rx: Polarization): number {
  if (tx === rx) return 0;
  if (isCircular(tx) !== isCircular(rx)) return CIRCULAR_TO_LINEAR_LOSS_DB;
  // Both circular of opposite sense, or linear-h against linear-v.
  return CROSS_POLAR_LOSS_DB;
}

/**
 * Loss between two linear polarisations misaligned by angleDeg, dB: -20 log10|cos angle|,
 * floored at the cross-polar isolation CROSS_POLAR_LOSS_DB (Malus's law for the
 * co-polar component).
 */
export function linearMismatchLossDb(angleDeg: number): number {
  const c = Math.abs(Math.cos((angleDeg * Math.PI) / 180));
  const lossDb = -amplitudeToDb(c);
  return lossDb < CROSS_POLAR_LOSS_DB ? lossDb : CROSS_POLAR_LOSS_DB;
}

/**
 * Polarisation tilt relative to horizontal for the rain model (ITU-R P.838-3 eq. 4-5
 * convention): 0 horizontal, 90 vertical, 45 circular.
 */
export function polarizationTiltDeg(p: Polarization): number {
  if (p === 'linear-h') return 0;
  if (p === 'linear-v') return 90;
  return 45;
}
