/**
 * Ephemeris targets (src/geometry/targets/ephemeris.ts), their interpolation
 * (src/geometry/interpolate-poly.ts) and light time (src/geometry/light-time.ts).
 * Independent references: satellite.js SGP4 (the trajectory written to the file),
 * astronomy-engine 2.1.19 (frames, sidereal time), the exact speed of light and the IAU
 * astronomical unit (IAU 2012 Resolution B2: 149,597,870.700 km), common-practice
 * light times (Earth-Moon 1.2-1.4 s; 1 AU about 499 s).
 */
import { Rotation_EQJ_EQD, SiderealTime } from 'astronomy-engine';
import { sgp4, twoline2satrec } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { makeSite } from '../../src/geometry/earth.js';
import { lookFrom, newLook } from '../../src/geometry/topocentric.js';
import { makeEphemerisTarget } from '../../src/geometry/targets/ephemeris.js';
import { parseOem } from '../../src/scenario/oem.js';
import { findPasses } from '../../src/geometry/passes.js';
import { prepareMask } from '../../src/geometry/mask.js';
import { cruiseOemText, twoBodySunState, CURLEW_ELEMENTS, AU_KM } from '../../scripts/generate-cruise-oem.js';
import { HelioState, Body, KM_PER_AU } from 'astronomy-engine';
import { astroDays } from '../../src/geometry/targets/ofDate.js';

const C_KM_S = 299_792.458; // exact (SI)
const LEO = [
  '1 90001U 26901A   26063.50000000  .00001200  00000+0  72000-4 0  9995',
  '2 90001  97.5800 138.2000 0001200  90.0000 270.1000 15.05500000 12006',
];

function iso(tMs: number): string {
  return new Date(tMs).toISOString().replace('Z', '');
}

function oemText(rows: { tMs: number; s: number[] }[], centre: string, interpolation: string, degree: number): string {
  const head = [
    'CCSDS_OEM_VERS = 2.0',
    'META_START',
    'OBJECT_NAME = TEST',
    `CENTER_NAME = ${centre}`,
    'REF_FRAME = EME2000',
    'TIME_SYSTEM = UTC',
    `START_TIME = ${iso(rows[0]!.tMs)}`,
    `STOP_TIME = ${iso(rows[rows.length - 1]!.tMs)}`,
    `INTERPOLATION = ${interpolation}`,
    `INTERPOLATION_DEGREE = ${degree}`,
    'META_STOP',
  ];
  return [...head, ...rows.map((r) => `${iso(r.tMs)} ${r.s.map((v) => v.toPrecision(17)).join(' ')}`)].join('\n') + '\n';
}

describe('OEM interpolation of a LEO sampled every 60 s', () => {
  const t0 = Date.UTC(2026, 2, 5);
  // truth 1: satellite.js SGP4 (time as minutes since the element epoch, no Julian-date rounding)
  const rec = twoline2satrec(LEO[0]!, LEO[1]!);
  const sgp4At = (tMs: number) => {
    const pv = sgp4(rec, (tMs - t0) / 60_000);
    const p = pv!.position as { x: number; y: number; z: number };
    const v = pv!.velocity as { x: number; y: number; z: number };
    return [p.x, p.y, p.z, v.x, v.y, v.z];
  };
  // truth 2: two-body Kepler motion (GM 398600.4418 km^3/s^2, NIMA TR8350.2), whose velocity is the
  // exact derivative of its position (SGP4's is not quite: Hermite would see the difference)
  const leo = { epochMs: t0, semiMajorAxisKm: 6928, eccentricity: 0.001, inclinationDeg: 97.6, raanDeg: 138, argPericenterDeg: 90, meanAnomalyDeg: 10 };
  const keplerAt = (tMs: number) => twoBodySunState(leo, tMs, 398_600.4418);
  for (const [method, truth, name, boundMm] of [
    ['LAGRANGE', sgp4At, 'SGP4', 1],
    ['LAGRANGE', keplerAt, 'two-body', 1],
    ['HERMITE', keplerAt, 'two-body', 1],
  ] as const) {
    it(`${method} degree 7 of a ${name} LEO: position error between nodes < ${boundMm} mm`, async () => {
      const { PolyInterpolator } = await import('../../src/geometry/interpolate-poly.js');
      const rows = Array.from({ length: 361 }, (_, k) => ({ tMs: t0 + k * 60_000, s: truth(t0 + k * 60_000) }));
      const seg = parseOem(oemText(rows, 'EARTH', method, 7), 'leo.oem').ephemeris!.segments[0]!;
      const interp = new PolyInterpolator(seg.tMs, seg.states, method === 'HERMITE', 7);
      const out = new Float64Array(6);
      let worstKm = 0;
      let worstVel = 0;
      for (let k = 0; k < 360; k += 1) {
        const t = t0 + k * 60_000 + 30_000; // mid-node: the worst place
        interp.stateAt(t, out);
        const s = truth(t);
        worstKm = Math.max(worstKm, Math.hypot(out[0]! - s[0]!, out[1]! - s[1]!, out[2]! - s[2]!));
        worstVel = Math.max(worstVel, Math.hypot(out[3]! - s[3]!, out[4]! - s[4]!, out[5]! - s[5]!));
      }
      console.log(`${method} 7 of a ${name} LEO at 60 s: worst position ${(worstKm * 1e6).toFixed(3)} mm, velocity ${(worstVel * 1e6).toFixed(4)} mm/s`);
      expect(worstKm).toBeLessThan(boundMm * 1e-6);
      expect(worstVel).toBeLessThan(1e-6); // 1 mm/s
    });
  }
});

/** A station (invented site) for the light-time checks. */
const site = makeSite('TST', 37.4, -3.2, 1.15);

describe('light time', () => {
  it('a point at rest 1 AU from the Earth: one-way light time 499.005 s (AU / c)', () => {
    const t0 = Date.UTC(2026, 2, 5);
    const rows = Array.from({ length: 40 }, (_, k) => ({ tMs: t0 - 86_400_000 + k * 3_600_000, s: [AU_KM, 0, 0, 0, 0, 0] }));
    const eph = parseOem(oemText(rows, 'EARTH', 'LAGRANGE', 3), 'au.oem').ephemeris!;
    const target = makeEphemerisTarget('AU', eph, { startMs: t0, endMs: t0 + 3_600_000 });
    const out = new Float64Array(6);
    expect(target.stateEcefAt(t0, out)).toBe(true);
    expect(target.lastLightTimeS).toBeCloseTo(AU_KM / C_KM_S, 6);
    expect(Math.abs(target.lastLightTimeS - 499.005)).toBeLessThan(0.001);
  });

  const span = { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 7) };
  const eph = parseOem(cruiseOemText(), 'curlew.oem').ephemeris!;

  it('heliocentric cruise craft: range rate (Doppler) equals the finite difference of the light-time corrected range', () => {
    const target = makeEphemerisTarget('CURLEW', eph, span);
    const s = new Float64Array(6);
    const look = newLook();
    const range = (t: number) => {
      target.stateEcefAt(t, s);
      return lookFrom(site, s, look).rangeKm;
    };
    let worst = 0;
    for (let h = 0; h < 48; h += 5) {
      const t = span.startMs + h * 3_600_000;
      target.stateEcefAt(t, s);
      const rr = lookFrom(site, s, look).rangeRateKmS;
      const fd = (range(t + 500) - range(t - 500)) / 1.0;
      worst = Math.max(worst, Math.abs(rr - fd));
    }
    console.log(`CURLEW range rate vs finite difference: worst ${(worst * 1e6).toFixed(3)} mm/s`);
    expect(worst).toBeLessThan(1e-6 * 5); // 5 mm/s (0.14 Hz at 8.4 GHz)
  });

  it('heliocentric cruise craft: the received-time state is the two-body state at the transmit time (brute force, own light-time solution)', () => {
    const target = makeEphemerisTarget('CURLEW', eph, span);
    const s = new Float64Array(6);
    const look = newLook();
    for (const h of [3, 17, 29]) {
      const tR = span.startMs + h * 3_600_000;
      target.stateEcefAt(tR, s);
      const got = lookFrom(site, s, look).rangeKm;
      // independent: geocentric two-body position at t_t, solved against the station's distance by bisection,
      // station moved into EME2000 with astronomy-engine's own rotation and sidereal time
      const days = astroDays(tR);
      const gast = (SiderealTime(days) * Math.PI) / 12;
      const st = site.ecefKm;
      const pef = [Math.cos(gast) * st[0] - Math.sin(gast) * st[1], Math.sin(gast) * st[0] + Math.cos(gast) * st[1], st[2]];
      const rot = Rotation_EQJ_EQD(days).rot; // EQJ -> EQD: v'_j = sum_i v_i rot[i][j]; inverse: v_i = sum_j rot[i][j] v'_j
      const stEqj = [0, 1, 2].map((i) => rot[i]![0]! * pef[0]! + rot[i]![1]! * pef[1]! + rot[i]![2]! * pef[2]!);
      const geo = (t: number) => {
        const c = twoBodySunState(CURLEW_ELEMENTS, t);
        const e = HelioState(Body.Earth, astroDays(t));
        return [c[0]! - e.x * KM_PER_AU, c[1]! - e.y * KM_PER_AU, c[2]! - e.z * KM_PER_AU];
      };
      let tau = 0;
      for (let i = 0; i < 5; i++) {
        const p = geo(tR - tau * 1000);
        tau = Math.hypot(p[0]! - stEqj[0]!, p[1]! - stEqj[1]!, p[2]! - stEqj[2]!) / C_KM_S;
      }
      const expected = tau * C_KM_S;
      // geocentric vs topocentric light time: |v| x 21 ms at most (light-time.ts)
      expect(Math.abs(got - expected)).toBeLessThan(1.0);
    }
  });

  it('received-time windows are the transmit-time windows shifted by the light time', () => {
    const target = makeEphemerisTarget('CURLEW', eph, span);
    const mask = prepareMask({ kind: 'constant', elevationDeg: 5 });
    const passes = findPasses(target, [site], [mask], span);
    expect(passes.length).toBeGreaterThan(0);
    const s = new Float64Array(6);
    const look = newLook();
    for (const p of passes) {
      for (const [tMs, up] of [
        [p.aosMs, true],
        [p.losMs, false],
      ] as const) {
        if ((up && p.aosClipped) || (!up && p.losClipped)) continue;
        // brute force at 1 s around the edge: elevation of the light-time corrected state vs the mask
        let edge = Number.NaN;
        for (let t = tMs - 60_000; t <= tMs + 60_000; t += 1000) {
          target.stateEcefAt(t, s);
          const el = lookFrom(site, s, look).elevationDeg;
          if ((up && el > 5) || (!up && el <= 5)) {
            edge = t;
            break;
          }
        }
        expect(Math.abs(edge - tMs)).toBeLessThanOrEqual(1000);
        // the transmit time of the edge is the received time less the light time there
        target.stateEcefAt(tMs, s);
        const tau = lookFrom(site, s, look).rangeKm / C_KM_S;
        expect(Math.abs(tMs - tau * 1000 - target.lastTransmitMs)).toBeLessThan(25); // R_E / c = 21 ms
        expect(tau).toBeGreaterThan(280);
      }
    }
  });
});

describe('usable span of an ephemeris file', () => {
  it('outside it there are no contacts, said in one warning; inside it the windows are those of the full file', async () => {
    const { findContacts, prepareGeometry } = await import('../../src/plan/contacts.js');
    const full = parseOem(cruiseOemText(), 'curlew.oem').ephemeris!;
    const cut = parseOem(
      cruiseOemText().replace(/USEABLE_START_TIME.*\n/, '').replace('STOP_TIME = ', 'USEABLE_START_TIME = 2026-03-06T00:00:00.000\nUSEABLE_STOP_TIME = 2026-03-08T00:00:00.000\nSTOP_TIME = '),
      'curlew-cut.oem',
    ).ephemeris!;
    const span = { startMs: Date.UTC(2026, 2, 5), endMs: Date.UTC(2026, 2, 10) };
    const station = { id: 'TST', name: 'Test', latitudeDeg: 37.4, longitudeDeg: -3.2, heightKm: 1.15, mask: { kind: 'constant' as const, elevationDeg: 5 }, timeZone: 'UTC' };
    const run = (eph: typeof full) => {
      const scenario = {
        spacecraft: [{ id: 'C', name: 'C', priority: 1, orbit: { kind: 'ephemeris' as const, ephemeris: eph, grazingMarginKm: 0 }, radios: [] }],
        stations: [station],
      } as unknown as Parameters<typeof prepareGeometry>[0];
      return findContacts(scenario, prepareGeometry(scenario, span), span);
    };
    const a = run(full);
    const b = run(cut);
    expect(a.warnings).toEqual([]);
    expect(b.warnings).toHaveLength(1);
    expect(b.warnings[0]).toMatch(/^C: its ephemeris covers 2026-03-06T00:\d\d:\d\dZ \.\. 2026-03-07T23:40:00Z only/);
    const inside = a.contacts.filter((c) => c.aosMs > Date.UTC(2026, 2, 6, 1) && c.losMs < Date.UTC(2026, 2, 7, 23));
    const whole = b.contacts.filter((c) => !c.aosClipped && !c.losClipped);
    expect(whole).toHaveLength(inside.length);
    whole.forEach((c, i) => {
      // the same edges to the search's 10 ms tolerance (its scan grid starts elsewhere)
      expect(Math.abs(c.aosMs - inside[i]!.aosMs)).toBeLessThan(20);
      expect(Math.abs(c.losMs - inside[i]!.losMs)).toBeLessThan(20);
    });
    expect(b.contacts.every((c) => c.aosMs >= Date.UTC(2026, 2, 6) && c.losMs <= Date.UTC(2026, 2, 8))).toBe(true);
  });
});
