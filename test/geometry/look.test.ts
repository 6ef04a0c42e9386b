/**
 * Earth, frames, topocentric look angles and masks against textbook geometry.
 */
import { describe, expect, it } from 'vitest';
import { ModelRangeError } from '../../src/errors.js';
import { makeSite, WGS84_EARTH_ROTATION_RAD_S, WGS84_EQUATORIAL_RADIUS_KM } from '../../src/geometry/earth.js';
import { gmstRadAt, temeToEcef } from '../../src/geometry/frames.js';
import { maskElevationDeg, prepareMask } from '../../src/geometry/mask.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { FIXTURE_EPOCH_MS } from '../fixtures/orbits.js';

const DEG = Math.PI / 180;
const GEO_RADIUS_KM = 42164; // geostationary orbit radius (common practice)

/** Exact circular inertial (TEME-like) orbit, 6900 km radius, 50 deg inclination, to ECEF. */
function circularEcef(tMs: number, out: Float64Array, exactAngle = false): Float64Array {
  const rKm = 6900;
  const nRadS = Math.sqrt(398600.4418 / rKm ** 3);
  const u = nRadS * ((tMs - FIXTURE_EPOCH_MS) / 1000);
  const ci = Math.cos(50 * DEG);
  const si = Math.sin(50 * DEG);
  const r = [rKm * Math.cos(u), rKm * Math.sin(u) * ci, rKm * Math.sin(u) * si];
  const v = [-rKm * nRadS * Math.sin(u), rKm * nRadS * Math.cos(u) * ci, rKm * nRadS * Math.cos(u) * si];
  const angleRad = exactAngle ? WGS84_EARTH_ROTATION_RAD_S * ((tMs - FIXTURE_EPOCH_MS) / 1000) : gmstRadAt(tMs);
  temeToEcef(r, v, angleRad, out);
  return out;
}

function geoState(lonDeg: number): Float64Array {
  return Float64Array.of(GEO_RADIUS_KM * Math.cos(lonDeg * DEG), GEO_RADIUS_KM * Math.sin(lonDeg * DEG), 0, 0, 0, 0);
}

describe('earth (NIMA TR8350.2 WGS-84)', () => {
  it('puts an equatorial sea-level site at the equatorial radius and a polar one at the polar radius', () => {
    const eq = makeSite('x', 0, 0, 0);
    expect(eq.ecefKm[0]).toBeCloseTo(6378.137, 9); // Table 3.1: a = 6378137 m
    const pole = makeSite('p', 90, 0, 0);
    expect(pole.ecefKm[2]).toBeCloseTo(6356.7523142, 6); // Table 3.3: b = 6356752.3142 m
  });
  it('rejects an impossible latitude with ModelRangeError', () => {
    expect(() => makeSite('bad', 91, 0, 0)).toThrow(ModelRangeError);
  });
});

describe('frames: GMST', () => {
  it('gives GMST 18h 41m 50.54841s at 2000-01-01T12:00 UT1 (IAU 1982 constant term, from memory)', () => {
    const expectedRad = ((18 + 41 / 60 + 50.54841 / 3600) * 15 * Math.PI) / 180;
    expect(Math.abs(gmstRadAt(Date.UTC(2000, 0, 1, 12)) - expectedRad)).toBeLessThan(1e-9);
  });
});

describe('topocentric look angles', () => {
  const look = newLook();

  it('sees a geostationary satellite at the zenith and 35,786 km from the equator below it (common practice)', () => {
    lookFrom(makeSite('eq', 0, -20, 0), geoState(-20), look);
    expect(look.elevationDeg).toBeCloseTo(90, 9);
    // 42164 - 6378.137 = 35785.863 km; 35,786 km is the usual rounded altitude
    expect(Math.abs(look.rangeKm - 35_786)).toBeLessThan(0.5);
    expect(look.rangeRateKmS).toBe(0);
  });

  it('matches the spherical-Earth GEO elevation tan(el) = (cos phi - Re/r) / sin phi (textbook geometry, e.g. Pratt/Bostian/Allnutt, from memory)', () => {
    // Tolerance 0.25 deg: WGS-84 up is the geodetic normal, the formula uses the geocentric
    // direction; they differ by up to f*sin(2 phi) = 0.19 deg (45 deg), plus a tiny radius effect.
    let maxDiff = 0;
    for (const latDeg of [5, 15, 30, 45, 60, 75]) {
      lookFrom(makeSite('s', latDeg, 10, 0), geoState(10), look);
      const phi = latDeg * DEG;
      const sphericalDeg = Math.atan((Math.cos(phi) - WGS84_EQUATORIAL_RADIUS_KM / GEO_RADIUS_KM) / Math.sin(phi)) / DEG;
      maxDiff = Math.max(maxDiff, Math.abs(look.elevationDeg - sphericalDeg));
      expect(Math.abs(look.elevationDeg - sphericalDeg), `lat ${latDeg}`).toBeLessThan(0.25);
      expect(look.azimuthDeg).toBeCloseTo(180, 9); // due south on the same meridian
    }
    console.log(`GEO elevation vs spherical formula: max difference ${maxDiff.toFixed(4)} deg`);
  });

  // Finite-difference tolerances below: truncation dt^2/6 |x'''| ~ 6e-6 km/s at dt = 2 s for
  // this LEO, plus the Julian-date input of satellite.js gstime, a double near 2.46e6 days
  // whose resolution is 40 us: ~2 cm of position jitter, < 1e-5 km/s over 2 dt = 4 s.
  const FD_TOL_KM_S = 2e-5;
  it('reports a range rate equal to a central finite difference of range (tolerance 1e-6 km/s)', () => {
    // Earth-fixed state from an exact rotation angle (no GMST jitter), dt = 0.02 s:
    // truncation dt^2/6 |range'''| < 1e-7 km/s even at closest approach.
    const site = makeSite('mid', 45.5, 7.3, 1.2);
    const s = new Float64Array(6);
    const a = newLook();
    let maxErr = 0;
    for (let k = 0; k < 2000; k++) {
      const t = FIXTURE_EPOCH_MS + k * 31_000;
      const dtMs = 20;
      const rMinus = lookFrom(site, circularEcef(t - dtMs, s, true), a).rangeKm;
      const rPlus = lookFrom(site, circularEcef(t + dtMs, s, true), a).rangeKm;
      lookFrom(site, circularEcef(t, s, true), look);
      maxErr = Math.max(maxErr, Math.abs(look.rangeRateKmS - (rPlus - rMinus) / ((2 * dtMs) / 1000)));
    }
    console.log(`range rate vs finite difference: max error ${maxErr.toExponential(2)} km/s`);
    expect(maxErr).toBeLessThan(1e-6);
  });

  it('gives ECEF velocities that are the derivative of ECEF positions (omega x r term; tolerance 2e-5 km/s)', () => {
    // Exact inertial motion in, so any mismatch is the frame transform's (WGS-84 omega vs
    // d(GMST)/dt: ~9e-12 rad/s x 7000 km = 6e-8 km/s).
    const s0 = new Float64Array(6);
    const sm = new Float64Array(6);
    const sp = new Float64Array(6);
    let maxErr = 0;
    for (let k = 0; k < 200; k++) {
      const t = FIXTURE_EPOCH_MS + k * 123_457;
      circularEcef(t, s0);
      circularEcef(t - 2000, sm);
      circularEcef(t + 2000, sp);
      for (let j = 0; j < 3; j++) maxErr = Math.max(maxErr, Math.abs(s0[3 + j]! - (sp[j]! - sm[j]!) / 4));
    }
    // Without the omega x r term the error would be ~0.5 km/s.
    console.log(`ECEF velocity vs finite difference: max error ${maxErr.toExponential(2)} km/s`);
    expect(maxErr).toBeLessThan(FD_TOL_KM_S);
  });
});

describe('horizon mask (piecewise-linear in azimuth, wrapping at 360)', () => {
  it('interpolates linearly and wraps 350 -> 10 through north', () => {
    const m = prepareMask({ kind: 'profile', azimuthDeg: [90, 10, 350], elevationDeg: [10, 5, 3] });
    expect(maskElevationDeg(m, 50)).toBeCloseTo(7.5, 12); // halfway 10..90: 5 -> 10
    expect(maskElevationDeg(m, 0)).toBeCloseTo(4, 12); // halfway 350..370: 3 -> 5
    expect(maskElevationDeg(m, 355)).toBeCloseTo(3.5, 12);
    expect(maskElevationDeg(m, 360)).toBeCloseTo(4, 12);
    expect(maskElevationDeg(m, -10)).toBeCloseTo(3, 12);
    expect(maskElevationDeg(m, 220)).toBeCloseTo(10 + (130 / 260) * (3 - 10), 12);
  });
  it('keeps a constant mask constant and rejects bad profiles', () => {
    expect(maskElevationDeg(prepareMask({ kind: 'constant', elevationDeg: 7 }), 123)).toBe(7);
    expect(() => prepareMask({ kind: 'profile', azimuthDeg: [0, 90], elevationDeg: [1] })).toThrow(ModelRangeError);
    expect(() => prepareMask({ kind: 'profile', azimuthDeg: [0, 360], elevationDeg: [1, 2] })).toThrow(ModelRangeError);
    expect(() => prepareMask({ kind: 'constant', elevationDeg: 95 })).toThrow(ModelRangeError);
  });
});
