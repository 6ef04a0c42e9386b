/**
 * Resolves a radio's coding entry to a Coding:
 * - adaptive over a shipped table: { adaptive: true, table: "DVB-S2", symbolRateBaud, rollOff };
 * - a fixed entry of a table: { table: "DVB-S2", code: "QPSK 1/2", symbolRateBaud | informationRateBps };
 * - a fixed CCSDS code: { code: "turbo r1/2 k8920 BER 1e-6", informationRateBps } (QPSK assumed
 *   for the symbol rate unless spectralEfficiencyBitsPerSymbol is given: 2 x code rate);
 * - a code of one's own: { ebN0ThresholdDb, informationRateBps, spectralEfficiencyBitsPerSymbol }.
 * Roll-off defaults to 0.35 (DVB-S2's widest, common practice).
 */
import type { Problem } from '../errors.js';
import type { Coding } from './types.js';
import type { RadioEntry } from './schema.js';
import { modcodTable, modcodByName, ccsdsCode, MODCOD_TABLE_NAMES, CCSDS_CODE_NAMES } from '../link/modcod/index.js';

export const DEFAULT_ROLL_OFF = 0.35;

const INVALID: Coding = { kind: 'fixed', name: 'invalid', ebN0ThresholdDb: 0, informationRateBps: 1, spectralEfficiencyBitsPerSymbol: 1, rollOff: DEFAULT_ROLL_OFF };

export function resolveCoding(c: RadioEntry['coding'], file: string, path: string, problems: Problem[]): Coding {
  const rollOff = c.rollOff ?? DEFAULT_ROLL_OFF;
  const bad = (field: string, message: string): Coding => {
    problems.push({ file, path: field ? `${path}.${field}` : path, message });
    return INVALID;
  };
  const tableList = MODCOD_TABLE_NAMES.join(', ');

  if (c.adaptive) {
    if (c.table === undefined) return bad('table', `is required for adaptive coding (one of ${tableList})`);
    const table = modcodTable(c.table);
    if (!table) return bad('table', `${JSON.stringify(c.table)} is not a known table (one of ${tableList})`);
    if (c.symbolRateBaud === undefined) return bad('symbolRateBaud', 'is required for adaptive coding');
    return { kind: 'adaptive', tableName: c.table, table: [...table], symbolRateBaud: c.symbolRateBaud, rollOff };
  }

  if (c.code !== undefined && c.table !== undefined) {
    const entry = modcodTable(c.table) ? modcodByName(c.table, c.code) : undefined;
    if (!modcodTable(c.table)) return bad('table', `${JSON.stringify(c.table)} is not a known table (one of ${tableList})`);
    if (!entry) return bad('code', `${JSON.stringify(c.code)} is not an entry of ${c.table} (e.g. "QPSK 1/2", "8PSK 3/5")`);
    const eff = entry.spectralEfficiencyBitsPerSymbol;
    const rate = c.informationRateBps ?? (c.symbolRateBaud !== undefined ? c.symbolRateBaud * eff : undefined);
    if (rate === undefined) return bad('', 'needs informationRateBps or symbolRateBaud');
    return { kind: 'fixed', name: `${c.table} ${entry.name}`, ebN0ThresholdDb: entry.esN0ThresholdDb - 10 * Math.log10(eff), informationRateBps: rate, spectralEfficiencyBitsPerSymbol: eff, rollOff };
  }

  if (c.code !== undefined && c.ebN0ThresholdDb === undefined) {
    const code = ccsdsCode(c.code);
    if (!code) return bad('code', `${JSON.stringify(c.code)} is not a known code (one of: ${CCSDS_CODE_NAMES.join('; ')}); or give table with a MODCOD name, or ebN0ThresholdDb`);
    if (c.informationRateBps === undefined) return bad('informationRateBps', 'is required for a fixed code');
    return {
      kind: 'fixed',
      name: code.name,
      ebN0ThresholdDb: code.ebN0ThresholdDb,
      informationRateBps: c.informationRateBps,
      spectralEfficiencyBitsPerSymbol: c.spectralEfficiencyBitsPerSymbol ?? 2 * code.rate,
      rollOff,
    };
  }

  if (c.ebN0ThresholdDb !== undefined) {
    if (c.informationRateBps === undefined) return bad('informationRateBps', 'is required with ebN0ThresholdDb');
    return {
      kind: 'fixed',
      name: c.code ?? 'own code',
      ebN0ThresholdDb: c.ebN0ThresholdDb,
      informationRateBps: c.informationRateBps,
      spectralEfficiencyBitsPerSymbol: c.spectralEfficiencyBitsPerSymbol ?? 1,
      rollOff,
    };
  }
  return bad('', `needs adaptive + table, a code name, or ebN0ThresholdDb with informationRateBps`);
}
