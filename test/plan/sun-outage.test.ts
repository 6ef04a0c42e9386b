/**
 * Sun outages (src/geometry/sun-outage.ts, src/plan/sun-outages.ts) and the Sun's noise
 * in the volumes. Independent reference: astronomy-engine 2.1.19 for the Sun's apparent
 * topocentric direction (`Equator` of date with aberration, `Horizon` without refraction)
 * and satellite.js 7.1.0 for ANCHOR-G's look angles (`eciToEcf`, `ecfToLookAngles`), the
 * Sun-boresight separation brute-forced every second.
 */
import { Body, Equator, Horizon, Observer } from 'astronomy-engine';
import { ecfToLookAngles, eciToEcf, gstime, propagate, twoline2satrec } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { astroDays } from '../../src/geometry/targets/ofDate.js';

const demo = loadScenario(demoFiles());
const span = { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 6) };

describe('the demo ANCHOR-G / SAL Sun outage on 2026-03-05', () => {
  const scenario = {
    ...demo,
    spacecraft: demo.spacecraft.filter((s) => s.id === 'ANCHOR-G'),
    stations: demo.stations.filter((s) => s.id === 'SAL'),
  };
  const plan = runPlan(scenario, span);
  const outages = plan.sunOutages ?? [];

  it('is found near 11:24 UTC at the minute of the brute-force closest approach', () => {
    expect(outages).toHaveLength(1);
    const o = outages[0]!;
    const sc = scenario.spacecraft[0]!;
    const tle = sc.orbit.kind === 'elements' ? sc.orbit.sets[0]!.tle! : undefined;
    const rec = twoline2satrec(tle!.line1, tle!.line2);
    const st = scenario.stations[0]!;
    const observer = new Observer(st.latitudeDeg, st.longitudeDeg, st.heightKm * 1000);
    const geodetic = { latitude: (st.latitudeDeg * Math.PI) / 180, longitude: (st.longitudeDeg * Math.PI) / 180, height: st.heightKm };
    const sep = (tMs: number): number => {
      const date = new Date(tMs);
      const eq = Equator(Body.Sun, astroDays(tMs), observer, true, true);
      const sun = Horizon(astroDays(tMs), observer, eq.ra, eq.dec);
      const pv = propagate(rec, date);
      const look = ecfToLookAngles(geodetic, eciToEcf(pv!.position as { x: number; y: number; z: number }, gstime(date)));
      const a1 = (sun.azimuth * Math.PI) / 180;
      const e1 = (sun.altitude * Math.PI) / 180;
      const c = Math.sin(e1) * Math.sin(look.elevation) + Math.cos(e1) * Math.cos(look.elevation) * Math.cos(a1 - look.azimuth);
      return (Math.acos(Math.min(1, c)) * 180) / Math.PI;
    };
    let best = Infinity;
    let bestMs = 0;
    for (let t = Date.UTC(2026, 2, 5, 11, 0); t <= Date.UTC(2026, 2, 5, 11, 50); t += 1000) {
      const d = sep(t);
      if (d < best) {
        best = d;
        bestMs = t;
      }
    }
    console.log(`closest approach: plan ${new Date(o.minAtMs).toISOString()} ${o.minOffsetDeg.toFixed(4)} deg; brute force ${new Date(bestMs).toISOString()} ${best.toFixed(4)} deg`);
    expect(Math.floor(o.minAtMs / 60_000)).toBe(Math.floor(bestMs / 60_000));
    expect(Math.abs(o.minAtMs - bestMs)).toBeLessThan(10_000);
    expect(Math.abs(o.minOffsetDeg - best)).toBeLessThan(0.01);
    expect(new Date(o.minAtMs).toISOString().slice(0, 16)).toBe('2026-03-05T11:24');
    // start and end: where the brute-force separation crosses solar radius + one beamwidth
    const limit = 0.2672 + o.beamwidthDeg; // apparent solar radius on 5 March (~16.03 arcmin), + 1 HPBW
    expect(sep(o.startMs + 3000)).toBeLessThan(limit + 0.002);
    expect(sep(o.startMs - 3000)).toBeGreaterThan(limit - 0.002);
    expect(sep(o.endMs - 3000)).toBeLessThan(limit + 0.002);
    expect(sep(o.endMs + 3000)).toBeGreaterThan(limit - 0.002);
  });

  it('the Sun fills the 13 m Ka-band beam: about the quiet-Sun brightness (~11,000 K) is added, and the volume drops', () => {
    const o = outages[0]!;
    expect(o.peakSunNoiseK).toBeGreaterThan(9000);
    expect(o.peakSunNoiseK).toBeLessThan(11_300);
    // the volume around the outage: the 15-minute bin holding it carries less than its neighbours
    const c = plan.contacts[0]!;
    const bins = c.link!.volumeBinsBits;
    const i = Math.floor((o.minAtMs - c.link!.binStartMs) / (15 * 60_000));
    expect(bins[i]!).toBeLessThan(0.95 * bins[i - 2]!);
    expect(bins[i]!).toBeLessThan(0.95 * bins[i + 2]!);
  });
});

describe('Sun-Earth-probe angle and the solar conjunction warning', () => {
  it('a fixed sky direction 3 deg from the Sun is warned of; at 40 deg it is not (threshold 5 deg); the angle matches astronomy-engine', async () => {
    const { GeoVector, AngleBetween, Vector } = await import('astronomy-engine');
    const { makeFixedSkyTarget } = await import('../../src/geometry/targets/fixedSky.js');
    const { SkyBodies } = await import('../../src/geometry/sky-bodies.js');
    const { solarConjunctionWarning } = await import('../../src/plan/contacts.js');
    const t = Date.UTC(2026, 2, 8);
    const sunEqj = GeoVector(Body.Sun, astroDays(t), true);
    const ra = (Math.atan2(sunEqj.y, sunEqj.x) * 180) / Math.PI;
    const dec = (Math.asin(sunEqj.z / Math.hypot(sunEqj.x, sunEqj.y, sunEqj.z)) * 180) / Math.PI;
    const sky = new SkyBodies({ startMs: t - 86_400_000, endMs: t + 86_400_000 });
    const s = new Float64Array(6);
    for (const [offset, warned] of [
      [3, true],
      [40, false],
    ] as const) {
      const target = makeFixedSkyTarget('X', (ra + offset + 360) % 360, dec, 1.5e8, { startMs: t - 86_400_000, endMs: t + 86_400_000 });
      const w = solarConjunctionWarning(target, sky, { startMs: t - 3_600_000, endMs: t + 3_600_000 });
      expect(w !== undefined).toBe(warned);
      target.stateEcefAt(t, s);
      sky.at(t);
      const dirRad = ((ra + offset) * Math.PI) / 180;
      const decRad = (dec * Math.PI) / 180;
      const probe = new Vector(Math.cos(decRad) * Math.cos(dirRad), Math.cos(decRad) * Math.sin(dirRad), Math.sin(decRad), sunEqj.t);
      expect(Math.abs(sky.sunEarthProbeDeg(s) - AngleBetween(sunEqj, probe))).toBeLessThan(0.01);
    }
  });
});

describe('the outage search against a 0.25 s scan (a LEO: fast boresight)', () => {
  it('finds every outage of KESTREL-1 over the demo week, edges within 1 s', async () => {
    const { prepareGeometry, findContacts } = await import('../../src/plan/contacts.js');
    const { SunOutageSearch, SUN_OUTAGE_BEAMWIDTHS } = await import('../../src/geometry/sun-outage.js');
    const { newBodyAngles } = await import('../../src/geometry/sky-bodies.js');
    const { halfPowerBeamwidthDeg } = await import('../../src/link/antenna.js');
    const scenario = { ...demo, spacecraft: demo.spacecraft.filter((s) => s.id === 'KESTREL-1') };
    const week = demo.span!;
    const geometry = prepareGeometry(scenario, week);
    const contacts = findContacts(scenario, geometry, week).contacts;
    const target = geometry.targets.get('KESTREL-1')!;
    const search = new SunOutageSearch(target, geometry.sky);
    const s = new Float64Array(6);
    const angles = newBodyAngles();
    let found = 0;
    let scanned = 0;
    for (const c of contacts) {
      const i = geometry.sites.findIndex((x) => x.stationId === c.stationId);
      const site = geometry.sites[i]!;
      const st = scenario.stations[i]!;
      const hpbw = halfPowerBeamwidthDeg((st.receiver as { dishDiameterM: number }).dishDiameterM, scenario.spacecraft[0]!.radios[0]!.frequencyHz);
      const fast = search.find(site, c.aosMs, c.losMs, hpbw, c.maxElevationDeg);
      const slow: { startMs: number; endMs: number }[] = [];
      let open = Number.NaN;
      for (let t = c.aosMs; t <= c.losMs; t += 250) {
        target.stateEcefAt(t, s);
        geometry.sky.at(t);
        const a = geometry.sky.angles(site, s, angles);
        const inside = a.sunOffsetDeg < a.sunRadiusDeg + SUN_OUTAGE_BEAMWIDTHS * hpbw;
        if (inside && Number.isNaN(open)) open = t;
        if (!inside && !Number.isNaN(open)) {
          slow.push({ startMs: open, endMs: t - 250 });
          open = Number.NaN;
        }
      }
      if (!Number.isNaN(open)) slow.push({ startMs: open, endMs: c.losMs });
      expect(fast.length).toBe(slow.length);
      fast.forEach((w, k) => {
        expect(Math.abs(w.startMs - slow[k]!.startMs)).toBeLessThan(1000);
        expect(Math.abs(w.endMs - slow[k]!.endMs)).toBeLessThan(1000);
      });
      found += fast.length;
      scanned++;
    }
    console.log(`KESTREL-1: ${scanned} contacts, ${found} outages`);
    expect(found).toBeGreaterThanOrEqual(2);
  });
});
