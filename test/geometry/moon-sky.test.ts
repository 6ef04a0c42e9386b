/**
 * Moon and fixed-sky targets against astronomy-engine 2.1.19's own topocentric
 * Equator (of date) + Horizon (no refraction), and the Moon's distance range.
 */
import { Body, Equator, EquatorFromVector, Horizon, Observer, RotateVector, Rotation_EQJ_EQD, Vector, MakeTime } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { makeFixedSkyTarget } from '../../src/geometry/targets/fixedSky.js';
import { makeMoonTarget } from '../../src/geometry/targets/moon.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';

const START_MS = Date.UTC(2026, 2, 2);
const WEEK = { startMs: START_MS, endMs: START_MS + 7 * 86_400_000 };
const sites = [
  { lat: 45.5, lon: 7.3, hKm: 1.2 },
  { lat: -33.0, lon: 150.0, hKm: 0.1 },
  { lat: 5.0, lon: -70.0, hKm: 2.5 },
];

describe('Moon target', () => {
  it('stays between lunar perigee and apogee geocentrically, and within an Earth radius of that topocentrically', () => {
    // Lunar perigee/apogee distances 356,000..407,000 km (common practice); seen from the
    // surface the distance can differ from the geocentric one by up to one Earth radius.
    const target = makeMoonTarget('moon', WEEK);
    const s = new Float64Array(6);
    const look = newLook();
    const site = makeSite('a', 45.5, 7.3, 1.2);
    let minTopo = Infinity;
    let maxTopo = 0;
    for (let t = WEEK.startMs; t <= WEEK.endMs; t += 1_800_000) {
      expect(target.stateEcefAt(t, s)).toBe(true);
      const geoKm = Math.hypot(s[0]!, s[1]!, s[2]!);
      expect(geoKm).toBeGreaterThan(356_000);
      expect(geoKm).toBeLessThan(407_000);
      lookFrom(site, s, look);
      minTopo = Math.min(minTopo, look.rangeKm);
      maxTopo = Math.max(maxTopo, look.rangeKm);
    }
    expect(minTopo).toBeGreaterThan(356_000 - 6_379);
    expect(maxTopo).toBeLessThan(407_000 + 6_379);
  });

  it("gives the elevation and azimuth of astronomy-engine's Equator(of date) + Horizon within 0.05 deg", () => {
    // Tolerance 0.05 deg: our geometric position omits aberration (~20 arcsec = 0.006 deg)
    // and light time (~1.3 s of lunar motion, ~0.0002 deg); the Hermite interpolation of
    // 20-min nodes adds < 1e-6 deg. astronomy-engine's lunar theory itself is ~1 arcmin,
    // but both sides use the same theory, so that does not enter.
    const target = makeMoonTarget('moon', WEEK);
    const s = new Float64Array(6);
    const look = newLook();
    let maxElDiff = 0;
    let maxAzDiff = 0;
    for (const p of sites) {
      const site = makeSite('s', p.lat, p.lon, p.hKm);
      const observer = new Observer(p.lat, p.lon, p.hKm * 1000);
      for (let t = WEEK.startMs + 123_456; t < WEEK.endMs; t += 7_200_000) {
        target.stateEcefAt(t, s);
        lookFrom(site, s, look);
        const date = new Date(t);
        const eq = Equator(Body.Moon, date, observer, true, true);
        const hor = Horizon(date, observer, eq.ra, eq.dec, undefined); // no refraction (astronomy-engine: omit the option)
        maxElDiff = Math.max(maxElDiff, Math.abs(look.elevationDeg - hor.altitude));
        if (hor.altitude < 80) {
          const dAz = Math.abs(((look.azimuthDeg - hor.azimuth + 540) % 360) - 180) * Math.cos((hor.altitude * Math.PI) / 180);
          maxAzDiff = Math.max(maxAzDiff, dAz);
        }
      }
    }
    console.log(`Moon vs astronomy-engine Horizon: max |d el| ${maxElDiff.toExponential(2)} deg, max |d az| cos(el) ${maxAzDiff.toExponential(2)} deg`);
    expect(maxElDiff).toBeLessThan(0.05);
    expect(maxAzDiff).toBeLessThan(0.05);
  });
});

describe('fixed-sky target', () => {
  it("points where astronomy-engine's Horizon puts the same J2000 direction (within 0.01 deg)", () => {
    // Range 1e9 km: parallax < 0.0004 deg. Tolerance 0.01 deg covers precession frozen at
    // mid-week (< 0.0003 deg) and GAST - GMST frozen at mid-week.
    const raDeg = 123.4;
    const decDeg = -21.5;
    const target = makeFixedSkyTarget('deep', raDeg, decDeg, 1e9, WEEK);
    const s = new Float64Array(6);
    const look = newLook();
    let maxDiff = 0;
    for (const p of sites) {
      const site = makeSite('s', p.lat, p.lon, p.hKm);
      const observer = new Observer(p.lat, p.lon, p.hKm * 1000);
      for (let t = WEEK.startMs; t < WEEK.endMs; t += 3_600_000 * 5) {
        target.stateEcefAt(t, s);
        lookFrom(site, s, look);
        const time = MakeTime(new Date(t));
        const d = (Math.PI / 180);
        const eqj = new Vector(Math.cos(decDeg * d) * Math.cos(raDeg * d), Math.cos(decDeg * d) * Math.sin(raDeg * d), Math.sin(decDeg * d), time);
        const eqd = EquatorFromVector(RotateVector(Rotation_EQJ_EQD(time), eqj));
        const hor = Horizon(time, observer, eqd.ra, eqd.dec, undefined); // no refraction (astronomy-engine: omit the option)
        maxDiff = Math.max(maxDiff, Math.abs(look.elevationDeg - hor.altitude));
      }
    }
    console.log(`fixed sky vs astronomy-engine Horizon: max |d el| ${maxDiff.toFixed(5)} deg`);
    expect(maxDiff).toBeLessThan(0.01);
  });
});
