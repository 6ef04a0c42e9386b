/**
 * Renders daily totals per station and totals per spacecraft: records for
 * JSON and CSV (fixed rounding: times to the ms, durations to 0.1 s, volumes
 * to the bit) and a compact terminal table (one line per day, one column per
 * station). Pure: returns strings and records; writing is write.ts's job.
 */
import { stringify } from 'csv-stringify/sync';
import type { DailyRow, DayMode, SpacecraftTotal } from '../plan/daily.js';
import { isoUtc, formatDuration } from '../time/format.js';
import { renderTable, formatBits, type Column } from './table.js';

const round1 = (v: number) => Number(v.toFixed(1));

export type DailyRecord = Record<string, string | number | boolean>;

export function dailyRecord(r: DailyRow): DailyRecord {
  return {
    station: r.stationId,
    time_zone: r.timeZone,
    day: r.day,
    day_start_utc: isoUtc(r.dayStartMs, 3),
    day_end_utc: isoUtc(r.dayEndMs, 3),
    day_hours: r.dayHours,
    dst_change: r.dstChange,
    partial_day: r.partial,
    contacts: r.contactCount,
    contact_time_s: round1(r.contactTimeS),
    volume_bits: r.volumeBits,
  };
}

export function spacecraftTotalRecord(t: SpacecraftTotal): DailyRecord {
  return {
    spacecraft: t.spacecraftId,
    contacts: t.contactCount,
    contact_time_s: round1(t.contactTimeS),
    volume_bits: t.volumeBits,
  };
}

const DAILY_COLUMNS = [
  'station',
  'time_zone',
  'day',
  'day_start_utc',
  'day_end_utc',
  'day_hours',
  'dst_change',
  'partial_day',
  'contacts',
  'contact_time_s',
  'volume_bits',
];

export function renderDailyCsv(rows: readonly DailyRow[]): string {
  return stringify(rows.map(dailyRecord), {
    header: true,
    columns: DAILY_COLUMNS,
    cast: { boolean: (v) => (v ? 'true' : 'false') },
  });
}

/**
 * Terminal table: a line per calendar day, a column per station holding
 * "volume (contacts)". Flags: "*" a 23/25-hour day (daylight-saving change),
 * "~" a day only partly inside the span. With local days each station's
 * column holds its own local day of that date.
 */
export function renderDailyTable(rows: readonly DailyRow[], mode: DayMode, totals: readonly SpacecraftTotal[]): string {
  const stations: string[] = [];
  for (const r of rows) if (!stations.includes(r.stationId)) stations.push(r.stationId);
  const days = [...new Set(rows.map((r) => r.day))].sort();
  const cell = new Map(rows.map((r) => [`${r.stationId}|${r.day}`, r]));
  const cols: Column[] = [{ header: mode.kind === 'utc' ? 'day (UTC)' : 'day (station local)' }];
  for (const s of stations) cols.push({ header: s, align: 'right' });
  if (mode.kind === 'utc') cols.push({ header: 'all stations', align: 'right' });
  let dst = false;
  let partial = false;
  const body = days.map((day) => {
    const line = [day];
    let sumBits = 0;
    let sumCount = 0;
    for (const s of stations) {
      const r = cell.get(`${s}|${day}`);
      if (!r) {
        line.push('');
        continue;
      }
      sumBits += r.volumeBits;
      sumCount += r.contactCount;
      const flag = (r.dstChange ? '*' : '') + (r.partial ? '~' : '');
      dst ||= r.dstChange;
      partial ||= r.partial;
      line.push(`${formatBits(r.volumeBits)} (${r.contactCount})${flag}`);
    }
    if (mode.kind === 'utc') line.push(`${formatBits(sumBits)} (${sumCount})`);
    return line;
  });
  const parts = [`Daily volume per station (contacts counted on their AOS day)`, renderTable(cols, body)];
  if (dst) parts.push('"*": 23- or 25-hour local day (daylight-saving change).');
  if (partial) parts.push('"~": day only partly inside the span.');
  parts.push('');
  parts.push('Per spacecraft over the span');
  parts.push(
    renderTable(
      [{ header: 'spacecraft' }, { header: 'contacts', align: 'right' }, { header: 'contact time', align: 'right' }, { header: 'volume', align: 'right' }],
      totals.map((t) => [t.spacecraftId, String(t.contactCount), formatDuration(t.contactTimeS), formatBits(t.volumeBits)]),
    ),
  );
  return parts.join('\n') + '\n';
}
