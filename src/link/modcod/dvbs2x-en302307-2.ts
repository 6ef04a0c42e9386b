/**
 * DVB-S2X additional MODCODs, normal FECFRAME, AWGN: information bits per symbol and
 * ideal Es/N0 threshold (quasi-error-free; the S2X criterion is recalled as frame error
 * rate 1e-5: from memory, unverified).
 *
 * Source: ETSI EN 302 307-2 V1.1.1 (2015-02), clause 6, Table 20a.
 * OPTIONAL table, weaker than DVB-S2: the standard was not opened. 31 rows were
 * recalled and matched by one independent third-party table; 8 rows are FROM MEMORY,
 * UNVERIFIED (their `status` says so). Spectral efficiencies are computed from the frame
 * structure with t = 12; the two 128APSK efficiencies assume 9258 symbols per frame
 * (unverified). Names ending in "-L" are the constellations for linear channels.
 * Units: information bits per symbol; Es/N0 in dB. Transcribed from the project
 * reference sheet (dvbs2x_modcod.csv). Do not edit by hand.
 */
import type { ModcodEntry } from '../../scenario/types.js';

export interface Dvbs2xModcod extends ModcodEntry {
  modulation: string;
  codeRate: string;
  bitsPerSymbol: number;
  status: string;
  notes: string;
}

const SRC = 'ETSI EN 302 307-2 V1.1.1 (2015-02) clause 6 Table 20a (normal FECFRAME)';

export const DVBS2X_EN302307_2: readonly Dvbs2xModcod[] = [
  { name: 'QPSK 2/9', modulation: 'QPSK', codeRate: '2/9', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.434841, esN0ThresholdDb: -2.85, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "VL-SNR set" },
  { name: 'QPSK 13/45', modulation: 'QPSK', codeRate: '13/45', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.567805, esN0ThresholdDb: -2.03, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: 'QPSK 9/20', modulation: 'QPSK', codeRate: '9/20', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 0.889135, esN0ThresholdDb: 0.22, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: 'QPSK 11/20', modulation: 'QPSK', codeRate: '11/20', bitsPerSymbol: 2, spectralEfficiencyBitsPerSymbol: 1.088581, esN0ThresholdDb: 1.45, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '8APSK-L 5/9', modulation: '8APSK-L', codeRate: '5/9', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 1.647211, esN0ThresholdDb: 4.73, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '8APSK-L 26/45', modulation: '8APSK-L', codeRate: '26/45', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 1.713601, esN0ThresholdDb: 5.13, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '8PSK 23/36', modulation: '8PSK', codeRate: '23/36', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 1.896173, esN0ThresholdDb: 6.12, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '8PSK 25/36', modulation: '8PSK', codeRate: '25/36', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.062148, esN0ThresholdDb: 7.02, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '8PSK 13/18', modulation: '8PSK', codeRate: '13/18', bitsPerSymbol: 3, spectralEfficiencyBitsPerSymbol: 2.145136, esN0ThresholdDb: 7.49, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '16APSK-L 1/2', modulation: '16APSK-L', codeRate: '1/2', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 1.972253, esN0ThresholdDb: 5.97, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK-L 8/15', modulation: '16APSK-L', codeRate: '8/15', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.104850, esN0ThresholdDb: 6.55, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK-L 5/9', modulation: '16APSK-L', codeRate: '5/9', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.193247, esN0ThresholdDb: 6.84, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 26/45', modulation: '16APSK', codeRate: '26/45', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.281645, esN0ThresholdDb: 7.51, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '16APSK 3/5', modulation: '16APSK', codeRate: '3/5', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.370043, esN0ThresholdDb: 7.8, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '16APSK-L 3/5', modulation: '16APSK-L', codeRate: '3/5', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.370043, esN0ThresholdDb: 7.41, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 28/45', modulation: '16APSK', codeRate: '28/45', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.458441, esN0ThresholdDb: 8.1, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 23/36', modulation: '16APSK', codeRate: '23/36', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.524739, esN0ThresholdDb: 8.38, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK-L 2/3', modulation: '16APSK-L', codeRate: '2/3', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.635236, esN0ThresholdDb: 8.43, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 25/36', modulation: '16APSK', codeRate: '25/36', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.745734, esN0ThresholdDb: 9.27, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 13/18', modulation: '16APSK', codeRate: '13/18', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 2.856231, esN0ThresholdDb: 9.71, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 7/9', modulation: '16APSK', codeRate: '7/9', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.077225, esN0ThresholdDb: 10.65, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '16APSK 77/90', modulation: '16APSK', codeRate: '77/90', bitsPerSymbol: 4, spectralEfficiencyBitsPerSymbol: 3.386618, esN0ThresholdDb: 11.99, source: SRC, status: "from memory, unverified", notes: "" },
  { name: '32APSK-L 2/3', modulation: '32APSK-L', codeRate: '2/3', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.289502, esN0ThresholdDb: 11.1, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '32APSK 32/45', modulation: '32APSK', codeRate: '32/45', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.510192, esN0ThresholdDb: 11.75, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '32APSK 11/15', modulation: '32APSK', codeRate: '11/15', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.620536, esN0ThresholdDb: 12.17, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '32APSK 7/9', modulation: '32APSK', codeRate: '7/9', bitsPerSymbol: 5, spectralEfficiencyBitsPerSymbol: 3.841226, esN0ThresholdDb: 13.05, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '64APSK-L 32/45', modulation: '64APSK-L', codeRate: '32/45', bitsPerSymbol: 6, spectralEfficiencyBitsPerSymbol: 4.206428, esN0ThresholdDb: 13.98, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '64APSK 11/15', modulation: '64APSK', codeRate: '11/15', bitsPerSymbol: 6, spectralEfficiencyBitsPerSymbol: 4.338659, esN0ThresholdDb: 14.81, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '64APSK 7/9', modulation: '64APSK', codeRate: '7/9', bitsPerSymbol: 6, spectralEfficiencyBitsPerSymbol: 4.603122, esN0ThresholdDb: 15.47, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '64APSK 4/5', modulation: '64APSK', codeRate: '4/5', bitsPerSymbol: 6, spectralEfficiencyBitsPerSymbol: 4.735354, esN0ThresholdDb: 15.87, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '64APSK 5/6', modulation: '64APSK', codeRate: '5/6', bitsPerSymbol: 6, spectralEfficiencyBitsPerSymbol: 4.933701, esN0ThresholdDb: 16.55, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '128APSK 3/4', modulation: '128APSK', codeRate: '3/4', bitsPerSymbol: 7, spectralEfficiencyBitsPerSymbol: 5.169876, esN0ThresholdDb: 17.73, source: SRC, status: "from memory, unverified", notes: "spectral efficiency assumes 9258 symbols per XFECFRAME (not verified)" },
  { name: '128APSK 7/9', modulation: '128APSK', codeRate: '7/9', bitsPerSymbol: 7, spectralEfficiencyBitsPerSymbol: 5.362430, esN0ThresholdDb: 18.53, source: SRC, status: "from memory, unverified", notes: "spectral efficiency assumes 9258 symbols per XFECFRAME (not verified)" },
  { name: '256APSK-L 29/45', modulation: '256APSK-L', codeRate: '29/45', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.065690, esN0ThresholdDb: 16.98, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '256APSK-L 2/3', modulation: '256APSK-L', codeRate: '2/3', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.241514, esN0ThresholdDb: 17.24, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '256APSK-L 31/45', modulation: '256APSK-L', codeRate: '31/45', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.417338, esN0ThresholdDb: 18.1, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '256APSK 32/45', modulation: '256APSK', codeRate: '32/45', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.593162, esN0ThresholdDb: 18.59, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '256APSK-L 11/15', modulation: '256APSK-L', codeRate: '11/15', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.768987, esN0ThresholdDb: 18.84, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
  { name: '256APSK 3/4', modulation: '256APSK', codeRate: '3/4', bitsPerSymbol: 8, spectralEfficiencyBitsPerSymbol: 5.900855, esN0ThresholdDb: 19.57, source: SRC, status: "es_n0 from memory; agrees with one independent third-party tabulation; spectral efficiency computed from frame structure", notes: "" },
];
