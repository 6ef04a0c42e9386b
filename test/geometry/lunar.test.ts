/**
 * Lunar surface sites, lunar orbiters and occultation by the Moon
 * (src/geometry/targets/lunar.ts, lunar-orbit.ts, src/geometry/occultation.ts).
 * Independent references: astronomy-engine 2.1.19 `Libration` (sub-Earth selenographic
 * point, Meeus' optical libration) and `GeoMoonState` (through the Moon target); optical libration within about
 * +-6.9 deg latitude and +-7.9 deg longitude (common practice); Earth-Moon one-way light
 * time 1.2-1.4 s (common practice); the hidden arc of a circular orbit seen edge-on from
 * afar, 2 arcsin(R / r) (plane geometry).
 */
import { Libration } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { moonSightMarginDeg } from '../../src/geometry/occultation.js';
import { findPasses } from '../../src/geometry/passes.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { LunarAxes, makeLunarSiteTarget } from '../../src/geometry/targets/lunar.js';
import { makeLunarOrbitTarget } from '../../src/geometry/targets/lunar-orbit.js';
import { makeMoonTarget } from '../../src/geometry/targets/moon.js';
import { MOON_MEAN_RADIUS_KM, MoonEphemeris } from '../../src/geometry/targets/moon-ephemeris.js';
import { astroDays } from '../../src/geometry/targets/ofDate.js';

const DEG = Math.PI / 180;
const month = { startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 2, 31) };
const station = makeSite('TST', 37.4, -3.2, 1.15); // invented site

describe('the Moon\'s orientation (IAU WGCCRE 2015 via RotationAxis) against astronomy-engine Libration', () => {
  it('the sub-Earth selenographic point agrees within 0.05 deg over a month; its latitude stays within +-6.9 deg', () => {
    const axes = new LunarAxes(month.startMs, month.endMs);
    const moon = new MoonEphemeris(month.startMs, month.endMs);
    const ax = new Float64Array(9);
    const m = new Float64Array(6);
    let worst = 0;
    let latMin = 90;
    let latMax = -90;
    for (let h = 0; h < 30 * 24; h += 6) {
      const t = month.startMs + h * 3_600_000;
      axes.at(t, ax);
      moon.stateAt(t, m);
      const r = Math.hypot(m[0]!, m[1]!, m[2]!);
      const u = [-m[0]! / r, -m[1]! / r, -m[2]! / r];
      const b = [0, 1, 2].map((row) => ax[3 * row]! * u[0]! + ax[3 * row + 1]! * u[1]! + ax[3 * row + 2]! * u[2]!);
      const lat = Math.asin(b[2]!) / DEG;
      const lon = Math.atan2(b[1]!, b[0]!) / DEG;
      const lib = Libration(astroDays(t));
      let dLon = lon - lib.elon;
      while (dLon > 180) dLon -= 360;
      while (dLon < -180) dLon += 360;
      worst = Math.max(worst, Math.abs(lat - lib.elat), Math.abs(dLon));
      latMin = Math.min(latMin, lat);
      latMax = Math.max(latMax, lat);
    }
    console.log(`sub-Earth point vs Libration: worst ${worst.toFixed(4)} deg; latitude ${latMin.toFixed(2)}..${latMax.toFixed(2)} deg`);
    expect(worst).toBeLessThan(0.05);
    expect(latMin).toBeGreaterThan(-7.0);
    expect(latMax).toBeLessThan(7.0);
    expect(latMax - latMin).toBeGreaterThan(10); // the month's swing in latitude
  });

  it('from a near-pole site the Earth\'s elevation swings through the libration range over a month', () => {
    const target = makeLunarSiteTarget('POLE', { latitudeDeg: -89.5, longitudeDeg: 0, heightKm: 0, mask: { kind: 'constant', elevationDeg: 0 } }, month);
    const s = new Float64Array(6);
    let lo = 90;
    let hi = -90;
    for (let h = 0; h < 30 * 24; h += 3) {
      target.stateEcefAt(month.startMs + h * 3_600_000, s);
      const el = target.skyOf([0, 0, 0]).elevationDeg; // the Earth's centre
      lo = Math.min(lo, el);
      hi = Math.max(hi, el);
    }
    console.log(`Earth elevation from (-89.5, 0): ${lo.toFixed(2)}..${hi.toFixed(2)} deg`);
    // 0.5 deg from the pole plus the latitude libration (+-6.9 deg) and ~1 deg of Earth parallax
    expect(hi - lo).toBeGreaterThan(10);
    expect(hi).toBeLessThan(0.5 + 6.9 + 1.0);
    expect(lo).toBeGreaterThan(-(-0.5 + 6.9 + 1.0) - 0.5);
  });
});

describe('lunar surface site seen from a station', () => {
  const site = { latitudeDeg: -89.2, longitudeDeg: 30, heightKm: 0.5, mask: { kind: 'constant' as const, elevationDeg: 1 } };
  it('site-to-station range differs from the Moon-centre range by at most one lunar radius; one-way light time 1.2-1.4 s', () => {
    const t1 = makeLunarSiteTarget('SITE', site, month);
    const t2 = makeMoonTarget('MOON', month);
    const a = new Float64Array(6);
    const b = new Float64Array(6);
    const look = newLook();
    for (let h = 0; h < 30 * 24; h += 7) {
      const t = month.startMs + h * 3_600_000;
      t1.stateEcefAt(t, a);
      t2.stateEcefAt(t, b);
      const r1 = lookFrom(station, a, look).rangeKm;
      const r2 = lookFrom(station, b, look).rangeKm;
      expect(Math.abs(r1 - r2)).toBeLessThanOrEqual(MOON_MEAN_RADIUS_KM + 0.5 + 2); // + height, + the Moon target's missing light time
      expect(t1.lastLightTimeS).toBeGreaterThan(1.2);
      expect(t1.lastLightTimeS).toBeLessThan(1.4);
    }
  });

  it('windows need the site to see the station above its own mask: the contact search matches a 60 s brute force of both conditions', () => {
    const span = { startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 2, 15) };
    const target = makeLunarSiteTarget('SITE', site, span);
    const mask = prepareMask({ kind: 'constant', elevationDeg: 5 });
    const passes = findPasses(target, [station], [mask], span);
    const s = new Float64Array(6);
    const look = newLook();
    let inside = 0;
    let mismatched = 0;
    for (let t = span.startMs; t < span.endMs; t += 60_000) {
      target.stateEcefAt(t, s);
      const el = lookFrom(station, s, look).elevationDeg;
      const sky = target.skyOf(station.ecefKm);
      const visible = el > 5 && sky.elevationDeg > 1;
      const found = passes.some((p) => t >= p.aosMs && t <= p.losMs);
      if (visible) inside++;
      if (visible !== found) mismatched++;
    }
    console.log(`lunar site: ${passes.length} windows, ${inside} visible minutes, ${mismatched} minutes disagree`);
    expect(inside).toBeGreaterThan(0);
    expect(mismatched).toBeLessThanOrEqual(2 * passes.length); // edges only (60 s grid)
    // some of the station's Moon passes are lost to the site's own mask (libration puts the Earth low)
    const moonOnly = findPasses(makeMoonTarget('MOON', span), [station], [mask], span);
    expect(passes.length).toBeLessThan(moonOnly.length + 1);
  });
});

describe('occultation by the Moon (plane geometry of a 100 km circular orbit)', () => {
  const rOrbit = MOON_MEAN_RADIUS_KM + 100;
  const stationFar = [384_400, 0, 0];
  const moon = [0, 0, 0];
  function hiddenFraction(plane: 'edge' | 'face', brute: boolean): number {
    let hidden = 0;
    const n = 7050; // ~1 s over a 118-minute revolution
    for (let k = 0; k < n; k++) {
      const a = (2 * Math.PI * k) / n;
      const sc = plane === 'edge' ? [rOrbit * Math.cos(a), rOrbit * Math.sin(a), 0] : [0, rOrbit * Math.cos(a), rOrbit * Math.sin(a)];
      if (!brute) {
        if (moonSightMarginDeg(stationFar, sc, moon, MOON_MEAN_RADIUS_KM) <= 0) hidden++;
        continue;
      }
      // brute force: angular separation from the Moon's centre below its angular radius, craft beyond the Moon's centre plane
      const d = sc.map((v, i) => v - stationFar[i]!);
      const m = moon.map((v, i) => v - stationFar[i]!);
      const dn = Math.hypot(...d);
      const mn = Math.hypot(...m);
      const sep = Math.acos((d[0]! * m[0]! + d[1]! * m[1]! + d[2]! * m[2]!) / (dn * mn));
      if (sep < Math.asin(MOON_MEAN_RADIUS_KM / mn) && dn > Math.sqrt(mn * mn - MOON_MEAN_RADIUS_KM ** 2)) hidden++;
    }
    return hidden / n;
  }
  it('seen edge-on, hidden about 39 % of each revolution (2 arcsin(R / r) / 360 deg), as the brute-force angular test', () => {
    const f = hiddenFraction('edge', false);
    const brute = hiddenFraction('edge', true);
    const theory = (2 * Math.asin(MOON_MEAN_RADIUS_KM / rOrbit)) / (2 * Math.PI);
    console.log(`edge-on hidden fraction ${f.toFixed(4)} (brute force ${brute.toFixed(4)}, far-field theory ${theory.toFixed(4)})`);
    expect(Math.abs(f - brute)).toBeLessThan(2 / 7050);
    expect(Math.abs(f - theory)).toBeLessThan(0.005); // the station is 384,400 km away, not at infinity
    expect(f).toBeGreaterThan(0.38);
    expect(f).toBeLessThan(0.40);
  });
  it('seen face-on, never hidden', () => {
    expect(hiddenFraction('face', false)).toBe(0);
    expect(hiddenFraction('face', true)).toBe(0);
  });
});

describe('lunar orbiter (two-body about the Moon)', () => {
  const span = { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 5, 12) };
  const el = { epochMs: span.startMs, semiMajorAxisKm: MOON_MEAN_RADIUS_KM + 100, eccentricity: 0, inclinationDeg: 90, raanDeg: 0, argPericenterDeg: 0, meanAnomalyDeg: 0, grazingMarginKm: 0 };
  it('period 2 pi sqrt(a^3 / GM) and speed 1.63 km/s about the Moon', () => {
    const t = makeLunarOrbitTarget('LO', el, span);
    expect(t.periodS / 60).toBeCloseTo(117.8, 0);
    const s = new Float64Array(6);
    t.orbitStateAt(span.startMs + 1234_000, s);
    expect(Math.hypot(s[0]!, s[1]!, s[2]!)).toBeCloseTo(MOON_MEAN_RADIUS_KM + 100, 6);
    expect(Math.hypot(s[3]!, s[4]!, s[5]!)).toBeCloseTo(Math.sqrt(4902.800066 / (MOON_MEAN_RADIUS_KM + 100)), 9);
  });
  it('windows cut by occultation match a 1 s brute force (the Moon from the Moon target)', () => {
    const t = makeLunarOrbitTarget('LO', el, span);
    const mask = prepareMask({ kind: 'constant', elevationDeg: 5 });
    const passes = findPasses(t, [station], [mask], span);
    const s = new Float64Array(6);
    const look = newLook();
    let visibleS = 0;
    let foundS = 0;
    let disagreeS = 0;
    const moon = new Float64Array(3);
    const moonTarget = makeMoonTarget('M', span);
    const ms = new Float64Array(6);
    for (let tm = span.startMs; tm < span.endMs; tm += 1000) {
      t.stateEcefAt(tm, s);
      const el5 = lookFrom(station, s, look).elevationDeg > 5;
      // the Moon's centre, independently (geometry/targets/moon.ts, astronomy-engine GeoMoonState) at the
      // received time, moved back along its inertial velocity by the light time
      moonTarget.stateEcefAt(tm, ms);
      const tau = (tm - t.lastTransmitMs) / 1000;
      const w = 7.292115e-5;
      moon[0] = ms[0]! - (ms[3]! - w * ms[1]!) * tau;
      moon[1] = ms[1]! - (ms[4]! + w * ms[0]!) * tau;
      moon[2] = ms[2]! - ms[5]! * tau;
      const visible = el5 && moonSightMarginDeg(station.ecefKm, s, moon, MOON_MEAN_RADIUS_KM) > 0;
      const found = passes.some((p) => tm >= p.aosMs && tm <= p.losMs);
      if (visible) visibleS++;
      if (found) foundS++;
      if (visible !== found) disagreeS++;
    }
    console.log(`lunar orbiter: ${passes.length} windows, visible ${visibleS} s, found ${foundS} s, disagree ${disagreeS} s`);
    expect(passes.length).toBeGreaterThan(2);
    expect(disagreeS).toBeLessThanOrEqual(2 * passes.length + 2);
  });
});

describe('lunar elements far from the window', () => {
  it('are warned of past 14 days (two-body drift), not within them', async () => {
    const { findContacts, prepareGeometry } = await import('../../src/plan/contacts.js');
    const el = { epochMs: Date.UTC(2026, 2, 5), semiMajorAxisKm: 1837.4, eccentricity: 0, inclinationDeg: 90, raanDeg: 0, argPericenterDeg: 0, meanAnomalyDeg: 0, grazingMarginKm: 0 };
    const run = (startMs: number) => {
      const span = { startMs, endMs: startMs + 6 * 3_600_000 };
      const scenario = {
        spacecraft: [{ id: 'LO', name: 'LO', priority: 1, orbit: { kind: 'lunarOrbit' as const, elements: el }, radios: [] }],
        stations: [{ id: 'TST', name: 'Test', latitudeDeg: 37.4, longitudeDeg: -3.2, heightKm: 1.15, mask: { kind: 'constant' as const, elevationDeg: 5 }, timeZone: 'UTC' }],
      } as unknown as Parameters<typeof prepareGeometry>[0];
      return findContacts(scenario, prepareGeometry(scenario, span), span).warnings;
    };
    expect(run(Date.UTC(2026, 2, 10))).toEqual([]);
    expect(run(Date.UTC(2026, 3, 1))).toEqual([expect.stringMatching(/^LO: its lunar elements \(epoch 2026-03-05T00:00:00Z\) are up to 27 days from the window/)]);
  });
});
