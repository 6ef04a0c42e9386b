/**
 * OMM vs TLE equivalence: the same element set (VANGUARD 1, NORAD 5, epoch
 * 2020-10-13T04:52:48.472320) as CCSDS OMM XML (test/reference/sgp4/omm-samples/
 * sample_omm.xml, from python-sgp4, see README there) and as the TLE quoted in that
 * README. Reference README: satellite.js json2satrec vs twoline2satrec agree within ~3 m
 * over 7 days (json2satrec cuts the epoch to whole ms), so tolerance 0.01 km.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { makeSgp4Target, normaliseOmmEpoch } from '../../src/geometry/targets/sgp4.js';
import type { ElementSet, OmmElements } from '../../src/scenario/types.js';
import { elementSetFromTle } from '../fixtures/orbits.js';

const xmlPath = fileURLToPath(new URL('../reference/sgp4/omm-samples/sample_omm.xml', import.meta.url));
const TLE = {
  line1: '1 00005U 58002B   20287.20333880 -.00000016  00000-0 -22483-4 0  9998',
  line2: '2 00005  34.2443 225.5254 1845686 162.2516 205.2356 10.84869164218149',
};
const TOL_KM = 0.01;

function tag(xml: string, name: string): string {
  const m = new RegExp(`<${name}>([^<]*)</${name}>`).exec(xml);
  if (!m) throw new Error(`no <${name}> in sample_omm.xml`);
  return m[1]!;
}

function ommFromXml(xml: string): OmmElements {
  const num = (n: string): number => Number(tag(xml, n));
  return {
    objectName: tag(xml, 'OBJECT_NAME'),
    objectId: tag(xml, 'OBJECT_ID'),
    epochIso: tag(xml, 'EPOCH'),
    meanMotionRevPerDay: num('MEAN_MOTION'),
    eccentricity: num('ECCENTRICITY'),
    inclinationDeg: num('INCLINATION'),
    raanDeg: num('RA_OF_ASC_NODE'),
    argPericenterDeg: num('ARG_OF_PERICENTER'),
    meanAnomalyDeg: num('MEAN_ANOMALY'),
    bstarPerEarthRadii: num('BSTAR'),
    meanMotionDotRevPerDay2: num('MEAN_MOTION_DOT'),
    meanMotionDdotRevPerDay3: num('MEAN_MOTION_DDOT'),
    noradCatId: num('NORAD_CAT_ID'),
    elementSetNo: num('ELEMENT_SET_NO'),
    revAtEpoch: num('REV_AT_EPOCH'),
    classification: tag(xml, 'CLASSIFICATION_TYPE'),
    ephemerisType: num('EPHEMERIS_TYPE'),
  };
}

// 2020-10-13T04:52:48.472320 UTC, by calendar arithmetic (not through the code under test)
const EPOCH_MS = Date.UTC(2020, 9, 13, 4, 52, 48) + 472.32;

describe('OMM (CCSDS 502.0-B) vs TLE, same element set', () => {
  it('normalises calendar, day-of-year and offset epochs to the same UTC instant', () => {
    // 2020 is a leap year: day 287 = 13 October (31+29+31+30+31+30+31+31+30 = 274 days before it)
    for (const s of ['2020-10-13T04:52:48.472320', '2020-10-13T04:52:48.472320Z', '2020-287T04:52:48.47232', '2020-10-13T06:52:48.472320+02:00', '2020-10-12T23:52:48.472320-05:00']) {
      const n = normaliseOmmEpoch(s);
      expect(n?.iso, s).toBe('2020-10-13T04:52:48.472320');
      expect(Math.abs(n!.epochMs - EPOCH_MS), s).toBeLessThan(1e-3);
    }
    expect(normaliseOmmEpoch('13/10/2020 04:52')).toBeUndefined();
  });

  it('XML OMM and TLE give the same ECEF track within 0.01 km over 7 days', () => {
    const omm = ommFromXml(readFileSync(xmlPath, 'utf8'));
    const ommSet: ElementSet = { origin: 'sample_omm.xml', catalogNumber: '5', epochMs: EPOCH_MS, omm };
    const tleSet = elementSetFromTle(TLE, 'reference README TLE');
    expect(Math.abs(tleSet.epochMs - EPOCH_MS)).toBeLessThan(1); // TLE day 287.20333880 is the same instant
    const a = makeSgp4Target('omm', [ommSet]);
    const b = makeSgp4Target('tle', [tleSet]);
    const sa = new Float64Array(6);
    const sb = new Float64Array(6);
    let maxKm = 0;
    for (let tMs = EPOCH_MS; tMs <= EPOCH_MS + 7 * 86_400_000; tMs += 600_000) {
      expect(a.stateEcefAt(tMs, sa)).toBe(true);
      expect(b.stateEcefAt(tMs, sb)).toBe(true);
      maxKm = Math.max(maxKm, Math.hypot(sa[0]! - sb[0]!, sa[1]! - sb[1]!, sa[2]! - sb[2]!));
    }
    console.log(`OMM vs TLE: max position difference over 7 days ${(maxKm * 1000).toFixed(3)} m`);
    expect(maxKm).toBeLessThan(TOL_KM);
  });
});
