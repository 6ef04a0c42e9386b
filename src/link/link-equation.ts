/**
 * The link equation in decibels: received power, C/N0, Eb/N0 and Es/N0.
 *
 * Sources:
 * - Friis transmission: Pr = EIRP + Gr - Lpath - Lother (dBW); Pratt & Allnutt,
 *   Satellite Communications, 3rd ed., eq. (4.7)-(4.8) (Examples 4.1-4.2).
 * - C/N0 = EIRP - losses + G/T - 10 log10 k (dB-Hz); Roddy, Satellite Communications,
 *   4th ed., eq. (12.38). Computation uses the exact 10 log10 k (units.ts).
 * - Eb/N0 = C/N0 - 10 log10 Rb; Es/N0 = Eb/N0 + 10 log10(information bits per symbol)
 *   (textbook definitions; ETSI EN 302 307-1 relates Es/N0 and spectral efficiency so).
 * Units: dBW, dBi, dB, dB/K, dB-Hz, bit/s.
 */
import { BOLTZMANN_EXACT_DBW_PER_K_HZ, linearToDb } from './units.js';

/** Received carrier power, dBW: EIRP + Gr - losses. */
export function receivedPowerDbw(eirpDbw: number, rxGainDbi: number, lossesDb: number): number {
  return eirpDbw + rxGainDbi - lossesDb;
}

/** Carrier-to-noise density, dB-Hz: EIRP - losses + G/T - 10 log10 k. */
export function carrierToNoiseDensityDbHz(eirpDbw: number, lossesDb: number, gOverTDbK: number): number {
  return eirpDbw - lossesDb + gOverTDbK - BOLTZMANN_EXACT_DBW_PER_K_HZ;
}

/** Eb/N0 per information bit, dB, at information rate rateBps. */
export function ebN0FromCn0Db(cN0DbHz: number, rateBps: number): number {
  return cN0DbHz - linearToDb(rateBps);
}

/** Es/N0, dB, from Eb/N0 and information bits per symbol. */
export function esN0FromEbN0Db(ebN0Db: number, bitsPerSymbol: number): number {
  return ebN0Db + linearToDb(bitsPerSymbol);
}
