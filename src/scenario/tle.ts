/**
 * Two-line element sets (TLE): reading and full validation before anything
 * reaches satellite.js (whose parser checks nothing: garbage gives NaN and
 * checksums are ignored).
 *
 * Format: the TLE column layout published with Spacetrack Report #3 (Hoots &
 * Roehrich, 1980) and kept in Vallado, Crawford, Hujsak & Kelso, "Revisiting
 * Spacetrack Report #3", AIAA 2006-6753 (its SGP4-VER.TLE verification file).
 * Columns below are 1-based and inclusive, as the layout is usually printed.
 *   Line 1: 1 line no. | 3-7 catalogue no. | 8 classification | 10-17 international
 *   designator | 19-20 epoch year | 21-32 epoch day of year with fraction |
 *   34-43 ndot/2 (rev/day^2) | 45-52 nddot/6 (rev/day^3, implied decimal + exponent) |
 *   54-61 BSTAR (1/earth radii, implied decimal + exponent) | 63 ephemeris type |
 *   65-68 element set no. | 69 checksum
 *   Line 2: 1 line no. | 3-7 catalogue no. | 9-16 inclination deg | 18-25 RAAN deg |
 *   27-33 eccentricity (implied leading point) | 35-42 argument of perigee deg |
 *   44-51 mean anomaly deg | 53-63 mean motion rev/day | 64-68 revolution no. | 69 checksum
 * Checksum: sum of columns 1-68 with digits counting their value, '-' counting 1
 * and everything else 0, modulo 10, written in column 69.
 * Epoch year: 57-99 means 19xx, 00-56 means 20xx (the usual convention, as in the
 * SGP4-VER.TLE notes). Alpha-5 catalogue numbers (a letter A-Z without I and O,
 * then 4 digits) are accepted in columns 3-7.
 * Text after column 69 is ignored (the verification file puts start/stop/step
 * times there). Lines starting with '#' are comments.
 */
import type { Problem } from '../errors.js';
import type { ElementSet, OmmElements } from './types.js';
import {
  ANGLE_360_RANGE,
  ECCENTRICITY_RANGE,
  INCLINATION_RANGE,
  MEAN_MOTION_RANGE,
  type RangeRule,
  dayOfYearStartMs,
  daysInYear,
  ephemerisTypeProblem,
  inRange,
  isoFromDayMicros,
  firstLineQuoter,
  quote,
  quoteLine,
} from './elements-common.js';

/** Mod-10 checksum of columns 1-68 of a TLE line ('-' counts 1, digits their value). */
export function tleChecksum(line: string): number {
  let sum = 0;
  const n = Math.min(68, line.length);
  for (let i = 0; i < n; i++) {
    const c = line.charCodeAt(i);
    if (c >= 48 && c <= 57) sum += c - 48;
    else if (c === 45) sum += 1;
  }
  return sum % 10;
}

/**
 * Append the checksum digit to columns 1-68 of a TLE line (for writing invented
 * demo sets). A longer line has its column 69 onward replaced.
 */
export function withChecksum(line68: string): string {
  if (line68.length < 68) {
    throw new RangeError(`withChecksum: a TLE line needs 68 columns before the checksum, got ${line68.length}`);
  }
  const body = line68.slice(0, 68);
  return body + String(tleChecksum(body));
}

/** One fixed-column field: 1-based inclusive columns, a pattern and what is valid. */
interface FieldSpec {
  from: number;
  to: number;
  name: string;
  pattern: RegExp;
  valid: string;
}

const SPACE = (col: number): FieldSpec => ({
  from: col, to: col, name: 'separator', pattern: /^ $/, valid: 'a space',
});

const CATALOGUE: Omit<FieldSpec, 'from' | 'to'> = {
  name: 'catalogue number',
  pattern: /^(?:[0-9A-HJ-NP-Z]\d{4}| {1,4}\d+)$/,
  valid: '5 digits (leading zeros or blanks), or Alpha-5: a letter A-Z other than I and O then 4 digits',
};

const IMPLIED_EXP = (from: number, name: string): FieldSpec => ({
  from, to: from + 7, name,
  pattern: /^[ +-]\d{5}[ +-]\d$/,
  valid: 'sign or blank, 5 digits with an implied leading decimal point, exponent sign and 1 digit (e.g. " 12345-4" = 0.12345e-4)',
});

const ANGLE = (from: number, name: string): FieldSpec => ({
  from, to: from + 7, name,
  pattern: /^ *\d{1,3}\.\d{4}$/,
  valid: 'a right-aligned number ddd.dddd with 4 decimals',
});

const LINE1: readonly FieldSpec[] = [
  SPACE(2),
  { from: 3, to: 7, ...CATALOGUE },
  { from: 8, to: 8, name: 'classification', pattern: /^[UCS]$/, valid: 'U, C or S' },
  SPACE(9),
  {
    from: 10, to: 17, name: 'international designator',
    pattern: /^(?:\d{5}[A-Z]{1,3} {0,2}| {8})$/,
    valid: 'launch year (2 digits), launch number (3 digits) and piece (1-3 letters, left-aligned), or all blank',
  },
  SPACE(18),
  { from: 19, to: 20, name: 'epoch year', pattern: /^\d{2}$/, valid: '2 digits (57-99 = 19xx, 00-56 = 20xx)' },
  {
    from: 21, to: 32, name: 'epoch day of year', pattern: /^ *\d{1,3}\.\d{8}$/,
    valid: 'day of year with 8 decimals, ddd.dddddddd',
  },
  SPACE(33),
  {
    from: 34, to: 43, name: 'first derivative of mean motion / 2', pattern: /^[ +-]\.\d{8}$/,
    valid: 'sign or blank, then .dddddddd (rev/day^2)',
  },
  SPACE(44),
  IMPLIED_EXP(45, 'second derivative of mean motion / 6'),
  SPACE(53),
  IMPLIED_EXP(54, 'BSTAR drag term'),
  SPACE(62),
  { from: 63, to: 63, name: 'ephemeris type', pattern: /^[ \d]$/, valid: 'a digit or blank' },
  SPACE(64),
  { from: 65, to: 68, name: 'element set number', pattern: /^ *\d*$/, valid: 'right-aligned digits or blank' },
];

const LINE2: readonly FieldSpec[] = [
  SPACE(2),
  { from: 3, to: 7, ...CATALOGUE },
  SPACE(8),
  ANGLE(9, 'inclination'),
  SPACE(17),
  ANGLE(18, 'right ascension of the ascending node'),
  SPACE(26),
  {
    from: 27, to: 33, name: 'eccentricity', pattern: /^\d{7}$/,
    valid: '7 digits with an implied leading decimal point (e.g. 0012345 = 0.0012345)',
  },
  SPACE(34),
  ANGLE(35, 'argument of perigee'),
  SPACE(43),
  ANGLE(44, 'mean anomaly'),
  SPACE(52),
  {
    from: 53, to: 63, name: 'mean motion', pattern: /^ *\d{1,2}\.\d{8}$/,
    valid: 'a right-aligned number dd.dddddddd (rev/day)',
  },
  { from: 64, to: 68, name: 'revolution number at epoch', pattern: /^ *\d*$/, valid: 'right-aligned digits or blank' },
];

function cols(line: string, from: number, to: number): string {
  return line.slice(from - 1, to);
}

/** Value of an implied-decimal exponent field such as " 12345-4" (= 0.12345e-4). */
function impliedExp(field: string): number {
  // Built as decimal text so the double is the correctly rounded value of what is written
  // (the same double an OMM's "-.22483E-4" gives).
  const sign = field[0] === '-' ? '-' : '';
  const expSign = field[6] === '-' ? '-' : '';
  return Number(`${sign}0.${field.slice(1, 6)}e${expSign}${field.slice(7, 8)}`);
}

/** Alpha-5 catalogue number as an integer (A = 10 ... Z = 33, skipping I and O). */
function catalogueValue(field: string): number {
  const t = field.trim();
  const first = t[0] ?? '0';
  if (/[A-Z]/.test(first)) {
    const alpha = 'ABCDEFGHJKLMNPQRSTUVWXYZ'.indexOf(first) + 10;
    return alpha * 10_000 + Number(t.slice(1));
  }
  return Number(t);
}

function twoDigitYear(yy: number): number {
  return yy < 57 ? 2000 + yy : 1900 + yy;
}

/** Where a line sits, for messages: "line 2 of set 3 (line 9 of the text)". */
interface LineRef {
  setNo: number;
  lineNo: 1 | 2;
  textLine: number;
  name?: string;
  /** Columns 3-7 as written, when not blank. */
  catalogue?: string;
}

interface LineRefWithText extends LineRef {
  lineText: string;
}

function where(ref: LineRef): string {
  const named = ref.name ? ` ${quote(ref.name)}` : '';
  const cat = ref.catalogue ? `catalogue ${ref.catalogue}, ` : '';
  return `line ${ref.lineNo} of set ${ref.setNo}${named} (${cat}line ${ref.textLine} of the text)`;
}

type Report = (message: string) => void;

/** Length, line number, checksum and fixed-column checks for one line. True when its fields can be read. */
function checkLine(
  line: string,
  ref: LineRef,
  specs: readonly FieldSpec[],
  checksum: boolean,
  report: Report,
  quoteOnce: (text: string) => string | undefined = quoteLine,
): boolean {
  const at = where(ref);
  const lineDigit = line[0] ?? '';
  let ok = true;
  if (lineDigit !== String(ref.lineNo)) {
    report(`${at}: column 1 (line number) is ${quote(lineDigit)}; valid: '${ref.lineNo}'`);
    ok = false;
  }
  if (line.length < 69) {
    const shown = quoteOnce(line);
    report(`${at}: line is ${line.length} characters long; valid: at least 69 (columns 1-69, checksum in column 69)${shown ? `: ${shown}` : ''}`);
    return false;
  }
  if (checksum) {
    const expected = tleChecksum(line);
    const found = line[68] ?? '';
    if (!/^\d$/.test(found)) {
      report(`${at}: checksum (column 69) is ${quote(found)}, expected ${expected}; valid: the mod-10 sum of columns 1-68 (digits count their value, '-' counts 1, others 0)`);
    } else if (Number(found) !== expected) {
      report(`${at}: checksum (column 69) is ${found}, expected ${expected}; valid: the mod-10 sum of columns 1-68 (digits count their value, '-' counts 1, others 0)`);
    }
  }
  for (const f of specs) {
    const v = cols(line, f.from, f.to);
    if (!f.pattern.test(v)) {
      const span = f.from === f.to ? `column ${f.from}` : `columns ${f.from}-${f.to}`;
      report(`${at}: ${span} (${f.name}) is ${quote(v)}; valid: ${f.valid}`);
      ok = false;
    }
  }
  return ok;
}

/** Numbers read from a TLE whose columns passed their checks. */
interface Line1Values {
  catalogue: string;
  classification: string;
  intlDesignator: string;
  year: number;
  dayInt: number;
  dayFrac8: number;
  ndot: number;
  nddot: number;
  bstar: number;
  ephemerisType: number;
  elementSetNo: number;
}

interface Line2Values {
  catalogue: string;
  inclinationDeg: number;
  raanDeg: number;
  eccentricity: number;
  argPerigeeDeg: number;
  meanAnomalyDeg: number;
  meanMotionRevPerDay: number;
  revAtEpoch: number;
}

function readLine1(l1: string): Line1Values {
  const day = cols(l1, 21, 32).trim();
  const point = day.indexOf('.');
  const blankToZero = (s: string): number => (s.trim() === '' ? 0 : Number(s));
  return {
    catalogue: cols(l1, 3, 7),
    classification: cols(l1, 8, 8),
    intlDesignator: cols(l1, 10, 17),
    year: twoDigitYear(Number(cols(l1, 19, 20))),
    dayInt: Number(day.slice(0, point)),
    dayFrac8: Number(day.slice(point + 1)),
    ndot: Number(cols(l1, 34, 43).replace(' ', '')),
    nddot: impliedExp(cols(l1, 45, 52)),
    bstar: impliedExp(cols(l1, 54, 61)),
    ephemerisType: blankToZero(cols(l1, 63, 63)),
    elementSetNo: blankToZero(cols(l1, 65, 68)),
  };
}

function readLine2(l2: string): Line2Values {
  const blankToZero = (s: string): number => (s.trim() === '' ? 0 : Number(s));
  return {
    catalogue: cols(l2, 3, 7),
    inclinationDeg: Number(cols(l2, 9, 16)),
    raanDeg: Number(cols(l2, 18, 25)),
    eccentricity: Number(`0.${cols(l2, 27, 33)}`),
    argPerigeeDeg: Number(cols(l2, 35, 42)),
    meanAnomalyDeg: Number(cols(l2, 44, 51)),
    meanMotionRevPerDay: Number(cols(l2, 53, 63)),
    revAtEpoch: blankToZero(cols(l2, 64, 68)),
  };
}

/** Epoch of line 1: UTC ms (fraction kept) and micro-seconds of the day (exact: 1e-8 day = 864 us). */
function epochOf(v: Line1Values): { epochMs: number; dayStartMs: number; microsOfDay: number } {
  const dayStartMs = dayOfYearStartMs(v.year, v.dayInt);
  return { epochMs: dayStartMs + v.dayFrac8 * 0.864, dayStartMs, microsOfDay: v.dayFrac8 * 864 };
}

/** Semantic checks once every column has the right shape. */
function checkValues(v1: Line1Values, v2: Line2Values, ref1: LineRef, ref2: LineRefWithText, report: Report): void {
  const dayMax = daysInYear(v1.year);
  if (v1.dayInt < 1 || v1.dayInt > dayMax) {
    report(
      `${where(ref1)}: columns 21-32 (epoch day of year) give day ${v1.dayInt} of ${v1.year}; valid: 1.00000000 up to but not including ${dayMax + 1} (${v1.year} has ${dayMax} days)`,
    );
  }
  const typeProblem = ephemerisTypeProblem(v1.ephemerisType);
  if (typeProblem) report(`${where(ref1)}: column 63 (ephemeris type) is ${v1.ephemerisType}; ${typeProblem}`);

  const range = (value: number, text: string, span: string, name: string, rule: RangeRule): void => {
    if (!inRange(value, rule)) report(`${where(ref2)}: columns ${span} (${name}) is ${quote(text)} = ${value}; valid: ${rule.valid}`);
  };
  const l2 = ref2.lineText;
  range(v2.inclinationDeg, cols(l2, 9, 16), '9-16', 'inclination', INCLINATION_RANGE);
  range(v2.raanDeg, cols(l2, 18, 25), '18-25', 'right ascension of the ascending node', ANGLE_360_RANGE);
  range(v2.eccentricity, cols(l2, 27, 33), '27-33', 'eccentricity', ECCENTRICITY_RANGE);
  range(v2.argPerigeeDeg, cols(l2, 35, 42), '35-42', 'argument of perigee', ANGLE_360_RANGE);
  range(v2.meanAnomalyDeg, cols(l2, 44, 51), '44-51', 'mean anomaly', ANGLE_360_RANGE);
  range(v2.meanMotionRevPerDay, cols(l2, 53, 63), '53-63', 'mean motion, rev/day', MEAN_MOTION_RANGE);

  if (catalogueValue(v1.catalogue) !== catalogueValue(v2.catalogue)) {
    report(
      `${where(ref2)}: columns 3-7 (catalogue number) are ${quote(v2.catalogue)} but line 1 has ${quote(v1.catalogue)}; valid: the same catalogue number on both lines`,
    );
  }
}


/** The elements of a set (drag terms of line 1, line 2 without catalogue, revolution number and checksum). */
function elementsOf(set: ElementSet): string {
  return set.tle ? `${set.tle.line1.slice(33, 61)}|${set.tle.line2.slice(8, 63)}` : '';
}

/** A TLE line is recognised by its line number and a blank, or by its length. */
function looksLikeDataLine(line: string): boolean {
  return /^[12] /.test(line) || line.length >= 60;
}

export interface TleParseOptions {
  /** Check the column-69 checksums (default true). Off only for known-bad reference files. */
  checksum?: boolean;
}

/**
 * Read every 2-line or 3-line (name line first) element set in `text`.
 * Every problem is reported (with `file`, `fieldPath`, set and line); only sets
 * with no problem are returned. A name line may carry the "0 " prefix of the
 * three-line form; blank lines, '#' comment lines, CRLF and trailing blanks are
 * accepted.
 */
export function parseTleText(
  text: string,
  file: string,
  fieldPath: string,
  opts: TleParseOptions = {},
): { sets: ElementSet[]; problems: Problem[] } {
  const checksum = opts.checksum ?? true;
  const problems: Problem[] = [];
  const report: Report = (message) => problems.push({ file, path: fieldPath, message });

  const lines: { text: string; no: number }[] = [];
  text.split(/\r\n|\r|\n/).forEach((raw, i) => {
    const t = raw.replace(/\s+$/, '');
    if (t === '' || t.startsWith('#')) return;
    lines.push({ text: t, no: i + 1 });
  });

  interface Found {
    setNo: number;
    name?: string;
    l1: { text: string; no: number };
    l2: { text: string; no: number };
  }
  const found: Found[] = [];
  const quoter = firstLineQuoter();
  let quoted = 0;
  const quoteOnce = (t: string): string | undefined => {
    const q = quoter(t);
    quoted++;
    return q;
  };
  /** After the first quoted line, later name lines are not echoed either. */
  const quoteOnceUsed = (): boolean => quoted > 0;
  let setNo = 0;
  let i = 0;
  while (i < lines.length) {
    const first = lines[i];
    if (!first) break;
    setNo++;
    let name: string | undefined;
    if (!looksLikeDataLine(first.text)) {
      name = first.text.replace(/^0 /, '').trim();
      i++;
    }
    const l1 = lines[i];
    // a text that is not element sets (a path to another file) is quoted once, cut short
    const named = name !== undefined ? ` ${quoteLine(name)}` : '';
    if (!l1 || !looksLikeDataLine(l1.text)) {
      const after = `after the name line (line ${first.no} of the text)`;
      const showName = !quoteOnceUsed();
      const shown = l1 ? quoteOnce(l1.text) : undefined;
      report(
        `set ${setNo}${showName ? named : ''}: line 1 missing ${after}; valid: a 2-line or 3-line element set${l1 ? `, found ${shown ?? `line ${l1.no}`}` : ', found the end of the text'}`,
      );
      continue;
    }
    if (l1.text.startsWith('2 ')) {
      const shown = quoteOnce(l1.text);
      report(`set ${setNo}${named}: line 1 missing, found a line 2 at line ${l1.no} of the text${shown ? ` (${shown})` : ''}; valid: line 1 (column 1 '1') then line 2`);
      i++;
      continue;
    }
    i++;
    const l2 = lines[i];
    if (!l2 || !looksLikeDataLine(l2.text) || l2.text.startsWith('1 ')) {
      const shown = l2 ? quoteOnce(l2.text) : undefined;
      report(
        `set ${setNo}${named}: line 2 missing after line 1 (line ${l1.no} of the text)${l2 ? `, found ${shown ? `${shown} at ` : ''}line ${l2.no}` : ', found the end of the text'}; valid: line 2 right after line 1`,
      );
      continue;
    }
    i++;
    found.push(name !== undefined ? { setNo, name, l1, l2 } : { setNo, l1, l2 });
  }
  if (setNo === 0) {
    report('no element set found; valid: one or more 2-line or 3-line element sets (lines starting "1 " and "2 ")');
  }

  const sets: ElementSet[] = [];
  const byKey = new Map<string, { set: ElementSet; setNo: number; line: number }>();
  const origin = fieldPath ? `${file}: ${fieldPath}` : file;
  for (const f of found) {
    const before = problems.length;
    const ref1: LineRefWithText = { setNo: f.setNo, lineNo: 1, textLine: f.l1.no, lineText: f.l1.text };
    const ref2: LineRefWithText = { setNo: f.setNo, lineNo: 2, textLine: f.l2.no, lineText: f.l2.text };
    if (f.name !== undefined) {
      ref1.name = f.name;
      ref2.name = f.name;
    }
    // a line that is no TLE line at all (not a digit and a blank in columns 1-2: another
    // kind of file) is not checked column by column, so its text is not echoed piecemeal
    const foreign = [f.l1, f.l2].find((l) => !/^\d /.test(l.text));
    if (foreign) {
      const shown = quoteOnce(foreign.text);
      report(
        `set ${f.setNo}: line ${foreign.no} of the text${shown ? ` (${shown})` : ''} is not a TLE line; valid: line 1 and line 2 of an element set, starting "1 " and "2 "`,
      );
      continue;
    }
    const cat1 = cols(f.l1.text, 3, 7).trim();
    const cat2 = cols(f.l2.text, 3, 7).trim();
    if (cat1) ref1.catalogue = cat1;
    if (cat2) ref2.catalogue = cat2;
    const ok1 = checkLine(f.l1.text, ref1, LINE1, checksum, report, quoteOnce);
    const ok2 = checkLine(f.l2.text, ref2, LINE2, checksum, report, quoteOnce);
    if (!ok1 || !ok2) continue;
    const line1 = f.l1.text.slice(0, 69);
    const line2 = f.l2.text.slice(0, 69);
    const v1 = readLine1(line1);
    const v2 = readLine2(line2);
    checkValues(v1, v2, ref1, ref2, report);
    if (problems.length > before) continue;
    const tag = (setNo > 1 ? ` set ${f.setNo}` : '') + (f.name ? ` (${f.name})` : '');
    const set: ElementSet = {
      origin: origin + tag,
      catalogNumber: v1.catalogue.trim(),
      epochMs: epochOf(v1).epochMs,
      tle: { line1, line2 },
    };
    // two different sets for one object at one epoch: which one is meant is unknowable
    const key = `${catalogueValue(v1.catalogue)}|${set.epochMs}`;
    const twin = byKey.get(key);
    if (twin && elementsOf(twin.set) !== elementsOf(set)) {
      report(
        `set ${f.setNo} (line ${f.l1.no} of the text) and set ${twin.setNo} (line ${twin.line} of the text) have the same catalogue number ${v1.catalogue.trim()} ` +
          `and epoch but different elements; valid: one element set per object and epoch`,
      );
      continue;
    }
    if (!twin) byKey.set(key, { set, setNo: f.setNo, line: f.l1.no });
    sets.push(set);
  }
  return { sets, problems };
}

/**
 * The elements of a TLE that passed parseTleText, in OMM terms (CCSDS 502.0-B-2
 * keywords and units): MEAN_MOTION_DOT and _DDOT hold the TLE columns as written
 * (conventionally ndot/2 and nddot/6, as OMM producers copy them). OBJECT_ID is
 * built from the international designator ("58002B" -> "1958-002B", blank -> "").
 * Throws RangeError on lines that fail parseTleText's checks (pass only lines it
 * accepted, with the same checksum option).
 */
export function tleToOmm(
  line1: string,
  line2: string,
  opts: { objectName?: string; checksum?: boolean } = {},
): OmmElements {
  const objectName = opts.objectName ?? '';
  const problems: string[] = [];
  const ref1: LineRefWithText = { setNo: 1, lineNo: 1, textLine: 1, lineText: line1 };
  const ref2: LineRefWithText = { setNo: 1, lineNo: 2, textLine: 2, lineText: line2 };
  const report: Report = (m) => problems.push(m);
  const checksum = opts.checksum ?? true;
  const ok1 = checkLine(line1, ref1, LINE1, checksum, report);
  const ok2 = checkLine(line2, ref2, LINE2, checksum, report);
  if (ok1 && ok2) {
    checkValues(readLine1(line1), readLine2(line2), ref1, ref2, report);
  }
  if (problems.length > 0) throw new RangeError(`tleToOmm: lines not validated: ${problems.join('; ')}`);
  const v1 = readLine1(line1);
  const v2 = readLine2(line2);
  const { dayStartMs, microsOfDay } = epochOf(v1);
  const d = v1.intlDesignator;
  const objectId =
    d.trim() === '' ? '' : `${twoDigitYear(Number(d.slice(0, 2)))}-${d.slice(2, 5)}${d.slice(5).trim()}`;
  return {
    objectName,
    objectId,
    epochIso: isoFromDayMicros(dayStartMs, microsOfDay),
    meanMotionRevPerDay: v2.meanMotionRevPerDay,
    eccentricity: v2.eccentricity,
    inclinationDeg: v2.inclinationDeg,
    raanDeg: v2.raanDeg,
    argPericenterDeg: v2.argPerigeeDeg,
    meanAnomalyDeg: v2.meanAnomalyDeg,
    bstarPerEarthRadii: v1.bstar,
    meanMotionDotRevPerDay2: v1.ndot,
    meanMotionDdotRevPerDay3: v1.nddot,
    noradCatId: catalogueValue(v1.catalogue),
    elementSetNo: v1.elementSetNo,
    revAtEpoch: v2.revAtEpoch,
    classification: v1.classification,
    ephemerisType: v1.ephemerisType,
  };
}
