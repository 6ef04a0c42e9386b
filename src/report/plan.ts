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
import { workerUniqueVolumes } from '../plan/worker-parts.js';
import { jsonPieces, rawLinesPieces, RawList } from './json-stream.js';
import { CONTACT_JSON_PAD, contactTexts, csvLayout, type CsvLayout } from './contact-text.js';
import { contactTextsOf, FORM, storedText, type ContactTextStore, type Form } from './contact-store.js';
import { contactRecord } from './contact-columns.js';

export { CONTACT_COLUMNS, contactRecord, type Cell, type ContactColumn } from './contact-columns.js';

const round = (v: number, d: number) => (Number.isFinite(v) ? Number(v.toFixed(d)) : null);

function timeText(tMs: number, zone: string | undefined): string {
  return zone ? isoInZone(tMs, zone) : isoUtc(tMs, 1);
}

/** The time alone when it falls on the same date as `refMs` (as printed), else the full time. */
function sameDayText(tMs: number, refMs: number, zone: string | undefined): string {
  const t = timeText(tMs, zone);
  const ref = timeText(refMs, zone);
  return t.slice(0, 10) === ref.slice(0, 10) ? t.slice(11) : t;
}

/** The MODCOD (or code) with the most time in a contact, "-" when none closes. */
function mostTimeIn(timeInModcodS: Record<string, number>): string {
  let best = '-';
  let bestS = 0;
  for (const [name, t] of Object.entries(timeInModcodS)) {
    if (t > bestS || (t === bestS && t > 0 && name < best)) {
      best = name;
      bestS = t;
    }
  }
  return best;
}

/** The terminal table in pieces, one station's table at a time (each piece ends its line). */
export function* planTablePieces(plan: PlanResult, zone?: string): Generator<string> {
  const hasLink = plan.contacts.some((c) => c.link !== undefined);
  const hasExpected = plan.contacts.some((c) => c.link?.expectedVolumeBits !== undefined);
  yield* lines(
    `Contact plan ${isoUtc(plan.span.startMs, 0)} .. ${isoUtc(plan.span.endMs, 0)}` +
      (hasLink ? `, link at ${plan.availabilityPercent} % availability, sampled every ${plan.linkStepS} s` : ''),
  );
  for (const st of plan.stations) {
    const rows = plan.contacts.filter((c) => c.stationId === st.id);
    yield* lines('');
    yield* lines(`${st.id}  ${st.name}  (${st.timeZone})`);
    if (rows.length === 0) {
      yield* lines('  no contacts in the window');
      continue;
    }
    // what the link gives first, then the geometry (TCA and azimuths: contacts.csv, plan.json)
    const cols: Column[] = [{ header: 'spacecraft' }];
    if (hasLink) {
      cols.push(
        { header: zone ? `data start (${zone})` : 'data start (UTC)' },
        { header: 'data end' },
        { header: 'volume', align: 'right' },
        ...(hasExpected ? [{ header: 'expected', align: 'right' } as const] : []),
        { header: 'closure margin dB', align: 'right' },
        { header: 'most time in' },
      );
    }
    cols.push({ header: hasLink ? 'AOS' : zone ? `AOS (${zone})` : 'AOS (UTC)' }, { header: 'LOS' }, { header: 'duration', align: 'right' }, { header: 'max el deg', align: 'right' });
    const body = rows.map((c) => {
      const l = c.link;
      const ref = l ? l.dataStartMs : c.aosMs;
      const r = [c.spacecraftId];
      if (hasLink) {
        r.push(
          l ? timeText(l.dataStartMs, zone) : '-',
          l ? sameDayText(l.dataEndMs, ref, zone) : '-',
          l ? formatBits(l.volumeBits) : '-',
          ...(hasExpected ? [l?.expectedVolumeBits !== undefined ? formatBits(l.expectedVolumeBits) : '-'] : []),
          l ? fixed(l.worstMarginDb, 1) : '-',
          l ? mostTimeIn(l.timeInModcodS) : '-',
        );
      }
      r.push(
        (hasLink && l ? sameDayText(c.aosMs, ref, zone) : timeText(c.aosMs, zone)) + (c.aosClipped ? '<' : ''),
        (hasLink && l ? sameDayText(c.losMs, ref, zone) : sameDayText(c.losMs, c.aosMs, zone)) + (c.losClipped ? '>' : ''),
        formatDuration(c.durationS),
        fixed(c.maxElevationDeg, 1),
      );
      return r;
    });
    yield* lines(indent(renderTable(cols, body)));
    yield* lines(`  ${summaryLine(rows, hasLink, hasExpected)}`);
  }
  const clipped = plan.contacts.some((c) => c.aosClipped || c.losClipped);
  yield* lines('');
  yield* lines(`All stations (station sum): ${summaryLine(plan.contacts, hasLink, hasExpected)}`);
  const ids = plan.spacecraft.map((s) => s.id);
  const once = workerUniqueVolumes(plan, ids) ?? uniqueVolumes(ids, plan.contacts);
  yield* lines(
    `Counted once per spacecraft radio (best station at each instant, union of windows): contact time ${formatDuration(once.reduce((s, u) => s + u.contactTimeS, 0))}` +
      (hasLink ? `, volume ${formatBits(once.reduce((s, u) => s + u.volumeBits, 0))}` : '') +
      (hasExpected ? `, expected ${formatBits(once.reduce((s, u) => s + u.expectedVolumeBits, 0))}` : ''),
  );
  if (hasExpected) {
    yield* lines(
      `"volume": at ${plan.availabilityPercent} % availability (the atmosphere exceeded ${Number((100 - plan.availabilityPercent).toPrecision(12))} % of an average year); ` +
        '"expected": the mean over an average year\'s attenuation statistics (README, "Expected volume").',
    );
  }
  if (clipped) yield* lines('"<" / ">": window cut by the start / end of the span.');
  const outages = plan.sunOutages ?? [];
  yield* lines('');
  yield* lines(`Sun outages (the Sun's limb within ${SUN_OUTAGE_BEAMWIDTHS} half-power beamwidth of boresight; their noise is in the volumes): ${outages.length === 0 ? 'none' : outages.length}`);
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
    yield* lines(indent(renderTable(cols, body)));
  }
}

const lines = (...text: string[]): string[] => text.map((l) => `${l}\n`);

function summaryLine(rows: Contact[], hasLink: boolean, hasExpected: boolean): string {
  const totalS = rows.reduce((s, c) => s + c.durationS, 0);
  let line = `${rows.length} window${rows.length === 1 ? '' : 's'}, contact time ${formatDuration(totalS)}`;
  const linked = hasLink && rows.some((c) => c.link !== undefined);
  if (linked) line += `, volume ${formatBits(rows.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0))}`;
  if (linked && hasExpected) line += `, expected ${formatBits(rows.reduce((s, c) => s + (c.link?.expectedVolumeBits ?? c.link?.volumeBits ?? 0), 0))}`;
  return line;
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((l) => `  ${l}`)
    .join('\n');
}

/** One contact as plan.json and contacts.jsonl hold it: its record, time per MODCOD and other radios. */
export function contactJson(c: Contact): Record<string, unknown> {
  return {
    ...contactRecord(c, true),
    // in JSON, the time per MODCOD as an object, in its column's place
    ...(c.link ? { time_in_modcod_s: roundRecord(c.link.timeInModcodS, 1) } : {}),
    ...(c.otherLinks
      ? {
          other_radios: c.otherLinks.map((l) => ({
            radio: l.radioId,
            volume_bits: l.volumeBits,
            ...(l.expectedVolumeBits !== undefined ? { expected_volume_bits: l.expectedVolumeBits } : {}),
            closure_margin_db: round(l.worstMarginDb, 2),
            peak_rate_bps: Math.round(l.peakRateBps),
          })),
        }
      : {}),
  };
}

function roundRecord(r: Record<string, number>, d: number): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const k of Object.keys(r).sort()) out[k] = round(r[k] ?? 0, d);
  return out;
}

/** Contact i's text in one form: the worker's bytes when the plan carries them (report/batch-text.ts), else made here. */
function textOf(plan: PlanResult, store: ContactTextStore | undefined, form: Form, i: number, layout?: CsvLayout): string | Uint8Array {
  const stored = store ? storedText(store, form, i) : undefined;
  if (stored) return stored;
  const t = contactTexts(plan.contacts[i]!, layout);
  return form === FORM.csv ? t.csv : form === FORM.json ? t.json : t.line;
}

/** plan.json in pieces (report/json-stream.ts): the same bytes as one JSON.stringify of it. */
export function planJsonPieces(plan: PlanResult, extra: Record<string, unknown> = {}): Iterable<string | Uint8Array> {
  const store = contactTextsOf(plan);
  const doc = {
    span: { from_utc: isoUtc(plan.span.startMs, 3), to_utc: isoUtc(plan.span.endMs, 3) },
    availability_percent: plan.availabilityPercent,
    link_step_s: plan.linkStepS,
    spacecraft: plan.spacecraft,
    stations: plan.stations.map((st) => ({ id: st.id, name: st.name, time_zone: st.timeZone })),
    contacts: new RawList(plan.contacts.length, (i) => textOf(plan, store, FORM.json, i), CONTACT_JSON_PAD),
    ...(plan.sunOutages ? { sun_outages: plan.sunOutages.map(sunOutageRecord) } : {}),
    ...extra,
    warnings: plan.warnings,
  };
  return jsonPieces(doc);
}

/** contacts.jsonl: one contact per line, the same record as in plan.json. */
export function contactsJsonLinesPieces(plan: PlanResult): Iterable<string | Uint8Array> {
  const store = contactTextsOf(plan);
  return rawLinesPieces(new RawList(plan.contacts.length, (i) => textOf(plan, store, FORM.line, i), ''));
}

/** contacts.csv in pieces, row by row: the columns of CONTACT_COLUMNS some contact has, in its order. */
export function* planCsvPieces(plan: PlanResult): Generator<string | Uint8Array> {
  const layout = csvLayout(plan.contacts);
  const store = contactTextsOf(plan);
  // a worker's rows are used where its batch had the same columns as the whole plan
  const sameLayout = store?.batches.map((b) => b?.csvHeader === layout.header);
  yield layout.header;
  for (let i = 0; i < plan.contacts.length; i++) {
    const ok = store !== undefined && sameLayout![store.source[2 * i]!] === true;
    yield ok ? textOf(plan, store, FORM.csv, i, layout) : contactTexts(plan.contacts[i]!, layout).csv;
  }
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
