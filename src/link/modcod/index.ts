/**
 * MODCOD and code tables by name, for scenario loading and reports. Names are matched
 * case-insensitively with runs of spaces collapsed.
 * Tables: "DVB-S2" (ETSI EN 302 307-1 V1.4.1 Table 13), "DVB-S2X" (ETSI EN 302 307-2
 * V1.1.1 Table 20a, optional, partly from memory); codes: CCSDS 131.0-B / 130.1-G.
 */
import type { ModcodEntry } from '../../scenario/types.js';
import { CCSDS_TM_CODES, type CcsdsCode } from './ccsds-tm-131.js';
import { DVBS2_EN302307_1 } from './dvbs2-en302307-1.js';
import { DVBS2X_EN302307_2 } from './dvbs2x-en302307-2.js';

export { bestModcod, lowestThresholdModcod, modcodStaircase, stepAt, type ModcodStaircase } from './acm.js';
export { occupiedBandwidthHz, shannonCapacityBps, shannonMinEbN0Db } from './shannon.js';
export { CCSDS_TM_CODES, type CcsdsCode } from './ccsds-tm-131.js';
export { DVBS2_EN302307_1, type Dvbs2Modcod } from './dvbs2-en302307-1.js';
export { DVBS2X_EN302307_2, type Dvbs2xModcod } from './dvbs2x-en302307-2.js';

function key(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLowerCase();
}

const TABLES: ReadonlyMap<string, readonly ModcodEntry[]> = new Map<string, readonly ModcodEntry[]>([
  ['dvb-s2', DVBS2_EN302307_1],
  ['dvbs2', DVBS2_EN302307_1],
  ['dvb-s2x', DVBS2X_EN302307_2],
  ['dvbs2x', DVBS2X_EN302307_2],
]);

/** Names accepted by modcodTable (canonical spellings). */
export const MODCOD_TABLE_NAMES: readonly string[] = ['DVB-S2', 'DVB-S2X'];

/** A MODCOD table by name ("DVB-S2", "DVB-S2X"), or undefined. */
export function modcodTable(name: string): readonly ModcodEntry[] | undefined {
  return TABLES.get(key(name));
}

/** One entry of a named table ("QPSK 1/2" in "DVB-S2"), or undefined. */
export function modcodByName(tableName: string, entryName: string): ModcodEntry | undefined {
  const t = modcodTable(tableName);
  if (t === undefined) return undefined;
  const k = key(entryName);
  return t.find((e) => key(e.name) === k);
}

/** A CCSDS code by name ("conv K7 r1/2 BER 1e-5"), or undefined. */
export function ccsdsCode(name: string): CcsdsCode | undefined {
  const k = key(name);
  return CCSDS_TM_CODES.find((c) => key(c.name) === k);
}

/** Names accepted by ccsdsCode, for "what would be valid" messages. */
export const CCSDS_CODE_NAMES: readonly string[] = CCSDS_TM_CODES.map((c) => c.name);
