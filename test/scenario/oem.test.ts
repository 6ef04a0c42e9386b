/**
 * CCSDS OEM reader (src/scenario/oem.ts) against the CCSDS 502.0-B-3 example messages
 * (test/reference/ccsds-oem/, source note there) and against its own rules.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseOem, parseOemEpochMs } from '../../src/scenario/oem.js';

const ref = (f: string) => readFileSync(new URL(`../reference/ccsds-oem/${f}`, import.meta.url), 'utf8');

/** The examples with their Mars centre / TOD frame / MRT scale replaced, to read their structure. */
function earthified(text: string): string {
  return text
    .replace(/MARS BARYCENTER/g, 'EARTH')
    .replace(/= TOD/g, '= EME2000')
    .replace(/MRT/g, 'UTC')
    .replace(/>J2000</g, '>EME2000<');
}

describe('CCSDS OEM examples (CCSDS 502.0-B-3, via test/reference/ccsds-oem)', () => {
  it('example 1 (KVN 3.0) is refused, one line per segment naming CENTER_NAME and the valid centres', () => {
    const r = parseOem(ref('oem-example-1.txt'), 'ex1.oem');
    expect(r.ephemeris).toBeUndefined();
    expect(r.problems.map((p) => p.path)).toEqual(['segment 1 (line 7): CENTER_NAME', 'segment 2 (line 29): CENTER_NAME']);
    expect(r.problems[0]!.path).toBe('segment 1 (line 7): CENTER_NAME');
    expect(r.problems[0]!.message).toContain('"MARS BARYCENTER" is not supported; valid: EARTH, MOON, SUN, EARTH-MOON BARYCENTER');
  });
  it('example 2 (KVN 2.0) is refused at its TOD frame, and its MRT time scale is refused too', () => {
    const r = parseOem(ref('oem-example-2.txt'), 'ex2.oem');
    expect(r.problems[0]!.path).toBe('segment 1 (line 5): REF_FRAME');
    expect(r.problems[0]!.message).toContain('"TOD" is not supported');
    const mrt = parseOem(ref('oem-example-2.txt').replace(/= TOD/g, '= EME2000'), 'ex2.oem');
    expect(mrt.problems[0]!.path).toBe('segment 1 (line 5): TIME_SYSTEM');
    expect(mrt.problems[0]!.message).toContain('"MRT" is not supported');
  });
  it('example 3 (XML) is refused at its Mars centre', () => {
    const r = parseOem(ref('oem-example-3.xml'), 'ex3.xml');
    expect(r.problems[0]!.path).toBe('segment 1 (<segment> 1): CENTER_NAME');
  });
  it('example 1 read with an Earth centre: two segments, 4 states each, comments and covariance skipped, usable span kept', () => {
    const r = parseOem(earthified(ref('oem-example-1.txt')), 'ex1.oem');
    expect(r.problems).toEqual([]);
    const segs = r.ephemeris!.segments;
    expect(segs).toHaveLength(2);
    expect(segs.map((s) => s.tMs.length)).toEqual([4, 4]);
    expect(segs[0]!.interpolation).toBe('HERMITE');
    expect(segs[0]!.degree).toBe(7);
    expect(segs[0]!.useableStartMs).toBe(Date.UTC(1996, 11, 18, 12, 10, 0, 331));
    expect(segs[1]!.useableStopMs).toBe(Date.UTC(1996, 11, 30, 1, 18, 2, 500));
    // last state line of segment 2, as printed in the example
    expect(Array.from(segs[1]!.states.slice(18, 24))).toEqual([2164.375, 1115.811, -688.131, -3.53328, -2.88452, 0.88535]);
  });
  it('example 2 read: day-of-year epochs (1996-353 = 18 December)', () => {
    const r = parseOem(earthified(ref('oem-example-2.txt')), 'ex2.oem');
    expect(r.problems).toEqual([]);
    expect(r.ephemeris!.segments[0]!.tMs[0]).toBe(Date.UTC(1996, 11, 18, 12, 0, 0, 331));
  });
  it('example 3 read: XML states with accelerations accepted', () => {
    const r = parseOem(earthified(ref('oem-example-3.xml')), 'ex3.xml');
    expect(r.problems).toEqual([]);
    const s = r.ephemeris!.segments[0]!;
    expect(s.tMs.length).toBeGreaterThanOrEqual(3);
    expect(Array.from(s.states.slice(0, 6))).toEqual([2789.6, -280.0, -1746.8, 4.73, -2.5, -1.04]);
  });
});

describe('OEM rules', () => {
  it('epochs: calendar and day-of-year forms agree; 2024-060 is 29 February (leap year)', () => {
    expect(parseOemEpochMs('2024-060T06:00:00.5')).toBe(Date.UTC(2024, 1, 29, 6, 0, 0, 500));
    expect(parseOemEpochMs('2024-02-29T06:00:00.5Z')).toBe(Date.UTC(2024, 1, 29, 6, 0, 0, 500));
    expect(parseOemEpochMs('2023-366T00:00:00')).toBeUndefined();
  });
  it('TAI and GPS epochs become UTC (TAI - UTC = 37 s since 2017, IERS Bulletin C; GPS = TAI - 19 s)', () => {
    const kvn = (system: string) => `CCSDS_OEM_VERS = 2.0
META_START
OBJECT_NAME = TEST
CENTER_NAME = EARTH
REF_FRAME = GCRF
TIME_SYSTEM = ${system}
START_TIME = 2026-03-05T00:00:37
STOP_TIME = 2026-03-05T00:02:37
INTERPOLATION = LAGRANGE
INTERPOLATION_DEGREE = 1
META_STOP
2026-03-05T00:00:37 7000 0 0 0 7.5 0
2026-03-05T00:01:37 7000 450 0 0 7.5 0
2026-03-05T00:02:37 7000 900 0 0 7.5 0
`;
    const tai = parseOem(kvn('TAI'), 'a.oem').ephemeris!.segments[0]!;
    expect(tai.tMs[0]).toBe(Date.UTC(2026, 2, 5, 0, 0, 0));
    const gps = parseOem(kvn('GPS'), 'a.oem').ephemeris!.segments[0]!;
    expect(gps.tMs[0]).toBe(Date.UTC(2026, 2, 5, 0, 0, 19));
  });
  it('a state line that is not six or nine numbers names its line', () => {
    const r = parseOem('CCSDS_OEM_VERS = 2.0\nMETA_START\nCENTER_NAME = EARTH\nMETA_STOP\n2026-01-01T00:00:00 1 2 3 4\n', 'b.oem');
    expect(r.problems[0]!.path).toBe('line 5');
  });
});
