import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { twoline2satrec } from 'satellite.js';
import type { Problem } from '../../src/errors.js';
import { parseTleText, tleChecksum, tleToOmm, withChecksum } from '../../src/scenario/tle.js';

/**
 * Reference: test/reference/sgp4/SGP4-VER.TLE, the verification element sets of
 * Vallado, Crawford, Hujsak & Kelso, "Revisiting Spacetrack Report #3", AIAA
 * 2006-6753 (copied from python-sgp4, see test/reference/sgp4/README.md). The
 * README states: 33 sets, CRLF line endings, verification times after column 69,
 * and exactly 5 lines failing the mod-10 checksum (both lines of 33333, line 1 of
 * 33334, both lines of 33335).
 * Second, independent reader: satellite.js 7.1.0 twoline2satrec (column slicing
 * with parseFloat, no validation) on the same lines.
 * Bad-input tests use invented element sets (catalogue 90001, "PBX-DEMO"), not a
 * real satellite's elements.
 */
const verText = readFileSync(
  fileURLToPath(new URL('../reference/sgp4/SGP4-VER.TLE', import.meta.url)),
  'utf8',
);
const FILE = 'ephemerides/demo.json';
const PATH = 'spacecraft[2].orbit.tle';

/** The 33 sets of the verification file, read independently of the parser: pair lines "1 " and "2 ". */
function verificationPairs(): { l1: string; l2: string }[] {
  const lines = verText.split('\r\n').filter((l) => l.startsWith('1 ') || l.startsWith('2 '));
  const pairs: { l1: string; l2: string }[] = [];
  for (let i = 0; i < lines.length; i += 2) pairs.push({ l1: lines[i] ?? '', l2: lines[i + 1] ?? '' });
  return pairs;
}

/** Invented set (not a real satellite): columns built field by field, checksums added. */
const L1_BODY =
  '1 ' + '90001' + 'U' + ' ' + '31042A  ' + ' ' + '31' + '072.50000000' + ' ' + ' .00001234' + ' ' +
  ' 00000-0' + ' ' + ' 56789-4' + ' ' + '0' + ' ' + ' 999';
const L2_BODY =
  '2 ' + '90001' + ' ' + ' 97.4000' + ' ' + '123.4567' + ' ' + '0012345' + ' ' + ' 89.1234' + ' ' +
  '271.0000' + ' ' + '15.20000000' + '12345';
const GOOD1 = withChecksum(L1_BODY);
const GOOD2 = withChecksum(L2_BODY);

/** Replace columns from..to (1-based, inclusive) and recompute the checksum. */
function edit(body: string, from: number, to: number, text: string): string {
  expect(text.length).toBe(to - from + 1);
  return withChecksum(body.slice(0, from - 1) + text + body.slice(to));
}

/** Every problem names the file and field path, the line and set, the value and what is valid. */
function expectProblem(problems: Problem[], where: string, value: string, valid: RegExp): void {
  const hit = problems.find((p) => p.message.includes(where) && p.message.includes(JSON.stringify(value)));
  expect(hit, `no problem at ${where} naming ${value}: ${JSON.stringify(problems)}`).toBeDefined();
  expect(hit?.file).toBe(FILE);
  expect(hit?.path).toBe(PATH);
  expect(hit?.message).toMatch(/valid: /);
  expect(hit?.message).toMatch(valid);
}

describe('SGP4-VER.TLE (Vallado et al. 2006 verification set)', () => {
  it('has the layout the README states (33 sets, CRLF) - guards the copy', () => {
    expect(verText.includes('\r\n')).toBe(true);
    expect(verificationPairs()).toHaveLength(33);
  });

  it('with checksums on: 30 sets and exactly the 5 checksum lines the README names', () => {
    const { sets, problems } = parseTleText(verText, FILE, PATH);
    expect(problems).toHaveLength(5);
    for (const p of problems) {
      expect(p.file).toBe(FILE);
      expect(p.path).toBe(PATH);
      expect(p.message).toMatch(/checksum \(column 69\) is \d, expected \d; valid: the mod-10 sum of columns 1-68/);
    }
    const flagged = problems.map((p) => /line (\d) of set \d+ \(catalogue (\d+)/.exec(p.message)?.slice(1, 3).reverse().join(' line '));
    expect(flagged).toEqual(['33333 line 1', '33333 line 2', '33334 line 1', '33335 line 1', '33335 line 2']);
    // Expected/found digits: found is column 69 as printed; expected differs from it.
    for (const p of problems) {
      const m = /is (\d), expected (\d)/.exec(p.message);
      expect(m?.[1]).not.toBe(m?.[2]);
    }
    expect(sets).toHaveLength(30);
    expect(sets.map((s) => s.catalogNumber)).not.toContain('33333');
  });

  it('with checksums off: all 33 sets parse, columns 1-69 kept, no problem', () => {
    const { sets, problems } = parseTleText(verText, FILE, PATH, { checksum: false });
    expect(problems).toEqual([]);
    expect(sets).toHaveLength(33);
    const pairs = verificationPairs();
    sets.forEach((s, i) => {
      expect(s.tle?.line1).toBe(pairs[i]?.l1.slice(0, 69));
      expect(s.tle?.line2).toBe(pairs[i]?.l2.slice(0, 69));
      expect(s.tle?.line2).toHaveLength(69); // the start/stop/step text after column 69 is dropped
      expect(s.origin).toBe(`${FILE}: ${PATH} set ${i + 1}`);
    });
    expect(sets[32]?.catalogNumber).toBe('20413');
  });

  it('tleChecksum agrees with column 69 on the 61 lines published with good checksums', () => {
    let agree = 0;
    for (const { l1, l2 } of verificationPairs()) {
      for (const l of [l1, l2]) if (tleChecksum(l) === Number(l[68])) agree++;
    }
    expect(agree).toBe(66 - 5);
  });

  it('epochs by hand (day-of-year arithmetic, 1 us tolerance)', () => {
    // Hand computation, stated:
    // 00005 "00179.78495062": 2000 is a leap year, Jan..May = 31+29+31+30+31 = 152 days,
    //   day 179 = 27 June; 0.78495062 d x 86400 = 67819.733568 s = 18:50:19.733568.
    // 88888 "80275.98708465": 1980 leap, Jan..Sep = 274 days, day 275 = 1 October;
    //   0.98708465 d x 86400 = 85284.11376 s = 23:41:24.113760.
    // 20413 "05363.79166667": 2005 common year, day 365 = 31 Dec, so day 363 = 29 December;
    //   0.79166667 d x 86400 = 68400.000288 s = 19:00:00.000288.
    const cases = [
      { cat: '00005', iso: '2000-06-27T18:50:19.733568', ms: Date.UTC(2000, 5, 27, 18, 50, 19) + 733.568 },
      { cat: '88888', iso: '1980-10-01T23:41:24.113760', ms: Date.UTC(1980, 9, 1, 23, 41, 24) + 113.76 },
      { cat: '20413', iso: '2005-12-29T19:00:00.000288', ms: Date.UTC(2005, 11, 29, 19, 0, 0) + 0.288 },
    ];
    const { sets } = parseTleText(verText, FILE, PATH, { checksum: false });
    const oneMicrosecondMs = 1e-3;
    for (const c of cases) {
      const set = sets.find((s) => s.catalogNumber === c.cat);
      expect(set).toBeDefined();
      expect(Math.abs((set?.epochMs ?? 0) - c.ms)).toBeLessThan(oneMicrosecondMs);
      expect(tleToOmm(set?.tle?.line1 ?? '', set?.tle?.line2 ?? '', { checksum: false }).epochIso).toBe(c.iso);
    }
  });

  it('values agree with satellite.js twoline2satrec on all 33 sets', () => {
    // satellite.js 7.1.0 reads the same columns with parseFloat and converts: angles to rad,
    // mean motion to rad/min (xpdotp = 1440/2pi), ndot/(xpdotp*1440), nddot/(xpdotp*1440^2);
    // its epoch is a Julian date (one double: resolution about 4e-5 s near JD 2.45e6).
    const xpdotp = 1440 / (2 * Math.PI);
    const rad = Math.PI / 180;
    let maxEpochErrMs = 0;
    const { sets } = parseTleText(verText, FILE, PATH, { checksum: false });
    for (const s of sets) {
      const l1 = s.tle?.line1 ?? '';
      const l2 = s.tle?.line2 ?? '';
      const o = tleToOmm(l1, l2, { checksum: false });
      const r = twoline2satrec(l1, l2);
      const rel = 1e-12;
      expect(o.inclinationDeg * rad).toBeCloseTo(r.inclo, 12);
      expect(o.raanDeg * rad).toBeCloseTo(r.nodeo, 12);
      expect(o.argPericenterDeg * rad).toBeCloseTo(r.argpo, 12);
      expect(o.meanAnomalyDeg * rad).toBeCloseTo(r.mo, 12);
      expect(o.eccentricity).toBe(r.ecco);
      // nokozai: the mean motion as read (sgp4init replaces `no` with the un-Kozai'd value).
      expect(Math.abs(o.meanMotionRevPerDay / xpdotp - r.nokozai) <= rel * Math.abs(r.nokozai)).toBe(true);
      expect(Math.abs(o.bstarPerEarthRadii - r.bstar) <= rel * Math.abs(r.bstar)).toBe(true);
      expect(Math.abs(o.meanMotionDotRevPerDay2 / (xpdotp * 1440) - r.ndot) <= rel * Math.abs(r.ndot)).toBe(true);
      const nddot = o.meanMotionDdotRevPerDay3 / (xpdotp * 1440 * 1440);
      expect(Math.abs(nddot - r.nddot) <= rel * Math.abs(r.nddot)).toBe(true);
      const jd = r.jdsatepoch;
      const satJsMs = (jd - 2440587.5) * 86_400_000;
      maxEpochErrMs = Math.max(maxEpochErrMs, Math.abs(satJsMs - s.epochMs));
    }
    // Tolerance 0.1 ms: above the Julian-date double's 0.04 ms resolution.
    console.log(`TLE epoch vs satellite.js Julian date: max difference ${maxEpochErrMs.toExponential(2)} ms over 33 sets`);
    expect(maxEpochErrMs).toBeLessThan(0.1);
  });
});

describe('parseTleText accepts the usual text shapes', () => {
  it('3-line and 2-line sets mixed, CRLF and LF, blank lines, trailing blanks, "0 " name prefix', () => {
    const second1 = edit(L1_BODY, 3, 7, '90002');
    const second2 = edit(L2_BODY, 3, 7, '90002');
    const text = `PBX-DEMO 1   \r\n${GOOD1}  \r\n${GOOD2}\r\n\r\n0 PBX-DEMO 2\n${second1}\n${second2}\n\n${GOOD1}\n${GOOD2}\n`;
    const { sets, problems } = parseTleText(text, FILE, PATH);
    expect(problems).toEqual([]);
    expect(sets.map((s) => s.origin)).toEqual([
      `${FILE}: ${PATH} set 1 (PBX-DEMO 1)`,
      `${FILE}: ${PATH} set 2 (PBX-DEMO 2)`,
      `${FILE}: ${PATH} set 3`,
    ]);
    expect(sets.map((s) => s.catalogNumber)).toEqual(['90001', '90002', '90001']);
    // Invented epoch "31072.50000000": 2031 is common; day 72 = 13 March (31+28 = 59, 72-59 = 13), 12:00.
    expect(sets[0]?.epochMs).toBe(Date.UTC(2031, 2, 13, 12));
  });

  it('one set gets no set number in its origin', () => {
    const { sets } = parseTleText(`${GOOD1}\n${GOOD2}`, FILE, PATH);
    expect(sets[0]?.origin).toBe(`${FILE}: ${PATH}`);
  });

  it('Alpha-5 catalogue numbers are accepted and compared between lines', () => {
    const a1 = edit(L1_BODY, 3, 7, 'A0001');
    const a2 = edit(L2_BODY, 3, 7, 'A0001');
    const ok = parseTleText(`${a1}\n${a2}`, FILE, PATH);
    expect(ok.problems).toEqual([]);
    expect(ok.sets[0]?.catalogNumber).toBe('A0001');
    // A0001 is 100001 in Alpha-5; 10001 on line 2 is another object.
    const bad = parseTleText(`${a1}\n${edit(L2_BODY, 3, 7, '10001')}`, FILE, PATH);
    expectProblem(bad.problems, 'line 2 of set 1', '10001', /same catalogue number/);
  });

  it('day 366 exists in a leap year only', () => {
    // 2032 is a leap year: day 366.5 = 31 December 12:00.
    const leap = parseTleText(`${edit(L1_BODY, 19, 32, '32366.50000000')}\n${GOOD2}`, FILE, PATH);
    expect(leap.problems).toEqual([]);
    expect(leap.sets[0]?.epochMs).toBe(Date.UTC(2032, 11, 31, 12));
    const common = parseTleText(`${edit(L1_BODY, 19, 32, '31366.50000000')}\n${GOOD2}`, FILE, PATH);
    expect(common.sets).toEqual([]);
    expect(common.problems[0]?.message).toMatch(/line 1 of set 1 .*day 366 of 2031; valid: .*2031 has 365 days/);
  });

  it('tleToOmm turns the international designator into OBJECT_ID', () => {
    expect(tleToOmm(GOOD1, GOOD2, { objectName: 'PBX-DEMO 1' })).toMatchObject({
      objectName: 'PBX-DEMO 1',
      objectId: '2031-042A',
      noradCatId: 90001,
      elementSetNo: 999,
      revAtEpoch: 12345,
      eccentricity: 0.0012345,
      bstarPerEarthRadii: 0.56789e-4,
      epochIso: '2031-03-13T12:00:00.000000',
    });
    expect(() => tleToOmm(GOOD1, edit(L2_BODY, 27, 33, '12.4567'))).toThrow(RangeError);
  });

  it('withChecksum fills column 69 and rejects short lines', () => {
    expect(GOOD1).toHaveLength(69);
    expect(Number(GOOD1[68])).toBe(tleChecksum(GOOD1));
    expect(() => withChecksum('1 90001U')).toThrow(RangeError);
  });
});

describe('parseTleText rejects bad input with file, path, value and what is valid (invented sets)', () => {
  const parse = (l1: string, l2: string) => parseTleText(`${l1}\n${l2}`, FILE, PATH);

  it('bad checksum states expected and found', () => {
    const found = (tleChecksum(GOOD2) + 3) % 10;
    const { sets, problems } = parse(GOOD1, GOOD2.slice(0, 68) + String(found));
    expect(sets).toEqual([]);
    expect(problems).toHaveLength(1);
    expect(problems[0]?.message).toContain(`line 2 of set 1 (catalogue 90001, line 2 of the text): checksum (column 69) is ${found}, expected ${tleChecksum(GOOD2)}; valid: the mod-10 sum of columns 1-68`);
    expect(problems[0]?.file).toBe(FILE);
    expect(problems[0]?.path).toBe(PATH);
  });

  it('wrong characters in fixed columns', () => {
    const r1 = parse(GOOD1, edit(L2_BODY, 9, 16, ' 97.4O00'));
    expectProblem(r1.problems, 'line 2 of set 1', ' 97.4O00', /columns 9-16 \(inclination\).*ddd\.dddd/);
    // A field shifted one column right: the separator and the field both fail.
    const shifted = parse(GOOD1, withChecksum(L2_BODY.slice(0, 8) + ' ' + L2_BODY.slice(8, 67)));
    expect(shifted.sets).toEqual([]);
    expectProblem(shifted.problems, 'line 2 of set 1', '  97.400', /columns 9-16 \(inclination\)/);
    const r3 = parse(edit(L1_BODY, 54, 61, ' 56789x4'), GOOD2);
    expectProblem(r3.problems, 'line 1 of set 1', ' 56789x4', /columns 54-61 \(BSTAR drag term\).*implied leading decimal point/);
    const r4 = parse(edit(L1_BODY, 34, 43, ' 0.0001234'), GOOD2);
    expectProblem(r4.problems, 'line 1 of set 1', ' 0.0001234', /first derivative of mean motion/);
    const r5 = parse(edit(L1_BODY, 8, 8, 'X'), GOOD2);
    expectProblem(r5.problems, 'line 1 of set 1', 'X', /column 8 \(classification\).*U, C or S/);
  });

  it('line numbers in column 1 and line length', () => {
    const r = parse(GOOD1, withChecksum('3' + L2_BODY.slice(1)));
    expectProblem(r.problems, 'line 2 of set 1', '3', /column 1 \(line number\).*valid: '2'/);
    const s = parse(GOOD1, GOOD2.slice(0, 60));
    expectProblem(s.problems, 'line 2 of set 1', GOOD2.slice(0, 60), /60 characters long; valid: at least 69/);
  });

  it('line 1 and line 2 catalogue numbers must match', () => {
    const { sets, problems } = parse(GOOD1, edit(L2_BODY, 3, 7, '90002'));
    expect(sets).toEqual([]);
    expectProblem(problems, 'line 2 of set 1', '90002', /line 1 has "90001"; valid: the same catalogue number on both lines/);
  });

  it('eccentricity field must be 7 digits (so e < 1)', () => {
    const r = parse(GOOD1, edit(L2_BODY, 27, 33, '1.00000'));
    expectProblem(r.problems, 'line 2 of set 1', '1.00000', /columns 27-33 \(eccentricity\).*implied leading decimal point/);
  });

  it('mean motion must be > 0 rev/day', () => {
    const r = parse(GOOD1, edit(L2_BODY, 53, 63, ' 0.00000000'));
    expectProblem(r.problems, 'line 2 of set 1', ' 0.00000000', /mean motion.*valid: greater than 0 rev\/day/);
  });

  it('angles in range: inclination 0..180, RAAN/argument of perigee/mean anomaly 0..360', () => {
    const r = parse(GOOD1, edit(edit(L2_BODY, 9, 16, '180.0001').slice(0, 68), 18, 25, '360.5000'));
    expectProblem(r.problems, 'line 2 of set 1', '180.0001', /inclination.*valid: 0 to 180 deg/);
    expectProblem(r.problems, 'line 2 of set 1', '360.5000', /ascending node.*valid: 0 to 360 deg/);
    const m = parse(GOOD1, edit(L2_BODY, 44, 51, '400.0000'));
    expectProblem(m.problems, 'line 2 of set 1', '400.0000', /mean anomaly.*valid: 0 to 360 deg/);
  });

  it('SGP4-XP ephemeris type 4 is refused', () => {
    const r = parse(edit(L1_BODY, 63, 63, '4'), GOOD2);
    expect(r.sets).toEqual([]);
    expect(r.problems[0]?.message).toMatch(/column 63 \(ephemeris type\) is 4; .*SGP4-XP/);
  });

  it('missing line 2, missing line 1 after a name, empty text', () => {
    const a = parseTleText(`PBX-DEMO 1\n${GOOD1}\nPBX-DEMO 2\n${GOOD1}\n${GOOD2}`, FILE, PATH);
    expect(a.sets).toHaveLength(1);
    expect(a.problems[0]?.message).toMatch(/set 1 "PBX-DEMO 1": line 2 missing after line 1 .*found "PBX-DEMO 2"/);
    const b = parseTleText(`PBX-DEMO 1\n`, FILE, PATH);
    expect(b.problems[0]?.message).toMatch(/line 1 missing/);
    const c = parseTleText('   \n\n', FILE, PATH);
    expect(c.problems[0]?.message).toMatch(/no element set found; valid:/);
  });
});
