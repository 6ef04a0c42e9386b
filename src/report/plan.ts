/**
 * Renders a plan: the terminal table per station, and the JSON and CSV forms
 * written under out/. Pure: returns strings; writing is write.ts's job.
 * Rounding is fixed (times to 0.1 s, angles to 0.01 deg, margins to 0.01 dB,
 * volumes to the bit) so the same inputs give byte-identical files.
 */
import { stringify } from 'csv-stringify/sync';
import type { PlanResult, Contact, SunOutage } from '../plan/types.js';
import { SUN_OUTAGE_BEAMWIDTHS } from '../geometry/sun-outage.js';
import { isoUtc, isoInZone, formatDuration } from '../time/format.js';
import { renderTable, fixed, formatBits, type Column } from './table.js';
import { uniqueVolumes } from '../plan/unique-volume.js';

const round = (v: number, d: number) => (Number.isFinite(v) ? Number(v.toFixed(d)) : null);

function timeText(tMs: number, zone: string | undefined): string {
  return zone ? isoInZone(tMs, zone) : isoUtc(tMs, 1);
}

export function renderPlanTable(plan: PlanResult, zone?: string): string {
  const parts: string[] = [];
  const hasLink = plan.contacts.some((c) => c.link !== undefined);
  const hasExpected = plan.contacts.some((c) => c.link?.expectedVolumeBits !== undefined);
  parts.push(
    `Contact plan ${isoUtc(plan.span.startMs, 0)} .. ${isoUtc(plan.span.endMs, 0)}` +
      (hasLink ? `, link at ${plan.availabilityPercent} % availability, sampled every ${plan.linkStepS} s` : ''),
  );
  for (const st of plan.stations) {
    const rows = plan.contacts.filter((c) => c.stationId === st.id);
    parts.push('');
    parts.push(`${st.id}  ${st.name}  (${st.timeZone})`);
    if (rows.length === 0) {
      parts.push('  no contacts in the window');
      continue;
    }
    const cols: Column[] = [
      { header: 'spacecraft' },
      { header: zone ? `AOS (${zone})` : 'AOS (UTC)' },
      { header: 'TCA' },
      { header: 'LOS' },
      { header: 'duration', align: 'right' },
      { header: 'max el deg', align: 'right' },
      { header: 'az AOS', align: 'right' },
      { header: 'az LOS', align: 'right' },
    ];
    if (hasLink) cols.push({ header: 'volume', align: 'right' });
    if (hasExpected) cols.push({ header: 'expected', align: 'right' });
    if (hasLink) cols.push({ header: 'worst margin dB', align: 'right' });
    const body = rows.map((c) => {
      const r = [
        c.spacecraftId,
        timeText(c.aosMs, zone) + (c.aosClipped ? '<' : ''),
        timeText(c.tcaMs, zone),
        timeText(c.losMs, zone) + (c.losClipped ? '>' : ''),
        formatDuration(c.durationS),
        fixed(c.maxElevationDeg, 1),
        fixed(c.aosAzimuthDeg, 0),
        fixed(c.losAzimuthDeg, 0),
      ];
      if (hasLink) r.push(c.link ? formatBits(c.link.volumeBits) : '-');
      if (hasExpected) r.push(c.link?.expectedVolumeBits !== undefined ? formatBits(c.link.expectedVolumeBits) : '-');
      if (hasLink) r.push(c.link ? fixed(c.link.worstMarginDb, 1) : '-');
      return r;
    });
    parts.push(indent(renderTable(cols, body)));
    parts.push(`  ${summaryLine(rows, hasLink, hasExpected)}`);
  }
  const clipped = plan.contacts.some((c) => c.aosClipped || c.losClipped);
  parts.push('');
  parts.push(`All stations (station sum): ${summaryLine(plan.contacts, hasLink, hasExpected)}`);
  const once = uniqueVolumes(
    plan.spacecraft.map((s) => s.id),
    plan.contacts,
  );
  parts.push(
    `Counted once per spacecraft radio (best station at each instant, union of windows): contact time ${formatDuration(once.reduce((s, u) => s + u.contactTimeS, 0))}` +
      (hasLink ? `, volume ${formatBits(once.reduce((s, u) => s + u.volumeBits, 0))}` : '') +
      (hasExpected ? `, expected ${formatBits(once.reduce((s, u) => s + u.expectedVolumeBits, 0))}` : ''),
  );
  if (hasExpected) {
    parts.push(
      `"volume": at ${plan.availabilityPercent} % availability (the atmosphere exceeded ${Number((100 - plan.availabilityPercent).toPrecision(12))} % of an average year); ` +
        '"expected": the mean over an average year\'s attenuation statistics (README, "Expected volume").',
    );
  }
  if (clipped) parts.push('"<" / ">": window cut by the start / end of the span.');
  const outages = plan.sunOutages ?? [];
  parts.push('');
  parts.push(`Sun outages (the Sun's limb within ${SUN_OUTAGE_BEAMWIDTHS} half-power beamwidth of boresight; their noise is in the volumes): ${outages.length === 0 ? 'none' : outages.length}`);
  if (outages.length > 0) {
    const cols: Column[] = [
      { header: 'station' },
      { header: 'spacecraft' },
      { header: zone ? `start (${zone})` : 'start (UTC)' },
      { header: 'end' },
      { header: 'duration', align: 'right' },
      { header: 'closest deg', align: 'right' },
      { header: 'at' },
      { header: 'beam deg', align: 'right' },
      { header: 'Sun noise K', align: 'right' },
    ];
    const body = outages.map((o) => [
      o.stationId,
      o.spacecraftId,
      timeText(o.startMs, zone),
      timeText(o.endMs, zone),
      formatDuration((o.endMs - o.startMs) / 1000),
      fixed(o.minOffsetDeg, 3),
      timeText(o.minAtMs, zone),
      fixed(o.beamwidthDeg, 3),
      fixed(o.peakSunNoiseK, 0),
    ]);
    parts.push(indent(renderTable(cols, body)));
  }
  return parts.join('\n') + '\n';
}

function summaryLine(rows: Contact[], hasLink: boolean, hasExpected: boolean): string {
  const totalS = rows.reduce((s, c) => s + c.durationS, 0);
  let line = `${rows.length} window${rows.length === 1 ? '' : 's'}, contact time ${formatDuration(totalS)}`;
  if (hasLink) line += `, volume ${formatBits(rows.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0))}`;
  if (hasExpected) line += `, expected ${formatBits(rows.reduce((s, c) => s + (c.link?.expectedVolumeBits ?? c.link?.volumeBits ?? 0), 0))}`;
  return line;
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((l) => `  ${l}`)
    .join('\n');
}

/** One contact as a plain record with fixed rounding (JSON and CSV share it). */
export function contactRecord(c: Contact): Record<string, string | number | boolean | null> {
  const rec: Record<string, string | number | boolean | null> = {
    station: c.stationId,
    spacecraft: c.spacecraftId,
    aos_utc: isoUtc(c.aosMs, 3),
    tca_utc: isoUtc(c.tcaMs, 3),
    los_utc: isoUtc(c.losMs, 3),
    duration_s: round(c.durationS, 1),
    max_elevation_deg: round(c.maxElevationDeg, 2),
    aos_azimuth_deg: round(c.aosAzimuthDeg, 2),
    los_azimuth_deg: round(c.losAzimuthDeg, 2),
    aos_clipped: c.aosClipped,
    los_clipped: c.losClipped,
  };
  if (c.lightTimeS !== undefined && Number.isFinite(c.lightTimeS)) {
    rec.light_time_s = round(c.lightTimeS, 6);
    rec.aos_transmit_utc = isoUtc(c.aosTransmitMs ?? Number.NaN, 3);
    rec.los_transmit_utc = isoUtc(c.losTransmitMs ?? Number.NaN, 3);
  }
  if (c.link) {
    rec.radio = c.link.radioId;
    rec.volume_bits = Math.round(c.link.volumeBits);
    if (c.link.expectedVolumeBits !== undefined) rec.expected_volume_bits = c.link.expectedVolumeBits;
    rec.closed_s = round(c.link.closedS, 1);
    rec.worst_margin_db = round(c.link.worstMarginDb, 2);
    rec.worst_margin_utc = isoUtc(c.link.worstMarginAtMs, 3);
    rec.worst_margin_elevation_deg = round(c.link.worstMarginElevationDeg, 2);
    rec.peak_rate_bps = Math.round(c.link.peakRateBps);
  }
  return rec;
}

export function renderPlanJson(plan: PlanResult, extra: Record<string, unknown> = {}): string {
  const doc = {
    span: { from_utc: isoUtc(plan.span.startMs, 3), to_utc: isoUtc(plan.span.endMs, 3) },
    availability_percent: plan.availabilityPercent,
    link_step_s: plan.linkStepS,
    spacecraft: plan.spacecraft,
    stations: plan.stations,
    contacts: plan.contacts.map((c) => ({
      ...contactRecord(c),
      ...(c.link?.expectedVolumeBoundBits !== undefined ? { expected_volume_bound_bits: Math.ceil(c.link.expectedVolumeBoundBits) } : {}),
      ...(c.link ? { time_in_modcod_s: roundRecord(c.link.timeInModcodS, 1) } : {}),
      ...(c.otherLinks
        ? {
            other_radios: c.otherLinks.map((l) => ({
              radio: l.radioId,
              volume_bits: l.volumeBits,
              ...(l.expectedVolumeBits !== undefined ? { expected_volume_bits: l.expectedVolumeBits } : {}),
              worst_margin_db: round(l.worstMarginDb, 2),
              peak_rate_bps: Math.round(l.peakRateBps),
            })),
          }
        : {}),
    })),
    ...(plan.sunOutages ? { sun_outages: plan.sunOutages.map(sunOutageRecord) } : {}),
    ...extra,
    warnings: plan.warnings,
  };
  return JSON.stringify(doc, null, 2) + '\n';
}

function roundRecord(r: Record<string, number>, d: number): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const k of Object.keys(r).sort()) out[k] = round(r[k] ?? 0, d);
  return out;
}

export function renderPlanCsv(plan: PlanResult): string {
  const records = plan.contacts.map(contactRecord);
  const first = records[0];
  if (!first) return 'station,spacecraft,aos_utc,tca_utc,los_utc,duration_s,max_elevation_deg\n';
  const columns: string[] = [];
  for (const r of records) for (const k of Object.keys(r)) if (!columns.includes(k)) columns.push(k);
  return stringify(records, { header: true, columns, cast: { boolean: (v) => (v ? 'true' : 'false') } });
}

/** One Sun outage with fixed rounding (JSON and CSV share it). */
export function sunOutageRecord(o: SunOutage): Record<string, string | number | null> {
  return {
    station: o.stationId,
    spacecraft: o.spacecraftId,
    start_utc: isoUtc(o.startMs, 3),
    end_utc: isoUtc(o.endMs, 3),
    duration_s: round((o.endMs - o.startMs) / 1000, 1),
    closest_offset_deg: round(o.minOffsetDeg, 4),
    closest_utc: isoUtc(o.minAtMs, 3),
    beamwidth_deg: round(o.beamwidthDeg, 4),
    peak_sun_noise_k: round(o.peakSunNoiseK, 1),
  };
}

const SUN_OUTAGE_COLUMNS = ['station', 'spacecraft', 'start_utc', 'end_utc', 'duration_s', 'closest_offset_deg', 'closest_utc', 'beamwidth_deg', 'peak_sun_noise_k'];

export function renderSunOutagesCsv(plan: PlanResult): string {
  return stringify((plan.sunOutages ?? []).map(sunOutageRecord), { header: true, columns: SUN_OUTAGE_COLUMNS });
}
