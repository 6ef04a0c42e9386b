/**
 * `passbudget codes`: every MODCOD and code-table entry a radio's coding may name, with its
 * threshold, efficiency and source. Pure: returns strings.
 */
import { CCSDS_TM_CODES, DVBS2_EN302307_1, DVBS2X_EN302307_2 } from '../link/modcod/index.js';
import { fixed, renderTable } from './table.js';

export interface CodeRow {
  /** How a scenario names it: { table, code } or { code }. */
  table: string | null;
  name: string;
  threshold_kind: 'Es/N0' | 'Eb/N0';
  threshold_db: number;
  /** Information bits per symbol (for a CCSDS code: QPSK, 2 x code rate, unless the radio says otherwise). */
  spectral_efficiency_bits_per_symbol: number;
  error_criterion: string;
  source: string;
}

export function codeRows(): CodeRow[] {
  const rows: CodeRow[] = [];
  for (const [table, list, criterion] of [
    ['DVB-S2', DVBS2_EN302307_1, 'PER 1e-7 (quasi-error-free)'],
    ['DVB-S2X', DVBS2X_EN302307_2, 'PER 1e-7 (quasi-error-free)'],
  ] as const) {
    for (const e of list) {
      rows.push({ table, name: e.name, threshold_kind: 'Es/N0', threshold_db: e.esN0ThresholdDb, spectral_efficiency_bits_per_symbol: e.spectralEfficiencyBitsPerSymbol, error_criterion: criterion, source: e.source });
    }
  }
  for (const c of CCSDS_TM_CODES) {
    rows.push({
      table: null,
      name: c.name,
      threshold_kind: 'Eb/N0',
      threshold_db: c.ebN0ThresholdDb,
      spectral_efficiency_bits_per_symbol: Number((2 * c.rate).toFixed(6)),
      error_criterion: c.errorCriterion,
      source: `${c.source}; ${c.status}${c.toleranceDb > 0 ? `, +/- ${c.toleranceDb} dB` : ''}`,
    });
  }
  return rows;
}

export function renderCodesTable(rows: readonly CodeRow[]): string {
  const body = rows.map((r) => [r.table ?? '(code)', r.name, r.threshold_kind, fixed(r.threshold_db, 2), fixed(r.spectral_efficiency_bits_per_symbol, 4), r.error_criterion, r.source]);
  return (
    renderTable(
      [{ header: 'table' }, { header: 'name' }, { header: 'threshold' }, { header: 'dB', align: 'right' }, { header: 'bit/symbol', align: 'right' }, { header: 'criterion' }, { header: 'source' }],
      body,
    ) +
    '\n\nIn a radio: coding: { adaptive: true, table: DVB-S2, symbolRateBaud: ... }, { table: DVB-S2, code: "QPSK 1/2", symbolRateBaud: ... },\n' +
    'or { code: "<a (code) name>", informationRateBps: ... }. A CCSDS code is taken as QPSK (2 x code rate bit/symbol) unless spectralEfficiencyBitsPerSymbol is given.\n'
  );
}

export function renderCodesJson(rows: readonly CodeRow[]): string {
  return JSON.stringify({ codes: rows }, null, 2) + '\n';
}
