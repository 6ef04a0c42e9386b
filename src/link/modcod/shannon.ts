/**
 * Shannon capacity of the occupied bandwidth of a carrier.
 *
 * Source: Shannon-Hartley, C = B log2(1 + S/N) for the band-limited AWGN channel
 * (C. E. Shannon, 1948; any digital-communications text). With S/N = (C/N0) / B:
 *   C = B log2(1 + (C/N0) / B)  bit/s.
 * Occupied bandwidth of a root-raised-cosine carrier B = Rs (1 + rolloff) (common
 * practice; DVB-S2 roll-offs 0.20, 0.25, 0.35, ETSI EN 302 307-1).
 * Also the Shannon minimum Eb/N0 for a spectral efficiency eta: (2^eta - 1) / eta.
 * Valid for B > 0; C/N0 in dB-Hz, any value.
 */
import { dbToLinear, linearToDb } from '../units.js';

/** Occupied bandwidth of a root-raised-cosine carrier, Hz: Rs (1 + rolloff). */
export function occupiedBandwidthHz(symbolRateBaud: number, rollOff: number): number {
  return symbolRateBaud * (1 + rollOff);
}

/** Capacity of bandwidth bandwidthHz at carrier-to-noise density cN0DbHz, bit/s. */
export function shannonCapacityBps(bandwidthHz: number, cN0DbHz: number): number {
  return bandwidthHz * Math.log2(1 + dbToLinear(cN0DbHz) / bandwidthHz);
}

/** Minimum Eb/N0 for error-free transmission at eta bit/s/Hz, dB: (2^eta - 1)/eta; -1.59 dB as eta -> 0. */
export function shannonMinEbN0Db(spectralEfficiencyBpsPerHz: number): number {
  const eta = spectralEfficiencyBpsPerHz;
  if (eta <= 0) return linearToDb(Math.LN2);
  return linearToDb((Math.pow(2, eta) - 1) / eta);
}
