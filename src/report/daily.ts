/**
 * Renders daily totals per station and totals per spacecraft: records for
 * JSON and CSV (fixed rounding: times to the ms, durations to 0.1 s, volumes
 * to the bit) and a compact terminal table (one line per day, one column per
 * station). Pure: returns strings and records; writing is write.ts's job.
 */
import { stringify } from 'csv-stringify/sync';
import type { AllStationsDay, DailyRow, DayMode, SpacecraftTotal } from '../plan/daily.js';
import { isoUtc, formatDuration } from '../time/format.js';
import { renderTable, formatBits, type Column } from './table.js';

const round1 = (v: number) => Number(v.toFixed(1));

export type DailyRecord = Record<string, string | number | boolean | Record<string, string | number>[]>;

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
    expected_volume_bits: r.expectedVolumeBits,
  };
}

/**
 * volume_bits and contact_time_s count each radio's data and time once (the best station
 * at each instant; the union of the windows); the station_sum_ fields add up the stations.
 * expected_volume_bits: the mean over an average year's attenuation statistics, counted once
 * the same way. With a recorder: delivered_bits left the recorder, volume_bits is then link capacity.
 */
export function spacecraftTotalRecord(t: SpacecraftTotal): DailyRecord {
  return {
    spacecraft: t.spacecraftId,
    contacts: t.contactCount,
    contact_time_s: round1(t.contactTimeS),
    volume_bits: t.volumeBits,
    station_sum_contact_time_s: round1(t.stationSumContactTimeS),
    station_sum_volume_bits: t.stationSumVolumeBits,
    expected_volume_bits: t.expectedVolumeBits,
    station_sum_expected_volume_bits: t.stationSumExpectedVolumeBits,
    ...(t.deliveredBits !== undefined ? { delivered_bits: t.deliveredBits } : {}),
    ...(t.otherRadios
      ? { other_radios: t.otherRadios.map((r) => ({ radio: r.radioId, volume_bits: r.volumeBits, station_sum_volume_bits: r.stationSumVolumeBits })) }
      : {}),
  } as DailyRecord;
}

/** One UTC day over all stations: volume counted once, and the station-sum. */
export function allStationsDayRecord(d: AllStationsDay): DailyRecord {
  return {
    day: d.day,
    day_start_utc: isoUtc(d.dayStartMs, 3),
    day_end_utc: isoUtc(d.dayEndMs, 3),
    contacts: d.contactCount,
    volume_bits: d.volumeBits,
    station_sum_volume_bits: d.stationSumVolumeBits,
    expected_volume_bits: d.expectedVolumeBits,
    station_sum_expected_volume_bits: d.stationSumExpectedVolumeBits,
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
  'expected_volume_bits',
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
export function renderDailyTable(rows: readonly DailyRow[], mode: DayMode, totals: readonly SpacecraftTotal[], allStations?: readonly AllStationsDay[]): string {
  const once = new Map((allStations ?? []).map((d) => [d.day, d]));
  const stations: string[] = [];
  for (const r of rows) if (!stations.includes(r.stationId)) stations.push(r.stationId);
  const days = [...new Set(rows.map((r) => r.day))].sort();
  const cell = new Map(rows.map((r) => [`${r.stationId}|${r.day}`, r]));
  const cols: Column[] = [{ header: mode.kind === 'utc' ? 'day (UTC)' : 'day (station local)' }];
  for (const s of stations) cols.push({ header: s, align: 'right' });
  if (mode.kind === 'utc' && allStations) cols.push({ header: 'all stations, counted once', align: 'right' }, { header: 'expected, counted once', align: 'right' });
  if (mode.kind === 'utc') cols.push({ header: 'station sum', align: 'right' });
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
    if (mode.kind === 'utc' && allStations) line.push(formatBits(once.get(day)?.volumeBits ?? 0), formatBits(once.get(day)?.expectedVolumeBits ?? 0));
    if (mode.kind === 'utc') line.push(`${formatBits(sumBits)} (${sumCount})`);
    return line;
  });
  const parts = [`Daily volume per station (contacts counted on their AOS day)`, renderTable(cols, body)];
  if (dst) parts.push('"*": 23- or 25-hour local day (daylight-saving change).');
  if (partial) parts.push('"~": day only partly inside the span.');
  if (mode.kind === 'utc' && allStations) {
    parts.push('"counted once": each radio\'s data once, from the best station in contact at each instant; "station sum": simultaneous reception counted at every station.');
    parts.push('"expected": the mean over an average year\'s attenuation statistics; the other volumes are at the link\'s availability.');
  }
  parts.push('');
  parts.push('Per spacecraft over the span (volume and contact time counted once: best station at each instant, union of the windows)');
  const recorder = totals.some((t) => t.deliveredBits !== undefined);
  const cols2: Column[] = [
    { header: 'spacecraft' },
    { header: 'contacts', align: 'right' },
    { header: 'contact time', align: 'right' },
    { header: recorder ? 'link capacity' : 'volume', align: 'right' },
    { header: recorder ? 'expected capacity' : 'expected', align: 'right' },
  ];
  if (recorder) cols2.push({ header: 'delivered (from recorder)', align: 'right' });
  cols2.push({ header: 'station-sum time', align: 'right' }, { header: 'station-sum volume', align: 'right' });
  parts.push(
    renderTable(
      cols2,
      totals.map((t) => {
        const r = [t.spacecraftId, String(t.contactCount), formatDuration(t.contactTimeS), formatBits(t.volumeBits), formatBits(t.expectedVolumeBits)];
        if (recorder) r.push(t.deliveredBits === undefined ? '-' : formatBits(t.deliveredBits));
        r.push(formatDuration(t.stationSumContactTimeS), formatBits(t.stationSumVolumeBits));
        return r;
      }),
    ),
  );
  if (recorder) parts.push('"link capacity": what the links could carry; "delivered": what left the onboard recorder (spacecraft without a recorder: "-").');
  const others = totals.flatMap((t) => (t.otherRadios ?? []).map((r) => `${t.spacecraftId} ${r.radioId} ${formatBits(r.volumeBits)} (station sum ${formatBits(r.stationSumVolumeBits)})`));
  if (others.length > 0) parts.push(`Other radios (each its own volume, counted once): ${others.join('; ')}`);
  return parts.join('\n') + '\n';
}
