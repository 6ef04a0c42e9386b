import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { twoline2satrec } from 'satellite.js';
import type { Problem } from '../../src/errors.js';
import { parseCcsdsEpoch, parseOmm } from '../../src/scenario/omm.js';
import { tleToOmm } from '../../src/scenario/tle.js';

/**
 * References (test/reference/sgp4/, see its README.md):
 * - omm-samples/sample_omm.xml and sample_omm.csv: one element set of NORAD 5 as
 *   CCSDS 502.0-B OMM (XML, OMM 2.0 ndm wrapper) and as CSV; the README states they
 *   are the same element set as the TLE
 *     1 00005U 58002B   20287.20333880 -.00000016  00000-0 -22483-4 0  9998
 *     2 00005  34.2443 225.5254 1845686 162.2516 205.2356 10.84869164218149
 *   so both must give the same epoch (to 1 ms, the README's test tolerance) and the
 *   same elements.
 * - omm-samples/sample_omm.json: a later element set of the same object (JSON form).
 * Epoch formats: CCSDS 301.0-B-4 ASCII time code A (calendar) and B (day of year).
 * Bad-input tests use an invented OMM (PBX-DEMO 1, catalogue 90001), not a real
 * satellite's elements.
 */
const ref = (name: string): string =>
  readFileSync(fileURLToPath(new URL(`../reference/sgp4/${name}`, import.meta.url)), 'utf8');
const xmlText = ref('omm-samples/sample_omm.xml');
const csvText = ref('omm-samples/sample_omm.csv');
const jsonText = ref('omm-samples/sample_omm.json');

const README_TLE1 = '1 00005U 58002B   20287.20333880 -.00000016  00000-0 -22483-4 0  9998';
const README_TLE2 = '2 00005  34.2443 225.5254 1845686 162.2516 205.2356 10.84869164218149';

const FILE = 'ephemerides/demo.json';
const PATH = 'spacecraft[1].orbit.omm';
const oneMs = 1;

/** CSV with a header row and plain (unquoted) fields -> one flat JSON object of strings. */
function csvToObject(text: string): Record<string, string> {
  const [head, row] = text.trim().split(/\r?\n/);
  const keys = (head ?? '').split(',');
  const values = (row ?? '').split(',');
  expect(values).toHaveLength(keys.length);
  return Object.fromEntries(keys.map((k, i) => [k, values[i] ?? '']));
}

describe('OMM samples against the TLE of the same element set', () => {
  const tle = tleToOmm(README_TLE1, README_TLE2, { objectName: 'VANGUARD 1' });
  const tleSet = { epochMs: Date.UTC(2020, 0, 1) + 286 * 86_400_000 + 0.2033388 * 86_400_000 };

  it('XML sample: same elements and epoch as the TLE', () => {
    const { sets, problems } = parseOmm(xmlText, 'sample_omm.xml', PATH);
    expect(problems).toEqual([]);
    expect(sets).toHaveLength(1);
    const set = sets[0];
    // Every value is the same decimal number written two ways (e.g. BSTAR "-22483-4" and
    // "-.22483E-4"), so the doubles must be identical, and the epoch string too:
    // 0.20333880 d = 17568.47232 s = 04:52:48.472320 exactly.
    expect(set?.omm).toEqual(tle);
    expect(set?.omm?.epochIso).toBe('2020-10-13T04:52:48.472320');
    expect(set?.catalogNumber).toBe('5');
    expect(Math.abs((set?.epochMs ?? 0) - tleSet.epochMs)).toBeLessThan(oneMs);
    // Hand: day 287 of 2020 (leap: Jan..Sep = 274 days) = 13 October.
    expect(Math.abs((set?.epochMs ?? 0) - (Date.UTC(2020, 9, 13, 4, 52, 48) + 472.32))).toBeLessThan(1e-3);
  });

  it('XML sample agrees with satellite.js reading the TLE (independent parser)', () => {
    const o = parseOmm(xmlText, 'sample_omm.xml', PATH).sets[0]?.omm;
    const r = twoline2satrec(README_TLE1, README_TLE2);
    const rad = Math.PI / 180;
    expect((o?.inclinationDeg ?? 0) * rad).toBeCloseTo(r.inclo, 12);
    expect((o?.raanDeg ?? 0) * rad).toBeCloseTo(r.nodeo, 12);
    expect((o?.argPericenterDeg ?? 0) * rad).toBeCloseTo(r.argpo, 12);
    expect((o?.meanAnomalyDeg ?? 0) * rad).toBeCloseTo(r.mo, 12);
    expect(o?.eccentricity).toBe(r.ecco);
    expect(o?.bstarPerEarthRadii).toBe(r.bstar);
    expect(((o?.meanMotionRevPerDay ?? 0) * 2 * Math.PI) / 1440).toBeCloseTo(r.nokozai, 14);
    expect(o?.epochIso.slice(0, 4)).toBe('2020');
    expect(r.epochdays).toBe(287.2033388);
  });

  it('CSV sample (converted to the flat JSON form in this test): same as the XML', () => {
    const json = JSON.stringify(csvToObject(csvText));
    const fromCsv = parseOmm(json, 'sample_omm.csv', PATH, 'json');
    const fromXml = parseOmm(xmlText, 'sample_omm.xml', PATH);
    expect(fromCsv.problems).toEqual([]);
    expect(fromCsv.sets[0]?.omm).toEqual(fromXml.sets[0]?.omm);
    expect(fromCsv.sets[0]?.omm).toEqual(tle);
    expect(fromCsv.sets[0]?.epochMs).toBe(fromXml.sets[0]?.epochMs);
  });

  it('JSON sample (array form, numbers as JSON numbers) parses', () => {
    const { sets, problems } = parseOmm(jsonText, 'sample_omm.json', PATH);
    expect(problems).toEqual([]);
    expect(sets).toHaveLength(1);
    const raw = (JSON.parse(jsonText) as Record<string, number | string>[])[0] ?? {};
    expect(sets[0]?.omm).toEqual({
      objectName: raw['OBJECT_NAME'],
      objectId: raw['OBJECT_ID'],
      epochIso: '2025-02-14T14:36:48.662784',
      meanMotionRevPerDay: raw['MEAN_MOTION'],
      eccentricity: raw['ECCENTRICITY'],
      inclinationDeg: raw['INCLINATION'],
      raanDeg: raw['RA_OF_ASC_NODE'],
      argPericenterDeg: raw['ARG_OF_PERICENTER'],
      meanAnomalyDeg: raw['MEAN_ANOMALY'],
      bstarPerEarthRadii: raw['BSTAR'],
      meanMotionDotRevPerDay2: raw['MEAN_MOTION_DOT'],
      meanMotionDdotRevPerDay3: raw['MEAN_MOTION_DDOT'],
      noradCatId: raw['NORAD_CAT_ID'],
      elementSetNo: raw['ELEMENT_SET_NO'],
      revAtEpoch: raw['REV_AT_EPOCH'],
      classification: raw['CLASSIFICATION_TYPE'],
      ephemerisType: raw['EPHEMERIS_TYPE'],
    });
    expect(Math.abs((sets[0]?.epochMs ?? 0) - (Date.UTC(2025, 1, 14, 14, 36, 48) + 662.784))).toBeLessThan(1e-3);
  });

  it('KVN written in this test from the XML sample values: same as the XML', () => {
    // KVN layout per CCSDS 502.0-B-2 section 7 (header, metadata, data; COMMENT lines;
    // units in brackets). Values copied from sample_omm.xml.
    const kvn = [
      'CCSDS_OMM_VERS = 2.0',
      'COMMENT values copied from test/reference/sgp4/omm-samples/sample_omm.xml',
      'CREATION_DATE  = ',
      'ORIGINATOR     = ',
      'META_START',
      'OBJECT_NAME    = VANGUARD 1',
      'OBJECT_ID      = 1958-002B',
      'CENTER_NAME    = EARTH',
      'REF_FRAME      = TEME',
      'TIME_SYSTEM    = UTC',
      'MEAN_ELEMENT_THEORY = SGP/SGP4',
      'META_STOP',
      '',
      'COMMENT mean elements',
      'EPOCH          = 2020-10-13T04:52:48.472320',
      'MEAN_MOTION    = 10.84869164 [rev/day]',
      'ECCENTRICITY   = .1845686',
      'INCLINATION    = 34.2443 [deg]',
      'RA_OF_ASC_NODE = 225.5254 [deg]',
      'ARG_OF_PERICENTER = 162.2516 [deg]',
      'MEAN_ANOMALY   = 205.2356 [deg]',
      'EPHEMERIS_TYPE = 0',
      'CLASSIFICATION_TYPE = U',
      'NORAD_CAT_ID   = 5',
      'ELEMENT_SET_NO = 999',
      'REV_AT_EPOCH   = 21814',
      'BSTAR          = -.22483E-4 [1/ER]',
      'MEAN_MOTION_DOT = -1.6E-7 [rev/day**2]',
      'MEAN_MOTION_DDOT = 0 [rev/day**3]',
    ].join('\r\n');
    const fromKvn = parseOmm(kvn, 'sample.kvn', PATH);
    expect(fromKvn.problems).toEqual([]);
    expect(fromKvn.sets[0]?.omm).toEqual(parseOmm(xmlText, 'sample_omm.xml', PATH).sets[0]?.omm);
  });
});

describe('CCSDS 301.0-B epochs', () => {
  it('day-of-year form (code B) and trailing Z give the same instant as the calendar form', () => {
    const a = parseCcsdsEpoch('2020-10-13T04:52:48.472320');
    const b = parseCcsdsEpoch('2020-287T04:52:48.472320Z');
    const c = parseCcsdsEpoch('2020-10-13T04:52:48.472320Z');
    expect(a.ok && b.ok && c.ok).toBe(true);
    if (a.ok && b.ok && c.ok) {
      expect(b.epochMs).toBe(a.epochMs);
      expect(c.epochMs).toBe(a.epochMs);
      expect(b.epochIso).toBe('2020-10-13T04:52:48.472320');
    }
  });

  it('sub-millisecond fraction kept in epochMs; epochIso rounded to microseconds with carry', () => {
    const e = parseCcsdsEpoch('2031-01-01T00:00:00.0004');
    // A double near 1.9e12 ms resolves 2^-12 ms (0.24 us): tolerance 5e-4 ms.
    expect(e.ok && e.epochMs - Date.UTC(2031, 0, 1)).toBeCloseTo(0.4, 3);
    expect(e.ok && e.epochIso).toBe('2031-01-01T00:00:00.000400');
    const r = parseCcsdsEpoch('2031-365T23:59:59.9999996');
    expect(r.ok && r.epochIso).toBe('2032-01-01T00:00:00.000000');
    const w = parseCcsdsEpoch('2031-12-31T23:59:59');
    expect(w.ok && w.epochIso).toBe('2031-12-31T23:59:59.000000');
  });

  it('refuses offsets, impossible dates and leap seconds', () => {
    for (const bad of ['2031-03-13T12:00:00+02:00', '2031-03-13T12:00:00+00:00', '2031-03-13T12:00:00-0500']) {
      const r = parseCcsdsEpoch(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.valid).toMatch(/without an explicit offset/);
    }
    for (const bad of ['2031-02-29T00:00:00', '2031-366T00:00:00', '2031-13-01T00:00:00', '2031-03-13T24:00:00', '2031-06-30T23:59:60', '2031-03-13 12:00:00', 'yesterday']) {
      expect(parseCcsdsEpoch(bad).ok).toBe(false);
    }
    expect(parseCcsdsEpoch('2032-366T00:00:00').ok).toBe(true);
  });
});

/** Invented OMM (no real satellite) in KVN; `edit` replaces or removes keyword lines. */
const DEMO: Record<string, string> = {
  CCSDS_OMM_VERS: '2.0',
  OBJECT_NAME: 'PBX-DEMO 1',
  OBJECT_ID: '2031-042A',
  CENTER_NAME: 'EARTH',
  REF_FRAME: 'TEME',
  TIME_SYSTEM: 'UTC',
  MEAN_ELEMENT_THEORY: 'SGP4',
  EPOCH: '2031-072T12:00:00.000000',
  MEAN_MOTION: '15.20000000',
  ECCENTRICITY: '0.0012345',
  INCLINATION: '97.4000',
  RA_OF_ASC_NODE: '123.4567',
  ARG_OF_PERICENTER: '89.1234',
  MEAN_ANOMALY: '271.0000',
  EPHEMERIS_TYPE: '0',
  CLASSIFICATION_TYPE: 'U',
  NORAD_CAT_ID: '90001',
  ELEMENT_SET_NO: '999',
  REV_AT_EPOCH: '12345',
  BSTAR: '0.56789E-4',
  MEAN_MOTION_DOT: '0.00001234',
  MEAN_MOTION_DDOT: '0',
};
function demoKvn(changes: Record<string, string | null> = {}): string {
  const merged: Record<string, string | null> = { ...DEMO, ...changes };
  return Object.entries(merged)
    .filter((kv): kv is [string, string] => kv[1] !== null)
    .map(([k, v]) => `${k} = ${v}`)
    .join('\n');
}

function expectProblem(problems: Problem[], key: string, value: string | null, valid: RegExp): void {
  const hit = problems.find((p) => p.message.includes(key) && (value === null || p.message.includes(JSON.stringify(value))));
  expect(hit, `no problem naming ${key} ${value ?? ''}: ${JSON.stringify(problems)}`).toBeDefined();
  expect(hit?.file).toBe(FILE);
  expect(hit?.path).toBe(PATH);
  expect(hit?.message).toMatch(valid);
}

describe('parseOmm on the invented demo', () => {
  it('the unchanged demo parses (control for the bad-input tests)', () => {
    const { sets, problems } = parseOmm(demoKvn(), FILE, PATH);
    expect(problems).toEqual([]);
    expect(sets[0]?.origin).toBe(`${FILE}: ${PATH} (PBX-DEMO 1)`);
    // Day 72 of 2031 (common year: 31 + 28 = 59) = 13 March.
    expect(sets[0]?.epochMs).toBe(Date.UTC(2031, 2, 13, 12));
    expect(sets[0]?.omm?.epochIso).toBe('2031-03-13T12:00:00.000000');
  });

  it('several messages in one KVN text, and in one XML ndm', () => {
    const two = `${demoKvn()}\n\n${demoKvn({ OBJECT_NAME: 'PBX-DEMO 2', NORAD_CAT_ID: '90002' })}`;
    const k = parseOmm(two, FILE, PATH);
    expect(k.problems).toEqual([]);
    expect(k.sets.map((s) => s.catalogNumber)).toEqual(['90001', '90002']);
    const xml2 = xmlText.replace(/(<omm[\s\S]*<\/omm>)/, '$1$1');
    const x = parseOmm(xml2, FILE, PATH);
    expect(x.problems).toEqual([]);
    expect(x.sets).toHaveLength(2);
  });

  it('missing required keywords are each named', () => {
    const { sets, problems } = parseOmm(demoKvn({ ECCENTRICITY: null, BSTAR: null }), FILE, PATH);
    expect(sets).toEqual([]);
    expectProblem(problems, 'missing required keyword ECCENTRICITY', null, /eccentricity, 0 <= e < 1/);
    expectProblem(problems, 'missing required keyword BSTAR', null, /SGP4 drag term/);
    expect(problems).toHaveLength(2);
    const j = parseOmm(JSON.stringify({ ...DEMO, EPOCH: undefined }), FILE, PATH);
    expectProblem(j.problems, 'missing required keyword EPOCH', null, /UTC/);
  });

  it('only SGP4 mean element theory', () => {
    const r = parseOmm(demoKvn({ MEAN_ELEMENT_THEORY: 'SGP4-XP' }), FILE, PATH);
    expect(r.sets).toEqual([]);
    expectProblem(r.problems, 'MEAN_ELEMENT_THEORY', 'SGP4-XP', /only SGP4 mean elements are supported; valid: SGP4 or SGP\/SGP4/);
    const d = parseOmm(demoKvn({ MEAN_ELEMENT_THEORY: 'DSST' }), FILE, PATH);
    expectProblem(d.problems, 'MEAN_ELEMENT_THEORY', 'DSST', /only SGP4/);
  });

  it('REF_FRAME TEME, TIME_SYSTEM UTC, CENTER_NAME EARTH when present', () => {
    const r = parseOmm(demoKvn({ REF_FRAME: 'EME2000', TIME_SYSTEM: 'TAI', CENTER_NAME: 'MOON' }), FILE, PATH);
    expectProblem(r.problems, 'REF_FRAME', 'EME2000', /valid: TEME/);
    expectProblem(r.problems, 'TIME_SYSTEM', 'TAI', /valid: UTC/);
    expectProblem(r.problems, 'CENTER_NAME', 'MOON', /valid: EARTH/);
    const absent = parseOmm(demoKvn({ REF_FRAME: null, TIME_SYSTEM: null, CENTER_NAME: null, MEAN_ELEMENT_THEORY: null }), FILE, PATH);
    expect(absent.problems).toEqual([]);
  });

  it('eccentricity must be in [0, 1)', () => {
    for (const e of ['1.0', '1.2', '-0.1']) {
      const r = parseOmm(demoKvn({ ECCENTRICITY: e }), FILE, PATH);
      expect(r.sets).toEqual([]);
      expectProblem(r.problems, 'ECCENTRICITY', e, /valid: 0 <= e < 1/);
    }
  });

  it('mean motion must be > 0 rev/day', () => {
    for (const n of ['0', '-15.2']) {
      const r = parseOmm(demoKvn({ MEAN_MOTION: n }), FILE, PATH);
      expect(r.sets).toEqual([]);
      expectProblem(r.problems, 'MEAN_MOTION', n, /valid: greater than 0 rev\/day/);
    }
  });

  it('angles in range', () => {
    const r = parseOmm(demoKvn({ INCLINATION: '180.5', RA_OF_ASC_NODE: '-1', MEAN_ANOMALY: '361' }), FILE, PATH);
    expectProblem(r.problems, 'INCLINATION', '180.5', /valid: 0 to 180 deg/);
    expectProblem(r.problems, 'RA_OF_ASC_NODE', '-1', /valid: 0 to 360 deg/);
    expectProblem(r.problems, 'MEAN_ANOMALY', '361', /valid: 0 to 360 deg/);
  });

  it('numbers must parse; units must be the CCSDS ones', () => {
    const r = parseOmm(demoKvn({ INCLINATION: '97.4O', BSTAR: 'NaN', NORAD_CAT_ID: '9000l' }), FILE, PATH);
    expectProblem(r.problems, 'INCLINATION', '97.4O', /not a number; valid: a decimal number/);
    expectProblem(r.problems, 'BSTAR', 'NaN', /not a number/);
    expectProblem(r.problems, 'NORAD_CAT_ID', '9000l', /valid: a non-negative integer/);
    const u = parseOmm(demoKvn({ MEAN_MOTION: '0.0011 [rad/s]' }), FILE, PATH);
    expectProblem(u.problems, 'MEAN_MOTION', 'rad/s', /valid: \[rev\/day\]/);
    const x = parseOmm(xmlText.replace('<INCLINATION>', '<INCLINATION units="rad">'), FILE, PATH);
    expectProblem(x.problems, 'INCLINATION', 'rad', /valid: \[deg\]/);
  });

  it('an epoch with an explicit UTC offset is refused', () => {
    const r = parseOmm(demoKvn({ EPOCH: '2031-03-13T12:00:00+02:00' }), FILE, PATH);
    expect(r.sets).toEqual([]);
    expectProblem(r.problems, 'EPOCH', '2031-03-13T12:00:00+02:00', /without an explicit offset \(found "\+02:00"\)/);
    const z = parseOmm(demoKvn({ EPOCH: '2031-072T12:00:00Z' }), FILE, PATH);
    expect(z.problems).toEqual([]);
  });

  it('SGP4-XP ephemeris type and parameters are refused with a reason', () => {
    const r = parseOmm(demoKvn({ EPHEMERIS_TYPE: '4', BSTAR: null, BTERM: '0.0015' }), FILE, PATH);
    expectProblem(r.problems, 'EPHEMERIS_TYPE', '4', /SGP4-XP/);
    expectProblem(r.problems, 'missing required keyword BSTAR', null, /BTERM was given: that is an SGP4-XP parameter/);
  });

  it('malformed text: KVN line, duplicate keyword, XML, JSON', () => {
    const k = parseOmm(`${demoKvn()}\nthis is not kvn`, FILE, PATH);
    expectProblem(k.problems, 'line 23', 'this is not kvn', /valid: KEYWORD = value/);
    const d = parseOmm(`${demoKvn()}\nEPOCH = 2031-072T13:00:00`, FILE, PATH);
    expectProblem(d.problems, 'EPOCH is given again', null, /first at line 8/);
    const x = parseOmm('<ndm><omm><body></omm></ndm>', FILE, PATH);
    expectProblem(x.problems, 'not well-formed XML', null, /line 1/);
    const j = parseOmm('[{"OBJECT_NAME": "PBX-DEMO 1",}]', FILE, PATH);
    expectProblem(j.problems, 'not valid JSON', null, /valid: an OMM object/);
    const e = parseOmm('', FILE, PATH);
    expectProblem(e.problems, 'no message found', null, /valid:/);
  });
});
