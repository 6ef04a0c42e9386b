/**
 * Streams trace rows (src/plan/trace.ts) as CSV through csv-stringify's stream API:
 * the row generator is pulled only as fast as the sink takes the text (backpressure
 * all the way: generator -> Readable -> Stringifier -> batching -> sink), so memory
 * stays flat whatever the length of the trace.
 *
 * Columns carry their units. Fixed rounding, so the same inputs give byte-identical
 * files: angles 0.001 deg, range 0.001 km, range rate 0.00001 km/s, Doppler 0.1 Hz,
 * every dB quantity 0.001 dB, rates to the bit/s. Times are ISO 8601 UTC to the
 * millisecond. margin_db is the closure margin (above the most robust entry's threshold
 * plus the required margin, as everywhere else); margin_in_use_db the margin over the
 * entry in use (adaptive coding: about 0 by construction).
 * Empty cells: geometry when the target had no state; link columns below the
 * horizon or without a radio (see src/plan/trace.ts). in_contact is 1 or 0.
 * body_noise_k: the Sun's and the Moon's antenna temperature in the beam (through the
 * atmosphere); sun_offset_deg: the Sun's centre from boresight as seen by the station;
 * sun_earth_probe_deg: the Sun-Earth-probe angle; lunar_site_earth_*: where the station
 * lies in a lunar surface site's sky (lunar sites only).
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { stringify } from 'csv-stringify';
import type { PreparedTrace, TraceRow } from '../plan/trace.js';
import { isoUtc } from '../time/format.js';
import { openStreamedOutput } from './write.js';

export const TRACE_COLUMNS = [
  'time_utc',
  'spacecraft',
  'station',
  'azimuth_deg',
  'elevation_deg',
  'range_km',
  'range_rate_km_s',
  'doppler_hz',
  'in_contact',
  'free_space_loss_db',
  'gas_db',
  'rain_db',
  'cloud_db',
  'scintillation_db',
  'atmosphere_db',
  'pointing_loss_db',
  'polarization_loss_db',
  'eirp_dbw',
  'g_over_t_db_k',
  'c_n0_db_hz',
  'eb_n0_db',
  'es_n0_db',
  'margin_db',
  'modcod',
  'rate_bps',
  'shannon_rate_bps',
  'margin_in_use_db',
  'body_noise_k',
  'sun_offset_deg',
  'sun_earth_probe_deg',
  'lunar_site_earth_elevation_deg',
  'lunar_site_earth_azimuth_deg',
] as const;

const col = (name: (typeof TRACE_COLUMNS)[number]): number => TRACE_COLUMNS.indexOf(name);
const BODY_NOISE_COL = col('body_noise_k');
const SUN_OFFSET_COL = col('sun_offset_deg');
const SEP_COL = col('sun_earth_probe_deg');
const LUNAR_EL_COL = col('lunar_site_earth_elevation_deg');
const LUNAR_AZ_COL = col('lunar_site_earth_azimuth_deg');

/** Default size of the text batches handed to the sink, characters. */
export const TRACE_CHUNK_CHARS = 64 * 1024;

/** Half a unit of the last printed digit, per number of decimals (0..6). */
const HALF_UNIT = [0.5, 0.05, 0.005, 0.0005, 0.00005, 0.000005, 0.0000005];
const ZERO_TEXT = HALF_UNIT.map((_, d) => (0).toFixed(d));

/** toFixed without a "-0.000": values that round to zero print as zero. */
function fx(v: number, decimals: number): string {
  if (v < 0 && v > -HALF_UNIT[decimals]!) return ZERO_TEXT[decimals]!;
  return v.toFixed(decimals);
}

/**
 * Time decimals of the trace CSV: always milliseconds (ISO 8601 with 3 decimals), like
 * every machine-readable time passbudget writes; the arguments are kept for callers.
 */
export function traceTimeDecimals(_startMs: number, _stepMs: number): number {
  return 3;
}

/** One row as CSV fields (a fresh array: the row object itself is reused by the generator). */
export function traceRecord(r: TraceRow, timeDecimals: number, timeText: string = isoUtc(r.tMs, timeDecimals)): string[] {
  const rec = new Array<string>(TRACE_COLUMNS.length).fill('');
  rec[0] = timeText;
  rec[1] = r.spacecraftId;
  rec[2] = r.stationId;
  rec[8] = r.inContact ? '1' : '0';
  if (!r.ok) return rec;
  const l = r.look;
  rec[3] = fx(l.azimuthDeg, 3);
  rec[4] = fx(l.elevationDeg, 3);
  rec[5] = fx(l.rangeKm, 3);
  rec[6] = fx(l.rangeRateKmS, 5);
  if (r.hasRadio) rec[7] = fx(r.dopplerHz, 1);
  rec[SUN_OFFSET_COL] = fx(r.sunOffsetDeg, 3);
  rec[SEP_COL] = fx(r.sunEarthProbeDeg, 3);
  if (r.lunarSite) {
    rec[LUNAR_EL_COL] = fx(r.lunarEarthElevationDeg, 3);
    rec[LUNAR_AZ_COL] = fx(r.lunarEarthAzimuthDeg, 3);
  }
  if (!r.hasLink) return rec;
  rec[BODY_NOISE_COL] = fx(r.link.bodyNoiseTempK, 3);
  const s = r.link;
  rec[9] = fx(s.freeSpaceLossDb, 3);
  rec[10] = fx(s.gasDb, 3);
  rec[11] = fx(s.rainDb, 3);
  rec[12] = fx(s.cloudDb, 3);
  rec[13] = fx(s.scintillationDb, 3);
  rec[14] = fx(s.atmosphereDb, 3);
  rec[15] = fx(s.pointingLossDb, 3);
  rec[16] = fx(s.polarizationLossDb, 3);
  rec[17] = fx(s.eirpDbw, 3);
  rec[18] = fx(s.gOverTDbK, 3);
  rec[19] = fx(s.cN0DbHz, 3);
  rec[20] = fx(s.ebN0Db, 3);
  rec[21] = fx(s.esN0Db, 3);
  rec[22] = fx(s.closureMarginDb, 3);
  rec[23] = r.modcod;
  rec[24] = fx(s.rateBps, 0);
  rec[25] = fx(s.shannonRateBps, 0);
  rec[26] = fx(s.marginDb, 3);
  return rec;
}

export interface TraceWriteStats {
  /** Data rows written (header excluded). */
  rows: number;
  /** Text chunks handed to the sink. */
  chunks: number;
  chars: number;
}

/**
 * Streams `rows` as CSV into `sink`, awaiting each sink call (the sink applies its own
 * backpressure). Text is handed over in batches of about `chunkChars`.
 */
export async function streamTraceCsv(
  rows: Iterable<TraceRow>,
  timeDecimals: number,
  sink: (chunk: string) => Promise<void>,
  chunkChars: number = TRACE_CHUNK_CHARS,
): Promise<TraceWriteStats> {
  const stats: TraceWriteStats = { rows: 0, chunks: 0, chars: 0 };
  function* records(): Generator<string[]> {
    yield [...TRACE_COLUMNS];
    // rows of one time step share its text (one step serves every station)
    let lastMs = Number.NaN;
    let lastText = '';
    for (const r of rows) {
      stats.rows++;
      if (r.tMs !== lastMs) {
        lastMs = r.tMs;
        lastText = isoUtc(r.tMs, timeDecimals);
      }
      yield traceRecord(r, timeDecimals, lastText);
    }
  }
  const flush = async (text: string) => {
    stats.chunks++;
    stats.chars += text.length;
    await sink(text);
  };
  await pipeline(
    Readable.from(records(), { objectMode: true }),
    stringify({ eof: true }),
    async (source: AsyncIterable<string | Buffer>) => {
      let pending = '';
      for await (const part of source) {
        pending += typeof part === 'string' ? part : part.toString('utf8');
        if (pending.length >= chunkChars) {
          const text = pending;
          pending = '';
          await flush(text);
        }
      }
      if (pending.length > 0) await flush(pending);
    },
  );
  return stats;
}

/** Streams the trace to `path` atomically (temp file beside it, renamed when complete). */
export async function writeTraceFile(path: string, trace: PreparedTrace, rows: Iterable<TraceRow>): Promise<TraceWriteStats & { path: string }> {
  const out = openStreamedOutput(path);
  try {
    const stats = await streamTraceCsv(rows, traceTimeDecimals(trace.span.startMs, trace.stepMs), (chunk) => out.write(chunk));
    return { ...stats, path: await out.commit() };
  } catch (err) {
    // a failed write (a full disk) surfaces here as the pipeline's abort: say what failed
    const failure = out.failure();
    out.abort();
    throw failure ?? err;
  }
}
