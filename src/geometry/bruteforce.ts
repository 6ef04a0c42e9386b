/**
 * Brute-force contact windows: the slow, obvious scan the fast search is tested and
 * benchmarked against. Every `stepS` from span start to span end (inclusive) the target
 * is propagated once and every site evaluated; a window is a maximal run of samples with
 * g = elevation - mask(azimuth) > 0 (and the target's own margin of sight > 0, as in passes.ts). AOS is its first sample, LOS its last, the peak its
 * highest-elevation sample (so each is exact to within one step). A window open at the
 * first (last) sample is aosClipped (losClipped). When the state fails, open windows end
 * at the last good sample (losTrackEnded) and the scan stops.
 * Units: ms for times, s for the step, degrees.
 */
import type { Mask, Span } from '../scenario/types.js';
import { maskElevationDeg, type PreparedMask } from './mask.js';
import { asPreparedMask, checkSearchInputs } from './passes.js';
import { lookFrom, newLook } from './topocentric.js';
import type { Pass, Site, Target } from './types.js';

export function findPassesBruteForce(
  target: Target,
  sites: readonly Site[],
  masks: readonly (Mask | PreparedMask)[],
  span: Span,
  stepS = 1,
): Pass[] {
  checkSearchInputs(sites, masks, span, stepS);
  const prepared = masks.map(asPreparedMask);
  const n = sites.length;
  const state = new Float64Array(6);
  const look = newLook();
  const open = new Uint8Array(n);
  const aos = new Float64Array(n);
  const aosAz = new Float64Array(n);
  const bestEl = new Float64Array(n);
  const bestT = new Float64Array(n);
  const lastT = new Float64Array(n);
  const lastAz = new Float64Array(n);
  const passes: Pass[] = [];
  const stepMs = stepS * 1000;
  const count = Math.ceil((span.endMs - span.startMs) / stepMs);
  let trackEnded = false;
  const close = (i: number, losClipped: boolean): void => {
    open[i] = 0;
    passes.push({
      spacecraftId: target.spacecraftId,
      stationId: sites[i]!.stationId,
      aosMs: aos[i]!,
      losMs: lastT[i]!,
      tcaMs: bestT[i]!,
      maxElevationDeg: bestEl[i]!,
      aosAzimuthDeg: aosAz[i]!,
      losAzimuthDeg: lastAz[i]!,
      aosClipped: aos[i] === span.startMs,
      losClipped,
      losTrackEnded: trackEnded,
    });
  };
  for (let k = 0; k <= count; k++) {
    const t = k < count ? span.startMs + k * stepMs : span.endMs;
    if (!target.stateEcefAt(t, state)) {
      trackEnded = true;
      break;
    }
    for (let i = 0; i < n; i++) {
      lookFrom(sites[i]!, state, look);
      let g = look.elevationDeg - maskElevationDeg(prepared[i]!, look.azimuthDeg);
      if (target.sightMarginDeg) g = Math.min(g, target.sightMarginDeg(sites[i]!.ecefKm));
      if (g > 0) {
        if (!open[i]) {
          open[i] = 1;
          aos[i] = t;
          aosAz[i] = look.azimuthDeg;
          bestEl[i] = Number.NEGATIVE_INFINITY;
        }
        if (look.elevationDeg > bestEl[i]!) {
          bestEl[i] = look.elevationDeg;
          bestT[i] = t;
        }
        lastT[i] = t;
        lastAz[i] = look.azimuthDeg;
      } else if (open[i]) {
        close(i, false);
      }
    }
  }
  for (let i = 0; i < n; i++) {
    if (open[i]) close(i, !trackEnded && lastT[i] === span.endMs);
  }
  passes.sort((a, b) => a.aosMs - b.aosMs);
  return passes;
}
