/**
 * Warnings an operator wants on a pass view, from its sampled track (plan/series.ts):
 * - Keyhole: an azimuth-elevation mount must swing its azimuth fast near the zenith; the
 *   azimuth rate is taken between samples (unwrapped). Flagged above 3 deg/s, the low end of
 *   the 3-10 deg/s slew limits usual for small tracking dishes (common practice).
 * - Sun in the beam: the Sun's direction from the station (astronomy-engine 2.1.19
 *   `Equator` and `Horizon`, apparent, refraction ignored) within the receive antenna's
 *   3 dB beamwidth (or 2 deg when unknown) of the track: the Sun's noise raises the
 *   system noise temperature, which the budget does not include.
 * Units: deg, deg/s, UTC epoch ms.
 */
import * as Astronomy from 'astronomy-engine';
import type { ContactSeries } from './series.js';

/** Azimuth rate above which a pass is flagged for an az-el mount, deg/s (common practice). */
export const KEYHOLE_AZIMUTH_RATE_DEG_S = 3;
/** Sun separation checked when the beamwidth is unknown, deg. */
export const SUN_CHECK_DEFAULT_DEG = 2;

export interface PassWarning {
  kind: 'keyhole' | 'sun';
  atMs: number;
  text: string;
}

const DEG = Math.PI / 180;

/** Great-circle angle between two (azimuth, elevation) directions, deg. */
export function separationDeg(az1Deg: number, el1Deg: number, az2Deg: number, el2Deg: number): number {
  const c = Math.sin(el1Deg * DEG) * Math.sin(el2Deg * DEG) + Math.cos(el1Deg * DEG) * Math.cos(el2Deg * DEG) * Math.cos((az1Deg - az2Deg) * DEG);
  return Math.acos(Math.min(1, Math.max(-1, c))) / DEG;
}

/** The largest azimuth rate between consecutive samples, deg/s, and when. */
export function peakAzimuthRate(s: ContactSeries): { rateDegS: number; atMs: number } {
  let best = { rateDegS: 0, atMs: s.aosMs };
  for (let i = 1; i < s.tMs.length; i++) {
    const dt = (s.tMs[i]! - s.tMs[i - 1]!) / 1000;
    if (!(dt > 0)) continue;
    let d = Math.abs(s.azimuthDeg[i]! - s.azimuthDeg[i - 1]!);
    if (d > 180) d = 360 - d;
    const rate = d / dt;
    if (rate > best.rateDegS) best = { rateDegS: rate, atMs: (s.tMs[i]! + s.tMs[i - 1]!) / 2 };
  }
  return best;
}

export function passWarnings(s: ContactSeries, station: { latitudeDeg: number; longitudeDeg: number; heightKm: number }): PassWarning[] {
  const out: PassWarning[] = [];
  const az = peakAzimuthRate(s);
  if (az.rateDegS > KEYHOLE_AZIMUTH_RATE_DEG_S) {
    out.push({
      kind: 'keyhole',
      atMs: az.atMs,
      text: `azimuth rate up to ${az.rateDegS.toFixed(1)} deg/s near the zenith (keyhole of an az-el mount; usual slew limits 3-10 deg/s)`,
    });
  }
  const limitDeg = Number.isFinite(s.rxBeamwidthDeg) ? Math.max(s.rxBeamwidthDeg, 0.1) : SUN_CHECK_DEFAULT_DEG;
  const observer = new Astronomy.Observer(station.latitudeDeg, station.longitudeDeg, station.heightKm * 1000);
  let closest = { sepDeg: Number.POSITIVE_INFINITY, atMs: s.aosMs };
  for (let i = 0; i < s.tMs.length; i++) {
    const date = new Date(s.tMs[i]!);
    const eq = Astronomy.Equator(Astronomy.Body.Sun, date, observer, true, true);
    const hor = Astronomy.Horizon(date, observer, eq.ra, eq.dec);
    const sep = separationDeg(s.azimuthDeg[i]!, s.elevationDeg[i]!, hor.azimuth, hor.altitude);
    if (sep < closest.sepDeg) closest = { sepDeg: sep, atMs: s.tMs[i]! };
  }
  if (closest.sepDeg <= limitDeg) {
    out.push({
      kind: 'sun',
      atMs: closest.atMs,
      text: `the Sun passes ${closest.sepDeg.toFixed(2)} deg from the track, inside the ${limitDeg.toFixed(2)} deg beam: sun noise not in the budget`,
    });
  }
  return out;
}
