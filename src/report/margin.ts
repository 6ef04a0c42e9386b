/**
 * Renders the worst-case elevation margin check (src/plan/margin.ts): a terminal
 * table, JSON and CSV. Pure: returns strings; writing is write.ts's job.
 * Fixed rounding: elevations 0.01 deg, ranges 0.1 km, margins 0.01 dB, rates to the bit/s.
 */
import { stringify } from 'csv-stringify/sync';
import type { MarginRow } from '../plan/margin.js';
import type { Span } from '../scenario/types.js';
import { isoUtc } from '../time/format.js';
import { renderTable, fixed, type Column } from './table.js';

export interface MarginReport {
  span: Span;
  availabilityPercent: number;
  rows: MarginRow[];
}

const round = (v: number | null, d: number): number | null => (v !== null && Number.isFinite(v) ? Number(v.toFixed(d)) : null);

/** PASS, FAIL or "not visible" (a pair with no contact in the span). */
export function resultText(r: MarginRow): string {
  return r.result === 'pass' ? 'PASS' : r.result === 'fail' ? 'FAIL' : r.result;
}

function usableText(r: MarginRow): string {
  if (r.usableMaskDeg === null) return 'never';
  return fixed(r.usableMaskDeg, 2);
}

export function renderMarginTable(report: MarginReport): string {
  const cols: Column[] = [
    { header: 'station' },
    { header: 'spacecraft' },
    { header: 'radio' },
    { header: 'mask deg', align: 'right' },
    { header: 'worst range km', align: 'right' },
    { header: 'margin at mask dB', align: 'right' },
    { header: 'modcod at mask' },
    { header: 'usable mask deg', align: 'right' },
    { header: 'worst seen dB', align: 'right' },
    { header: 'contacts', align: 'right' },
    { header: 'result' },
  ];
  const body = report.rows.map((r) => [
    r.station,
    r.spacecraft,
    r.radioId,
    fixed(r.maskElevationDeg, 2),
    fixed(r.worstRangeKm, 1),
    fixed(r.maskMarginDb, 2),
    r.maskModcod || '-',
    usableText(r),
    r.worstSeenMarginDb === null ? '-' : fixed(r.worstSeenMarginDb, 2),
    String(r.contacts),
    resultText(r),
  ]);
  const failed = report.rows.filter((r) => r.result === 'fail').length;
  const passed = report.rows.filter((r) => r.result === 'pass').length;
  const hidden = report.rows.length - failed - passed;
  return (
    `Worst-case elevation margin, ${isoUtc(report.span.startMs, 0)} .. ${isoUtc(report.span.endMs, 0)}, ` +
    `atmosphere at ${report.availabilityPercent} % availability\n` +
    `(margin net of each radio's required margin, at the lowest mask elevation and the longest slant range the orbit reaches there)\n\n` +
    renderTable(cols, body) +
    `\n\n${passed} pass, ${failed} fail` +
    (hidden > 0 ? `, ${hidden} not graded (not visible: no contact in the span; no feed: the station cannot hear the radio)` : '') +
    '\n'
  );
}

function jsonRow(r: MarginRow) {
  return {
    station: r.station,
    spacecraft: r.spacecraft,
    radio: r.radioId,
    mask_elevation_deg: round(r.maskElevationDeg, 2),
    max_geocentric_radius_km: round(r.maxRadiusKm, 1),
    max_geocentric_radius_utc: (Number.isFinite(r.maxRadiusAtMs) ? isoUtc(r.maxRadiusAtMs, 3) : null),
    worst_range_km: round(r.worstRangeKm, 1),
    mask_margin_db: round(r.maskMarginDb, 2),
    mask_modcod: r.maskModcod,
    mask_rate_bps: Math.round(r.maskRateBps),
    usable_mask_deg: round(r.usableMaskDeg, 2),
    worst_seen_margin_db: round(r.worstSeenMarginDb, 2),
    contacts: r.contacts,
    pass: r.pass,
    result: r.result,
  };
}

export function renderMarginJson(report: MarginReport): string {
  return (
    JSON.stringify(
      {
        from_utc: isoUtc(report.span.startMs, 3),
        to_utc: isoUtc(report.span.endMs, 3),
        availability_percent: report.availabilityPercent,
        pass: report.rows.every((r) => r.result !== 'fail'),
        rows: report.rows.map(jsonRow),
      },
      null,
      2,
    ) + '\n'
  );
}

export const MARGIN_CSV_COLUMNS = [
  'station',
  'spacecraft',
  'radio',
  'mask_elevation_deg',
  'max_geocentric_radius_km',
  'worst_range_km',
  'mask_margin_db',
  'mask_modcod',
  'mask_rate_bps',
  'usable_mask_deg',
  'worst_seen_margin_db',
  'contacts',
  'result',
] as const;

export function renderMarginCsv(report: MarginReport): string {
  const cell = (v: number | null, d: number) => (v === null || !Number.isFinite(v) ? '' : v.toFixed(d));
  const rows = report.rows.map((r) => [
    r.station,
    r.spacecraft,
    r.radioId,
    cell(r.maskElevationDeg, 2),
    cell(r.maxRadiusKm, 1),
    cell(r.worstRangeKm, 1),
    cell(r.maskMarginDb, 2),
    r.maskModcod,
    cell(r.maskRateBps, 0),
    cell(r.usableMaskDeg, 2),
    cell(r.worstSeenMarginDb, 2),
    String(r.contacts),
    resultText(r),
  ]);
  return stringify([[...MARGIN_CSV_COLUMNS], ...rows]);
}
