/**
 * DVB-S2 MODCODs, normal FECFRAME (64 800 bits), without pilots: information bits per
 * symbol and ideal Es/N0 for quasi-error-free reception (packet error rate 1e-7 on
 * 188-byte packets, AWGN, perfect synchronisation, 50 LDPC iterations).
 *
 * Source: ETSI EN 302 307-1 V1.4.1 (2014-11), clause 6, Table 13 (same values in the
 * single-part editions EN 302 307 V1.1.2, V1.2.1, V1.3.1).
 * Units: spectralEfficiencyBitsPerSymbol in information bits per transmitted symbol
 * (bit/s per Hz of symbol rate); esN0ThresholdDb in dB.
 * Transcribed from the project reference sheet (dvbs2_modcod.csv); each row keeps its
 * status note. Spectral efficiencies re-derive exactly from the frame structure
 * (Kbch - 80) / (64800/m + 90); see test/link/modcod/dvbs2.test.ts. Do not edit by hand.
 */
import type { ModcodEntry } from '../../scenario/types.js';

export interface Dvbs2Modcod extends ModcodEntry {
  modulation: string;
  /** LDPC code rate as printed, e.g. "3/4". */
  codeRate: string;
  bitsPerSymbol: number;
  /** BCH information length, bits (frame structure). */
  kbchBits: number;
  /** How far the row was checked (reference sheet wording). */
  status: string;
}

const SRC = 'ETSI EN 302 307-1 V1.4.1 (2014-11) clause 6 Table 13';

const STATUS = "es_n0: standard value cross-checked against independent third-party tabulations; spectral efficiency reproduced exactly from frame structure";

export const DVBS2_EN302307_1: readonly Dvbs2Modcod[] = [
  { name: 'QPSK 1/4', modulation: 'QPSK', codeRate: '1/4', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.490243, esN0ThresholdDb: -2.35, kbchBits: 16008, source: SRC, status: STATUS },
  { name: 'QPSK 1/3', modulation: 'QPSK', codeRate: '1/3', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.656448, esN0ThresholdDb: -1.24, kbchBits: 21408, source: SRC, status: STATUS },
  { name: 'QPSK 2/5', modulation: 'QPSK', codeRate: '2/5', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.789412, esN0ThresholdDb: -0.3, kbchBits: 25728, source: SRC, status: STATUS },
  { name: 'QPSK 1/2', modulation: 'QPSK', codeRate: '1/2', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.988858, esN0ThresholdDb: 1.0, kbchBits: 32208, source: SRC, status: STATUS },
  { name: 'QPSK 3/5', modulation: 'QPSK', codeRate: '3/5', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.188304, esN0ThresholdDb: 2.23, kbchBits: 38688, source: SRC, status: STATUS },
  { name: 'QPSK 2/3', modulation: 'QPSK', codeRate: '2/3', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.322253, esN0ThresholdDb: 3.1, kbchBits: 43040, source: SRC, status: STATUS },
  { name: 'QPSK 3/4', modulation: 'QPSK', codeRate: '3/4', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.487473, esN0ThresholdDb: 4.03, kbchBits: 48408, source: SRC, status: STATUS },
  { name: 'QPSK 4/5', modulation: 'QPSK', codeRate: '4/5', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.587196, esN0ThresholdDb: 4.68, kbchBits: 51648, source: SRC, status: STATUS },
  { name: 'QPSK 5/6', modulation: 'QPSK', codeRate: '5/6', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.654663, esN0ThresholdDb: 5.18, kbchBits: 53840, source: SRC, status: STATUS },
  { name: 'QPSK 8/9', modulation: 'QPSK', codeRate: '8/9', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.766451, esN0ThresholdDb: 6.2, kbchBits: 57472, source: SRC, status: STATUS },
  { name: 'QPSK 9/10', modulation: 'QPSK', codeRate: '9/10', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.788612, esN0ThresholdDb: 6.42, kbchBits: 58192, source: SRC, status: STATUS },
  { name: '8PSK 3/5', modulation: '8PSK', codeRate: '3/5', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 1.779991, esN0ThresholdDb: 5.5, kbchBits: 38688, source: SRC, status: STATUS },
  { name: '8PSK 2/3', modulation: '8PSK', codeRate: '2/3', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 1.980636, esN0ThresholdDb: 6.62, kbchBits: 43040, source: SRC, status: STATUS },
  { name: '8PSK 3/4', modulation: '8PSK', codeRate: '3/4', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.228124, esN0ThresholdDb: 7.91, kbchBits: 48408, source: SRC, status: STATUS },
  { name: '8PSK 5/6', modulation: '8PSK', codeRate: '5/6', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.478562, esN0ThresholdDb: 9.35, kbchBits: 53840, source: SRC, status: STATUS },
  { name: '8PSK 8/9', modulation: '8PSK', codeRate: '8/9', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.646012, esN0ThresholdDb: 10.69, kbchBits: 57472, source: SRC, status: STATUS },
  { name: '8PSK 9/10', modulation: '8PSK', codeRate: '9/10', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.679207, esN0ThresholdDb: 10.98, kbchBits: 58192, source: SRC, status: STATUS },
  { name: '16APSK 2/3', modulation: '16APSK', codeRate: '2/3', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.637201, esN0ThresholdDb: 8.97, kbchBits: 43040, source: SRC, status: STATUS },
  { name: '16APSK 3/4', modulation: '16APSK', codeRate: '3/4', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.966728, esN0ThresholdDb: 10.21, kbchBits: 48408, source: SRC, status: STATUS },
  { name: '16APSK 4/5', modulation: '16APSK', codeRate: '4/5', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.165623, esN0ThresholdDb: 11.03, kbchBits: 51648, source: SRC, status: STATUS },
  { name: '16APSK 5/6', modulation: '16APSK', codeRate: '5/6', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.300184, esN0ThresholdDb: 11.61, kbchBits: 53840, source: SRC, status: STATUS },
  { name: '16APSK 8/9', modulation: '16APSK', codeRate: '8/9', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.523143, esN0ThresholdDb: 12.89, kbchBits: 57472, source: SRC, status: STATUS },
  { name: '16APSK 9/10', modulation: '16APSK', codeRate: '9/10', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.567342, esN0ThresholdDb: 13.13, kbchBits: 58192, source: SRC, status: STATUS },
  { name: '32APSK 3/4', modulation: '32APSK', codeRate: '3/4', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.703295, esN0ThresholdDb: 12.73, kbchBits: 48408, source: SRC, status: STATUS },
  { name: '32APSK 4/5', modulation: '32APSK', codeRate: '4/5', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.951571, esN0ThresholdDb: 13.64, kbchBits: 51648, source: SRC, status: STATUS },
  { name: '32APSK 5/6', modulation: '32APSK', codeRate: '5/6', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 4.119540, esN0ThresholdDb: 14.28, kbchBits: 53840, source: SRC, status: STATUS },
  { name: '32APSK 8/9', modulation: '32APSK', codeRate: '8/9', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 4.397854, esN0ThresholdDb: 15.69, kbchBits: 57472, source: SRC, status: STATUS },
  { name: '32APSK 9/10', modulation: '32APSK', codeRate: '9/10', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 4.453027, esN0ThresholdDb: 16.05, kbchBits: 58192, source: SRC, status: STATUS },
];
