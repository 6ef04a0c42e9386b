/**
 * CCSDS Orbit Mean-elements Messages (OMM) for SGP4: reading and validation.
 *
 * Source: CCSDS 502.0-B-2 "Orbit Data Messages" (Blue Book, 2009): the OMM
 * chapter (metadata, mean Keplerian elements, TLE-related parameters, units) and
 * the KVN syntax chapter ("KEYWORD = value [unit]", COMMENT lines); chapter
 * numbers and the 301.0-B issue below are from memory. The XML form
 * follows the NDM/XML schema layout ndm > omm > header/body > segment >
 * metadata/data > meanElements/tleParameters. The JSON form is the flat-keyword
 * layout common in practice (one object or an array of objects, keys named as
 * in the KVN). Epochs: CCSDS 301.0-B-4 (Time Code Formats) ASCII time code A
 * "YYYY-MM-DDThh:mm:ss[.d...][Z]" and B "YYYY-DDDThh:mm:ss[.d...][Z]", UTC.
 *
 * Accepted: MEAN_ELEMENT_THEORY "SGP4" or "SGP/SGP4" (both occur in practice for
 * the same data), REF_FRAME TEME, TIME_SYSTEM UTC, CENTER_NAME EARTH, when
 * present. Required here: the keywords SGP4 needs (see REQUIRED below) and the
 * object's name and designator; EPHEMERIS_TYPE, CLASSIFICATION_TYPE,
 * ELEMENT_SET_NO and REV_AT_EPOCH default to 0, "U", 0 and 0. Ranges: 0 <= e < 1,
 * mean motion > 0 rev/day, inclination 0..180 deg, other angles 0..360 deg.
 * Units, when given in brackets (KVN) or a units attribute (XML), must be the
 * CCSDS ones (rev/day, deg, 1/ER, rev/day**2, rev/day**3).
 */
import { xmlLib } from '../lazy.js';
import type { Problem } from '../errors.js';
import type { ElementSet, OmmElements } from './types.js';
import {
  ANGLE_360_RANGE,
  CLASSIFICATIONS,
  ECCENTRICITY_RANGE,
  INCLINATION_RANGE,
  MEAN_MOTION_RANGE,
  type RangeRule,
  dayOfYearStartMs,
  daysInMonth,
  daysInYear,
  ephemerisTypeProblem,
  inRange,
  isoFromDayMicros,
  parseCount,
  parseDecimal,
  quote,
  firstLineQuoter,
  EPOCH_YEAR_MIN,
  EPOCH_YEAR_MAX,
} from './elements-common.js';

export type OmmFormat = 'kvn' | 'xml' | 'json';

/** One keyword's value as found, with where it was (for messages). */
interface Entry {
  value: string;
  unit?: string;
  where: string;
}

type Message = Map<string, Entry>;

type Report = (message: string) => void;

/** Keywords SGP4 needs, with what each is (for "missing" messages). */
const REQUIRED: readonly (readonly [string, string])[] = [
  ['OBJECT_NAME', 'spacecraft name'],
  ['EPOCH', 'epoch, UTC, YYYY-MM-DDThh:mm:ss[.f] or YYYY-DDDThh:mm:ss[.f]'],
  ['MEAN_MOTION', 'mean motion, rev/day, > 0'],
  ['ECCENTRICITY', 'eccentricity, 0 <= e < 1'],
  ['INCLINATION', 'inclination, deg, 0..180'],
  ['RA_OF_ASC_NODE', 'right ascension of the ascending node, deg, 0..360'],
  ['ARG_OF_PERICENTER', 'argument of pericentre, deg, 0..360'],
  ['MEAN_ANOMALY', 'mean anomaly, deg, 0..360'],
  ['NORAD_CAT_ID', 'catalogue number, a non-negative integer'],
  ['BSTAR', 'SGP4 drag term, 1/ER'],
  ['MEAN_MOTION_DOT', 'first derivative of mean motion, rev/day**2'],
  ['MEAN_MOTION_DDOT', 'second derivative of mean motion, rev/day**3'],
];

/** Units CCSDS 502.0-B-2 gives each numeric keyword (compared lower-case, blanks removed). */
const UNITS: Readonly<Record<string, readonly string[]>> = {
  MEAN_MOTION: ['rev/day'],
  INCLINATION: ['deg'],
  RA_OF_ASC_NODE: ['deg'],
  ARG_OF_PERICENTER: ['deg'],
  MEAN_ANOMALY: ['deg'],
  BSTAR: ['1/er'],
  MEAN_MOTION_DOT: ['rev/day**2', 'rev/day^2'],
  MEAN_MOTION_DDOT: ['rev/day**3', 'rev/day^3'],
};

/** Keywords whose KVN value may carry a trailing "[unit]". */
const NUMERIC_KEYS = new Set([
  ...Object.keys(UNITS),
  'ECCENTRICITY', 'SEMI_MAJOR_AXIS', 'GM', 'MASS', 'SOLAR_RAD_AREA', 'SOLAR_RAD_COEFF',
  'DRAG_AREA', 'DRAG_COEFF', 'BTERM', 'AGOM',
]);

const THEORIES = ['SGP4', 'SGP/SGP4'];

// ---------------------------------------------------------------- epochs

export type EpochResult =
  | { ok: true; epochMs: number; epochIso: string }
  | { ok: false; valid: string };

const EPOCH_VALID =
  'UTC as YYYY-MM-DDThh:mm:ss[.f] or YYYY-DDDThh:mm:ss[.f] (CCSDS 301.0-B ASCII time code A or B), optionally ending in Z';

/**
 * Parse a CCSDS ASCII time code A or B epoch (UTC). A trailing 'Z' is accepted;
 * any explicit offset (+hh:mm, -hh:mm, even +00:00) is refused. epochMs keeps the
 * sub-millisecond fraction as a float; epochIso is "YYYY-MM-DDTHH:MM:SS.ffffff",
 * rounded to the microsecond.
 */
export function parseCcsdsEpoch(text: string): EpochResult {
  const t = text.trim();
  const m =
    /^(\d{4})-(?:(\d{2})-(\d{2})|(\d{3}))T(\d{2}):(\d{2}):(\d{2})(?:\.(\d+))?(Z|[+-]\d{2}(?::?\d{2})?)?$/.exec(t);
  if (!m) return { ok: false, valid: EPOCH_VALID };
  const [, yS, moS, dS, doyS, hS, miS, sS, fS, zone] = m;
  if (zone !== undefined && zone !== 'Z') {
    return {
      ok: false,
      valid: `an epoch in UTC without an explicit offset (found ${quote(zone)}): ${EPOCH_VALID}`,
    };
  }
  const year = Number(yS);
  if (year < EPOCH_YEAR_MIN || year > EPOCH_YEAR_MAX) return { ok: false, valid: `a year from ${EPOCH_YEAR_MIN} to ${EPOCH_YEAR_MAX}` };
  let dayOfYear: number;
  if (doyS !== undefined) {
    dayOfYear = Number(doyS);
    if (dayOfYear < 1 || dayOfYear > daysInYear(year)) {
      return { ok: false, valid: `day of year 001..${daysInYear(year)} for ${year}` };
    }
  } else {
    const month = Number(moS);
    const day = Number(dS);
    if (month < 1 || month > 12) return { ok: false, valid: 'month 01..12' };
    const dim = daysInMonth(year, month);
    if (day < 1 || day > dim) return { ok: false, valid: `day 01..${dim} for ${yS}-${moS}` };
    // Day of year (1 January = 1): count in a common year, then add the leap day after February.
    dayOfYear = Math.round((Date.UTC(2001, month - 1, day) - Date.UTC(2001, 0, 1)) / 86_400_000) + 1;
    if (month > 2 && daysInYear(year) === 366) dayOfYear += 1;
  }
  const hh = Number(hS);
  const mi = Number(miS);
  const ss = Number(sS);
  if (hh > 23 || mi > 59) return { ok: false, valid: 'hours 00..23 and minutes 00..59' };
  if (ss > 59) return { ok: false, valid: 'seconds 00..59 (a leap second 60 cannot be placed on the UTC millisecond axis)' };
  const frac = fS ?? '';
  const dayStartMs = dayOfYearStartMs(year, dayOfYear);
  const wholeSeconds = hh * 3600 + mi * 60 + ss;
  const epochMs = dayStartMs + wholeSeconds * 1000 + (frac ? Number(`0.${frac}`) * 1000 : 0);
  const micro6 = Number((frac + '000000').slice(0, 6));
  const roundUp = frac.length > 6 && Number(frac[6]) >= 5 ? 1 : 0;
  const epochIso = isoFromDayMicros(dayStartMs, wholeSeconds * 1_000_000 + micro6 + roundUp);
  return { ok: true, epochMs, epochIso };
}

// ---------------------------------------------------------------- readers

function detectFormat(text: string): OmmFormat {
  const first = text.replace(/^\uFEFF/, '').trimStart()[0];
  if (first === '<') return 'xml';
  if (first === '{' || first === '[') return 'json';
  return 'kvn';
}

function readKvn(text: string, report: Report): Message[] {
  const messages: Message[] = [];
  let cur: Message | undefined;
  const quoteOnce = firstLineQuoter();
  text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).forEach((raw, i) => {
    const lineNo = i + 1;
    const t = raw.trim();
    if (t === '' || /^COMMENT(\s|$)/.test(t)) return;
    if (/^[A-Z_]+_(START|STOP)$/.test(t)) return; // META_START, DATA_START, COVARIANCE_STOP ...
    const m = /^([A-Za-z][A-Za-z0-9_]*)\s*=\s*(.*)$/.exec(t);
    if (!m) {
      const shown = quoteOnce(t);
      report(`line ${lineNo}: ${shown ? `${shown} ` : ''}is not a KVN line; valid: KEYWORD = value [unit], a COMMENT line or a blank line`);
      return;
    }
    const key = (m[1] ?? '').toUpperCase();
    let value = m[2] ?? '';
    let unit: string | undefined;
    if (NUMERIC_KEYS.has(key)) {
      const u = /^(.*?)\s*\[([^\]]*)\]$/.exec(value);
      if (u) {
        value = u[1] ?? '';
        unit = u[2] ?? '';
      }
    }
    if (key === 'CCSDS_OMM_VERS' || !cur) {
      if (!cur || cur.size > 0) {
        cur = new Map();
        messages.push(cur);
      }
    }
    const prev = cur.get(key);
    if (prev) {
      report(`line ${lineNo}: ${key} is given again (first at ${prev.where}); valid: each keyword once per message (start a new message with CCSDS_OMM_VERS)`);
      return;
    }
    const entry: Entry = { value, where: `line ${lineNo}` };
    if (unit !== undefined) entry.unit = unit;
    cur.set(key, entry);
  });
  return messages;
}

type XmlNode = string | number | boolean | null | undefined | XmlNode[] | { [k: string]: XmlNode };

function isObject(n: XmlNode): n is { [k: string]: XmlNode } {
  return typeof n === 'object' && n !== null && !Array.isArray(n);
}

/** Copy the leaf elements of one XML block (metadata, meanElements ...) into the message. */
function collectXmlLeaves(block: XmlNode, blockName: string, msg: Message, report: Report, label: string): void {
  if (!isObject(block)) return;
  for (const [key, node] of Object.entries(block)) {
    if (key.startsWith('@_') || key === 'COMMENT' || key === '#text') continue;
    const where = `<${blockName}><${key}>`;
    if (Array.isArray(node)) {
      report(`${label}${where} appears ${node.length} times; valid: each keyword once per message`);
      continue;
    }
    let value: string;
    let unit: string | undefined;
    if (isObject(node)) {
      const inner = Object.keys(node).filter((k) => !k.startsWith('@_') && k !== '#text');
      if (inner.length > 0) continue; // a nested block, not a keyword
      value = node['#text'] === undefined ? '' : String(node['#text']);
      const u = node['@_units'];
      if (typeof u === 'string') unit = u;
    } else {
      value = node === undefined || node === null ? '' : String(node);
    }
    const entry: Entry = { value, where };
    if (unit !== undefined) entry.unit = unit;
    msg.set(key, entry);
  }
}

function asList(n: XmlNode): XmlNode[] {
  if (n === undefined || n === null || n === '') return [];
  return Array.isArray(n) ? n : [n];
}

/** A document type or entity declaration: refused before any XML parsing (no entity is ever expanded). */
const XML_DECLARATIONS = /<!(DOCTYPE|ENTITY|ELEMENT|ATTLIST)\b/i;

function readXml(text: string, report: Report): Message[] {
  const declared = XML_DECLARATIONS.exec(text);
  if (declared) {
    const line = text.slice(0, declared.index).split('\n').length;
    report(
      `line ${line}: a <!${(declared[1] ?? '').toUpperCase()} declaration; valid: an NDM/XML document without document type or entity declarations (they are refused, never expanded)`,
    );
    return [];
  }
  const valid = xmlLib().XMLValidator.validate(text);
  if (valid !== true) {
    report(`not well-formed XML: ${valid.err.msg} (line ${valid.err.line}, column ${valid.err.col}); valid: an NDM/XML document with <omm> elements`);
    return [];
  }
  const parser = new (xmlLib().XMLParser)({
    ignoreAttributes: false,
    attributeNamePrefix: '@_',
    removeNSPrefix: true,
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
    isArray: (name) => name === 'omm' || name === 'segment',
  });
  let doc: XmlNode;
  try {
    doc = parser.parse(text) as XmlNode;
  } catch (err) {
    report(`cannot be read as XML: ${(err as Error).message.split('\n')[0] ?? 'parse error'}; valid: an NDM/XML document with <omm> elements`);
    return [];
  }
  if (!isObject(doc)) return [];
  const omms = isObject(doc['ndm']) ? asList(doc['ndm']['omm']) : asList(doc['omm']);
  if (omms.length === 0) {
    report('no <omm> element found; valid: <ndm> wrapping one or more <omm>, or an <omm> root element');
    return [];
  }
  const messages: Message[] = [];
  omms.forEach((omm, i) => {
    const label = omms.length > 1 ? `<omm> ${i + 1}: ` : '';
    const segments = isObject(omm) && isObject(omm['body']) ? asList(omm['body']['segment']) : [];
    if (segments.length === 0) {
      report(`${label}no <body><segment> found; valid: <omm><body><segment> with <metadata> and <data>`);
      return;
    }
    for (const seg of segments) {
      const msg: Message = new Map();
      if (!isObject(seg)) continue;
      collectXmlLeaves(seg['metadata'], 'metadata', msg, report, label);
      const data = seg['data'];
      if (isObject(data)) {
        collectXmlLeaves(data['meanElements'], 'meanElements', msg, report, label);
        collectXmlLeaves(data['tleParameters'], 'tleParameters', msg, report, label);
      }
      messages.push(msg);
    }
  });
  return messages;
}

function readJson(text: string, report: Report): Message[] {
  let doc: unknown;
  try {
    doc = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    report(`not valid JSON: ${(e as Error).message}; valid: an OMM object or an array of them`);
    return [];
  }
  const list = Array.isArray(doc) ? doc : [doc];
  if (list.length === 0) {
    report('the JSON array is empty; valid: one or more OMM objects');
    return [];
  }
  const messages: Message[] = [];
  list.forEach((item: unknown, i) => {
    const at = Array.isArray(doc) ? `[${i}]` : '';
    if (typeof item !== 'object' || item === null || Array.isArray(item)) {
      report(`JSON${at ? ` element ${at}` : ''} is ${JSON.stringify(item)}; valid: an object of OMM keywords (OBJECT_NAME, EPOCH, MEAN_MOTION ...)`);
      return;
    }
    const msg: Message = new Map();
    for (const [key, v] of Object.entries(item as Record<string, unknown>)) {
      const where = at ? `JSON ${at}.${key}` : `JSON key ${key}`;
      if (v === null || v === undefined) continue;
      if (typeof v === 'string' || typeof v === 'number') {
        msg.set(key.toUpperCase(), { value: String(v), where });
      } else {
        report(`${where} is ${JSON.stringify(v)}; valid: a number or a string`);
      }
    }
    messages.push(msg);
  });
  return messages;
}

// ---------------------------------------------------------------- checks

function checkMessage(msg: Message, label: string, origin: string, report: Report, warn: Report): ElementSet | undefined {
  let bad = false;
  const fail = (m: string): void => {
    bad = true;
    report(`${label}${m}`);
  };
  const say = (key: string, e: Entry): string => `${key} (${e.where}) is ${quote(e.value)}`;
  const present = (key: string): Entry | undefined => {
    const e = msg.get(key);
    return e && e.value.trim() !== '' ? e : undefined;
  };

  for (const [key, what] of REQUIRED) {
    if (present(key)) continue;
    let hint = '';
    if (key === 'MEAN_MOTION' && present('SEMI_MAJOR_AXIS')) hint = '; SEMI_MAJOR_AXIS was given, but SGP4 elements use MEAN_MOTION';
    if (key === 'BSTAR' && present('BTERM')) hint = '; BTERM was given: that is an SGP4-XP parameter, not supported';
    if (key === 'MEAN_MOTION_DDOT' && present('AGOM')) hint = '; AGOM was given: that is an SGP4-XP parameter, not supported';
    const empty = msg.has(key) ? ' (empty)' : '';
    fail(`missing required keyword ${key}${empty}${hint}; valid: ${key} given: ${what}`);
  }

  // an object not yet launched (or not yet catalogued) has no international designator
  if (!present('OBJECT_ID')) warn(`${label}no OBJECT_ID (international designator, e.g. 2031-042A); accepted without one`);

  const fixed = (key: string, allowed: readonly string[], why: string): void => {
    const e = present(key);
    if (e && !allowed.includes(e.value.trim().toUpperCase())) {
      fail(`${say(key, e)}; ${why}; valid: ${allowed.join(' or ')}`);
    }
  };
  fixed('MEAN_ELEMENT_THEORY', THEORIES, 'only SGP4 mean elements are supported');
  fixed('REF_FRAME', ['TEME'], 'SGP4 mean elements are referred to TEME');
  fixed('TIME_SYSTEM', ['UTC'], 'epochs are read as UTC');
  fixed('CENTER_NAME', ['EARTH'], 'SGP4 orbits are Earth orbits');

  const unitOk = (key: string, e: Entry): boolean => {
    const allowed = UNITS[key];
    if (e.unit === undefined || allowed === undefined) return true;
    const u = e.unit.replace(/\s+/g, '').toLowerCase();
    if (allowed.includes(u)) return true;
    fail(`${key} (${e.where}) has unit ${quote(e.unit)}; valid: [${allowed[0] ?? ''}] or no unit`);
    return false;
  };
  const number = (key: string, rule?: RangeRule): number => {
    const e = present(key);
    if (!e) return Number.NaN; // reported as missing above
    if (!unitOk(key, e)) return Number.NaN;
    const v = parseDecimal(e.value);
    if (v === undefined) {
      fail(`${say(key, e)}, not a number; valid: a decimal number such as 0.0012 or -1.6E-7${rule ? `, ${rule.valid}` : ''}`);
      return Number.NaN;
    }
    if (rule && !inRange(v, rule)) {
      fail(`${say(key, e)}; valid: ${rule.valid}`);
      return Number.NaN;
    }
    return v;
  };
  const count = (key: string, fallback: number): number => {
    const e = present(key);
    if (!e) return fallback;
    const v = parseCount(e.value);
    if (v === undefined) {
      fail(`${say(key, e)}; valid: a non-negative integer`);
      return Number.NaN;
    }
    return v;
  };

  let epochMs = Number.NaN;
  let epochIso = '';
  const epochEntry = present('EPOCH');
  if (epochEntry) {
    const r = parseCcsdsEpoch(epochEntry.value);
    if (r.ok) {
      epochMs = r.epochMs;
      epochIso = r.epochIso;
    } else {
      fail(`${say('EPOCH', epochEntry)}; valid: ${r.valid}`);
    }
  }

  const meanMotionRevPerDay = number('MEAN_MOTION', MEAN_MOTION_RANGE);
  const eccentricity = number('ECCENTRICITY', ECCENTRICITY_RANGE);
  const inclinationDeg = number('INCLINATION', INCLINATION_RANGE);
  const raanDeg = number('RA_OF_ASC_NODE', ANGLE_360_RANGE);
  const argPericenterDeg = number('ARG_OF_PERICENTER', ANGLE_360_RANGE);
  const meanAnomalyDeg = number('MEAN_ANOMALY', ANGLE_360_RANGE);
  const bstarPerEarthRadii = number('BSTAR');
  const meanMotionDotRevPerDay2 = number('MEAN_MOTION_DOT');
  const meanMotionDdotRevPerDay3 = number('MEAN_MOTION_DDOT');
  const noradCatId = present('NORAD_CAT_ID') ? count('NORAD_CAT_ID', Number.NaN) : Number.NaN;
  const elementSetNo = count('ELEMENT_SET_NO', 0);
  const revAtEpoch = count('REV_AT_EPOCH', 0);
  const ephemerisType = count('EPHEMERIS_TYPE', 0);
  const typeEntry = present('EPHEMERIS_TYPE');
  if (typeEntry && Number.isFinite(ephemerisType)) {
    const why = ephemerisTypeProblem(ephemerisType);
    if (why) fail(`${say('EPHEMERIS_TYPE', typeEntry)}; ${why}`);
  }
  let classification = 'U';
  const classEntry = present('CLASSIFICATION_TYPE');
  if (classEntry) {
    classification = classEntry.value.trim().toUpperCase();
    if (!(CLASSIFICATIONS as readonly string[]).includes(classification)) {
      fail(`${say('CLASSIFICATION_TYPE', classEntry)}; valid: ${CLASSIFICATIONS.join(', ')}`);
    }
  }

  if (bad) return undefined;
  const omm: OmmElements = {
    objectName: present('OBJECT_NAME')?.value.trim() ?? '',
    objectId: present('OBJECT_ID')?.value.trim() ?? '',
    epochIso,
    meanMotionRevPerDay,
    eccentricity,
    inclinationDeg,
    raanDeg,
    argPericenterDeg,
    meanAnomalyDeg,
    bstarPerEarthRadii,
    meanMotionDotRevPerDay2,
    meanMotionDdotRevPerDay3,
    noradCatId,
    elementSetNo,
    revAtEpoch,
    classification,
    ephemerisType,
  };
  return {
    origin,
    catalogNumber: present('NORAD_CAT_ID')?.value.trim() ?? '',
    epochMs,
    omm,
  };
}

/** The mean elements and drag terms of a set, for telling two sets at one epoch apart. */
function elementsKey(set: ElementSet): string {
  const o = set.omm;
  if (!o) return '';
  return [o.meanMotionRevPerDay, o.eccentricity, o.inclinationDeg, o.raanDeg, o.argPericenterDeg, o.meanAnomalyDeg, o.bstarPerEarthRadii, o.meanMotionDotRevPerDay2, o.meanMotionDdotRevPerDay3].join('|');
}

/**
 * Read every OMM in `text` (KVN, XML or JSON; detected from the first character
 * when `format` is not given: '<' XML, '{' or '[' JSON, anything else KVN) and
 * check it for SGP4 use. Every problem is reported, with `file` and `fieldPath`;
 * only messages without problems become element sets.
 */
export function parseOmm(
  text: string,
  file: string,
  fieldPath: string,
  format?: OmmFormat | 'auto',
): { sets: ElementSet[]; problems: Problem[]; warnings: string[] } {
  const fmt = format === undefined || format === 'auto' ? detectFormat(text) : format;
  const problems: Problem[] = [];
  const warnings: string[] = [];
  const report: Report = (message) => problems.push({ file, path: fieldPath, message });
  const kind = fmt.toUpperCase();
  const readers: Record<OmmFormat, (t: string, r: Report) => Message[]> = {
    kvn: readKvn,
    xml: readXml,
    json: readJson,
  };
  const messages = readers[fmt](text, (m) => report(`OMM ${kind}: ${m}`));
  if (messages.length === 0 && problems.length === 0) {
    report(`OMM ${kind}: no message found; valid: one or more OMMs with OBJECT_NAME, EPOCH, MEAN_MOTION ...`);
  }
  const base = fieldPath ? `${file}: ${fieldPath}` : file;
  const sets: ElementSet[] = [];
  const byKey = new Map<string, { set: ElementSet; index: number }>();
  messages.forEach((msg, i) => {
    const name = msg.get('OBJECT_NAME')?.value.trim();
    const numbered = messages.length > 1 ? ` ${i + 1} of ${messages.length}` : '';
    const label = `OMM ${kind}${numbered}${name ? ` (${quote(name)})` : ''}: `;
    const origin = base + (messages.length > 1 ? ` [${i}]` : '') + (name ? ` (${name})` : '');
    const set = checkMessage(msg, label, origin, report, (m) => warnings.push(`${base}: ${m}`));
    if (!set) return;
    // two different sets for one object at one epoch: which one is meant is unknowable
    const key = `${set.omm?.noradCatId}|${set.epochMs}`;
    const twin = byKey.get(key);
    const at = (k: number): string => `message ${k + 1} (EPOCH at ${messages[k]?.get('EPOCH')?.where ?? '?'})`;
    if (twin && elementsKey(twin.set) !== elementsKey(set)) {
      report(
        `OMM ${kind}: ${at(i)} and ${at(twin.index)} have the same NORAD_CAT_ID ${set.catalogNumber} and EPOCH but different elements; valid: one element set per object and epoch`,
      );
      return;
    }
    if (!twin) byKey.set(key, { set, index: i });
    sets.push(set);
  });
  return { sets, problems, warnings };
}
