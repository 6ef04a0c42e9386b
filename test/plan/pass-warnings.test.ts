// Pass warnings (src/plan/pass-warnings.ts) on constructed tracks:
// - the great-circle separation against closed forms (same azimuth: the elevation
//   difference; both on the horizon: the azimuth difference; zenith to horizon: 90 deg);
// - the keyhole: a straight overhead pass of a craft at height h and speed v has a peak
//   azimuth rate that grows without bound near the zenith; a track offset by 1 deg of
//   elevation from the zenith swings its azimuth by ~180 deg in a few seconds;
// - the Sun: a track laid through the Sun's direction from astronomy-engine is flagged,
//   the same track 20 deg away is not.
import { describe, expect, it } from 'vitest';
import * as Astronomy from 'astronomy-engine';
import { passWarnings, peakAzimuthRate, separationDeg } from '../../src/plan/pass-warnings.js';
import type { ContactSeries } from '../../src/plan/series.js';

function series(tMs: number[], azimuthDeg: number[], elevationDeg: number[], rxBeamwidthDeg = 0.5): ContactSeries {
  const n = tMs.length;
  return {
    stationId: 'TST',
    spacecraftId: 'PBX',
    radioId: 'X',
    aosMs: tMs[0]!,
    losMs: tMs[n - 1]!,
    dataStartMs: tMs[0]!,
    stepS: (tMs[1]! - tMs[0]!) / 1000,
    tMs: Float64Array.from(tMs),
    azimuthDeg: Float64Array.from(azimuthDeg),
    elevationDeg: Float64Array.from(elevationDeg),
    rateBps: new Float64Array(n).fill(1e6),
    marginDb: new Float64Array(n).fill(3),
    modcodIndex: new Int16Array(n),
    modcodNames: ['QPSK 1/2'],
    rxBeamwidthDeg,
  };
}

const T0 = Date.UTC(2026, 5, 21, 10, 0, 0);
const site = { latitudeDeg: 45, longitudeDeg: 10, heightKm: 0 };

describe('pass warnings', () => {
  it('separation: closed forms', () => {
    expect(separationDeg(120, 10, 120, 35)).toBeCloseTo(25, 9);
    expect(separationDeg(10, 0, 100, 0)).toBeCloseTo(90, 9);
    expect(separationDeg(350, 0, 10, 0)).toBeCloseTo(20, 9);
    expect(separationDeg(77, 90, 200, 0)).toBeCloseTo(90, 9);
  });

  it('keyhole: a pass 1 deg from the zenith swings its azimuth fast and is flagged; a 30 deg pass is not', () => {
    // azimuth of a straight track passing at closest elevation eMax: az = atan2(along, cross)
    const make = (eMaxDeg: number) => {
      const t: number[] = [];
      const az: number[] = [];
      const el: number[] = [];
      const crossKm = 500 / Math.tan((eMaxDeg * Math.PI) / 180); // height 500 km, flat-Earth closed form
      for (let k = -60; k <= 60; k++) {
        const alongKm = k * 7.5 * 2; // 7.5 km/s, 2 s steps
        t.push(T0 + k * 2000);
        az.push(((Math.atan2(alongKm, crossKm) * 180) / Math.PI + 360) % 360);
        el.push((Math.atan2(500, Math.hypot(alongKm, crossKm)) * 180) / Math.PI);
      }
      return series(t, az, el);
    };
    const near = peakAzimuthRate(make(89));
    // closed form at the closest point: d(az)/dt = v / cross = 7.5 / (500 / tan 89 deg) rad/s
    const closedDegS = ((7.5 / (500 / Math.tan((89 * Math.PI) / 180))) * 180) / Math.PI;
    // sampled every 2 s (15 km steps against an 8.7 km miss distance) the rate seen is below the peak, and above half of it
    expect(near.rateDegS).toBeGreaterThan(0.5 * closedDegS);
    expect(near.rateDegS).toBeLessThanOrEqual(closedDegS * 1.0001);
    expect(passWarnings(make(89), site).map((w) => w.kind)).toContain('keyhole');
    expect(passWarnings(make(30), site).map((w) => w.kind)).not.toContain('keyhole');
  });

  it('sun in the beam: a track through the Sun (astronomy-engine) is flagged, 20 deg away it is not', () => {
    const obs = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, 0);
    const t: number[] = [];
    const az: number[] = [];
    const el: number[] = [];
    const elOff: number[] = [];
    for (let k = 0; k < 30; k++) {
      const tm = T0 + k * 10_000;
      const eq = Astronomy.Equator(Astronomy.Body.Sun, new Date(tm), obs, true, true);
      const h = Astronomy.Horizon(new Date(tm), obs, eq.ra, eq.dec);
      t.push(tm);
      az.push(h.azimuth);
      el.push(h.altitude);
      elOff.push(h.altitude - 20);
    }
    expect(passWarnings(series(t, az, el), site).map((w) => w.kind)).toContain('sun');
    expect(passWarnings(series(t, az, elOff), site).map((w) => w.kind)).not.toContain('sun');
  });
});
