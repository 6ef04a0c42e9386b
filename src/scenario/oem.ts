/**
 * CCSDS Orbit Ephemeris Message reader, KVN and XML (CCSDS 502.0-B-3, "Orbit Data
 * Messages", sec. 5 (OEM), sec. 7 (KVN syntax) and the NDM/XML schema).
 *
 * Read: the header (CCSDS_OEM_VERS), then one or more segments of metadata
 * (META_START..META_STOP) and data lines "epoch x y z vx vy vz [ax ay az]" (km, km/s,
 * km/s^2; accelerations accepted and not used), COMMENT lines anywhere, covariance
 * blocks (COVARIANCE_START..COVARIANCE_STOP, XML <covarianceMatrix>) skipped.
 * Epochs: calendar "YYYY-MM-DDThh:mm:ss[.s]" or day-of-year "YYYY-DDDThh:mm:ss[.s]",
 * optional trailing "Z".
 * Accepted: REF_FRAME EME2000 (alias J2000), ICRF, GCRF (treated as one frame: their
 * differences, the ~20 mas frame bias, are far below the use); CENTER_NAME EARTH, MOON,
 * SUN, EARTH-MOON BARYCENTER (converted to geocentric by geometry/targets/ephemeris.ts);
 * TIME_SYSTEM UTC, TAI, TT, GPS, TDB (TDB taken as TT: |TDB - TT| < 2 ms); INTERPOLATION
 * LAGRANGE or HERMITE with INTERPOLATION_DEGREE 1..15 (default: Lagrange, degree 7).
 * Anything else (a TOD frame, MRT time, a Mars centre) is refused with one problem naming
 * the file, the segment and the keyword. USEABLE_START_TIME / USEABLE_STOP_TIME bound
 * where the segment is used (default START_TIME / STOP_TIME).
 * Units: epoch ms (UTC), km, km/s.
 */
import { xmlLib } from '../lazy.js';
import type { Problem } from '../errors.js';
import type { Ephemeris, EphemerisSegment } from './types.js';

export const OEM_CENTRES = ['EARTH', 'MOON', 'SUN', 'EARTH-MOON BARYCENTER'] as const;
export const OEM_FRAMES = ['EME2000', 'J2000', 'ICRF', 'GCRF'] as const;
export const OEM_TIME_SYSTEMS = ['UTC', 'TAI', 'TT', 'GPS', 'TDB'] as const;
export const OEM_MAX_DEGREE = 15;
const DEFAULT_DEGREE = 7;

/** TAI - UTC, s, from the IERS leap-second announcements (Bulletin C), 2009 onwards. */
const TAI_MINUS_UTC: readonly [number, number][] = [
  [Date.UTC(2009, 0, 1), 34],
  [Date.UTC(2012, 6, 1), 35],
  [Date.UTC(2015, 6, 1), 36],
  [Date.UTC(2017, 0, 1), 37],
];
/** TT - TAI, s (exact by definition, IAU 1991). */
const TT_MINUS_TAI_S = 32.184;
/** TAI - GPS time, s (GPS time was UTC at 1980-01-06, common practice). */
const TAI_MINUS_GPS_S = 19;

/** One raw segment as read, before its keywords are checked. */
interface RawSegment {
  meta: Map<string, string>;
  /** Line of META_START (KVN) or the segment's index (XML), for messages. */
  where: string;
  rows: { epoch: string; values: number[]; where: string }[];
}

/** An OEM's text read into segments; problems name `file` and where. */
export function parseOem(text: string, file: string): { ephemeris?: Ephemeris; problems: Problem[] } {
  const problems: Problem[] = [];
  const report = (path: string, message: string) => problems.push({ file, path, message });
  const raw = text.trimStart().startsWith('<') ? readXml(text, report) : readKvn(text, report);
  if (problems.length > 0) return { problems };
  if (raw.length === 0) {
    report('', 'holds no segment; valid: META_START..META_STOP followed by state lines (CCSDS 502.0-B-3 sec. 5)');
    return { problems };
  }
  const segments: EphemerisSegment[] = [];
  raw.forEach((seg, i) => {
    const s = checkSegment(seg, `segment ${i + 1}`, report);
    if (s) segments.push(s);
  });
  if (problems.length > 0) return { problems };
  segments.sort((a, b) => a.useableStartMs - b.useableStartMs);
  return { ephemeris: { origin: file, objectName: segments[0]!.objectName, segments }, problems };
}

/** Reads a CCSDS epoch (calendar or day-of-year form) as UTC-scale-free ms, or undefined. */
export function parseOemEpochMs(text: string): number | undefined {
  const m = /^(\d{4})-(?:(\d{2})-(\d{2})|(\d{3}))T(\d{2}):(\d{2}):(\d{2}(?:\.\d*)?)Z?$/.exec(text.trim());
  if (!m) return undefined;
  const year = Number(m[1]);
  const h = Number(m[5]);
  const min = Number(m[6]);
  const sec = Number(m[7]);
  if (h > 23 || min > 59 || sec >= 61) return undefined;
  let dayMs: number;
  if (m[4] !== undefined) {
    const doy = Number(m[4]);
    const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
    if (doy < 1 || doy > (leap ? 366 : 365)) return undefined;
    dayMs = Date.UTC(year, 0, 1) + (doy - 1) * 86_400_000;
  } else {
    const month = Number(m[2]);
    const day = Number(m[3]);
    dayMs = Date.UTC(year, month - 1, day);
    const d = new Date(dayMs);
    if (d.getUTCMonth() !== month - 1 || d.getUTCDate() !== day) return undefined;
  }
  return dayMs + ((h * 60 + min) * 60 + sec) * 1000;
}

/** Offset to add to a time in `system` to get UTC, s; undefined before 2009 for atomic scales. */
function toUtcOffsetS(system: string, tMs: number): number | undefined {
  if (system === 'UTC') return 0;
  let taiUtc: number | undefined;
  for (const [from, s] of TAI_MINUS_UTC) if (tMs >= from) taiUtc = s;
  if (taiUtc === undefined) return undefined;
  switch (system) {
    case 'TAI':
      return -taiUtc;
    case 'GPS':
      return TAI_MINUS_GPS_S - taiUtc;
    default: // TT, TDB
      return -TT_MINUS_TAI_S - taiUtc;
  }
}

function checkSegment(seg: RawSegment, label: string, report: (path: string, message: string) => void): EphemerisSegment | undefined {
  const at = (key: string) => `${label} (${seg.where}): ${key}`;
  const get = (key: string) => seg.meta.get(key)?.trim();
  const need = (key: string): string | undefined => {
    const v = get(key);
    if (v === undefined || v === '') report(at(key), 'is missing; CCSDS 502.0-B-3 Table 5-3 requires it');
    return v;
  };
  const centre = need('CENTER_NAME')?.toUpperCase();
  if (centre !== undefined && !(OEM_CENTRES as readonly string[]).includes(centre)) {
    report(at('CENTER_NAME'), `"${centre}" is not supported; valid: ${OEM_CENTRES.join(', ')}`);
    return undefined;
  }
  const frame = need('REF_FRAME')?.toUpperCase();
  if (frame !== undefined && !(OEM_FRAMES as readonly string[]).includes(frame)) {
    report(at('REF_FRAME'), `"${frame}" is not supported; valid: EME2000 (or J2000), ICRF, GCRF`);
    return undefined;
  }
  const system = need('TIME_SYSTEM')?.toUpperCase();
  if (system !== undefined && !(OEM_TIME_SYSTEMS as readonly string[]).includes(system)) {
    report(at('TIME_SYSTEM'), `"${system}" is not supported; valid: ${OEM_TIME_SYSTEMS.join(', ')}`);
    return undefined;
  }
  const interpolation = (get('INTERPOLATION') ?? 'LAGRANGE').toUpperCase();
  if (interpolation !== 'LAGRANGE' && interpolation !== 'HERMITE') {
    report(at('INTERPOLATION'), `"${interpolation}" is not supported; valid: LAGRANGE, HERMITE`);
    return undefined;
  }
  const degreeText = get('INTERPOLATION_DEGREE');
  const degree = degreeText === undefined ? DEFAULT_DEGREE : Number(degreeText);
  if (!Number.isInteger(degree) || degree < 1 || degree > OEM_MAX_DEGREE) {
    report(at('INTERPOLATION_DEGREE'), `"${degreeText}" is not a whole number 1..${OEM_MAX_DEGREE}`);
    return undefined;
  }
  if (centre === undefined || frame === undefined || system === undefined) return undefined;
  const time = (key: string, text: string | undefined): number | undefined => {
    if (text === undefined) return undefined;
    const raw = parseOemEpochMs(text);
    if (raw === undefined) {
      report(at(key), `"${text}" is not a CCSDS epoch; valid: YYYY-MM-DDThh:mm:ss[.d] or YYYY-DDDThh:mm:ss[.d]`);
      return undefined;
    }
    const off = toUtcOffsetS(system, raw);
    if (off === undefined) {
      report(at(key), `"${text}" ${system} is before 2009; valid: UTC, or ${system} from 2009 (leap-second table)`);
      return undefined;
    }
    return raw + off * 1000;
  };
  const startMs = time('START_TIME', need('START_TIME'));
  const stopMs = time('STOP_TIME', need('STOP_TIME'));
  if (startMs === undefined || stopMs === undefined) return undefined;
  const useableStartMs = time('USEABLE_START_TIME', get('USEABLE_START_TIME')) ?? startMs;
  const useableStopMs = time('USEABLE_STOP_TIME', get('USEABLE_STOP_TIME')) ?? stopMs;
  const n = seg.rows.length;
  const minNodes = interpolation === 'HERMITE' ? Math.ceil((degree + 1) / 2) : degree + 1;
  if (n < Math.max(2, minNodes)) {
    report(at('data'), `has ${n} state line${n === 1 ? '' : 's'}; ${interpolation} of degree ${degree} needs at least ${Math.max(2, minNodes)}`);
    return undefined;
  }
  const tMs = new Float64Array(n);
  const states = new Float64Array(6 * n);
  for (let k = 0; k < n; k++) {
    const row = seg.rows[k]!;
    const t = time(`state at ${row.where}`, row.epoch);
    if (t === undefined) return undefined;
    if (k > 0 && !(t > tMs[k - 1]!)) {
      report(`${label} (${row.where})`, `epoch ${row.epoch} is not after the line before it; valid: epochs strictly increasing`);
      return undefined;
    }
    tMs[k] = t;
    for (let j = 0; j < 6; j++) states[6 * k + j] = row.values[j]!;
  }
  if (!(useableStartMs < useableStopMs) || useableStartMs < tMs[0]! - 1 || useableStopMs > tMs[n - 1]! + 1) {
    report(at('USEABLE_START_TIME'), 'the usable span must be non-empty and lie within the segment\'s first and last state');
    return undefined;
  }
  return {
    objectName: get('OBJECT_NAME') ?? '',
    centre: centre as EphemerisSegment['centre'],
    interpolation,
    degree,
    useableStartMs,
    useableStopMs,
    tMs,
    states,
  };
}

function readKvn(text: string, report: (path: string, message: string) => void): RawSegment[] {
  const lines = text.split(/\r?\n/);
  const segments: RawSegment[] = [];
  let cur: RawSegment | undefined;
  let mode: 'header' | 'meta' | 'data' | 'cov' = 'header';
  let sawVersion = false;
  for (let i = 0; i < lines.length; i++) {
    const where = `line ${i + 1}`;
    const line = lines[i]!.trim();
    if (line === '' || line.startsWith('COMMENT')) continue;
    if (line === 'META_START') {
      cur = { meta: new Map(), where, rows: [] };
      segments.push(cur);
      mode = 'meta';
      continue;
    }
    if (line === 'META_STOP') {
      if (mode !== 'meta') return fail(report, where, 'META_STOP without META_START');
      mode = 'data';
      continue;
    }
    if (line === 'COVARIANCE_START') {
      mode = 'cov';
      continue;
    }
    if (line === 'COVARIANCE_STOP') {
      mode = 'data';
      continue;
    }
    if (mode === 'cov') continue;
    const kv = /^([A-Z0-9_]+)\s*=\s*(.*)$/.exec(line);
    if (mode === 'header') {
      if (!kv) return fail(report, where, `"${line.slice(0, 40)}" is not a header line; valid: KEY = value, then META_START`);
      if (kv[1] === 'CCSDS_OEM_VERS') sawVersion = true;
      continue;
    }
    if (mode === 'meta') {
      if (!kv) return fail(report, where, `"${line.slice(0, 40)}" is not a metadata line; valid: KEY = value`);
      cur!.meta.set(kv[1]!, kv[2]!);
      continue;
    }
    // data
    const parts = line.split(/\s+/);
    const values = parts.slice(1).map(Number);
    if ((values.length !== 6 && values.length !== 9) || !values.every(Number.isFinite)) {
      return fail(report, where, `"${line.slice(0, 60)}" is not a state line; valid: epoch x y z x_dot y_dot z_dot [x_ddot y_ddot z_ddot] (km, km/s, km/s^2)`);
    }
    cur!.rows.push({ epoch: parts[0]!, values, where });
  }
  if (!sawVersion) return fail(report, 'line 1', 'CCSDS_OEM_VERS is missing; valid: an OEM in KVN starting with CCSDS_OEM_VERS = 2.0 or 3.0');
  return segments;
}

function fail(report: (path: string, message: string) => void, where: string, message: string): RawSegment[] {
  report(where, message);
  return [];
}

type XmlNode = Record<string, unknown>;
const isObject = (v: unknown): v is XmlNode => v !== null && typeof v === 'object' && !Array.isArray(v);
const asList = (v: unknown): unknown[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);

function readXml(text: string, report: (path: string, message: string) => void): RawSegment[] {
  if (/<!(DOCTYPE|ENTITY)/i.test(text)) return fail(report, '', 'a <!DOCTYPE or <!ENTITY declaration; valid: an NDM/XML OEM without them');
  const valid = xmlLib().XMLValidator.validate(text);
  if (valid !== true) return fail(report, `line ${valid.err.line}`, `not well-formed XML: ${valid.err.msg}`);
  const parser = new (xmlLib().XMLParser)({
    ignoreAttributes: true,
    removeNSPrefix: true,
    parseTagValue: false,
    trimValues: true,
    isArray: (name) => name === 'segment' || name === 'stateVector',
  });
  const doc = parser.parse(text) as XmlNode;
  const oem = isObject(doc['ndm']) ? doc['ndm']['oem'] : doc['oem'];
  const body = isObject(oem) ? oem['body'] : undefined;
  const segs = isObject(body) ? asList(body['segment']) : [];
  if (segs.length === 0) return fail(report, '', 'no <oem><body><segment> found; valid: an NDM/XML OEM');
  return segs.map((seg, i) => {
    const where = `<segment> ${i + 1}`;
    const meta = new Map<string, string>();
    const md = isObject(seg) ? seg['metadata'] : undefined;
    if (isObject(md)) for (const [k, v] of Object.entries(md)) if (typeof v === 'string') meta.set(k, v);
    const data = isObject(seg) ? seg['data'] : undefined;
    const rows: RawSegment['rows'] = [];
    asList(isObject(data) ? data['stateVector'] : undefined).forEach((sv, j) => {
      const g = (k: string) => (isObject(sv) && typeof sv[k] === 'string' ? Number(sv[k]) : Number.NaN);
      const values = [g('X'), g('Y'), g('Z'), g('X_DOT'), g('Y_DOT'), g('Z_DOT')];
      const epoch = isObject(sv) && typeof sv['EPOCH'] === 'string' ? sv['EPOCH'] : '';
      if (!values.every(Number.isFinite)) {
        report(`${where} <stateVector> ${j + 1}`, 'needs EPOCH, X, Y, Z, X_DOT, Y_DOT, Z_DOT as numbers (km, km/s)');
      }
      rows.push({ epoch, values, where: `${where} <stateVector> ${j + 1}` });
    });
    return { meta, where, rows };
  });
}
