/**
 * Horizon mask: the lowest usable elevation as a function of azimuth.
 *
 * Model: a constant elevation, or a terrain/obstruction profile of (azimuth, elevation)
 * points joined by straight lines in azimuth, wrapping from the last point through 360
 * back to the first (piecewise-linear interpolation on a circle). Common practice for
 * station horizon masks. Prepared once into sorted arrays with a one-degree bucket
 * index, so a lookup is O(1) and allocation-free.
 * Valid range: azimuth any finite value (taken modulo 360), profile elevations -90..90 deg.
 * Units: degrees.
 */
import { ModelRangeError } from '../errors.js';
import type { Mask } from '../scenario/types.js';

export type PreparedMask =
  | { readonly kind: 'constant'; readonly elevationDeg: number }
  | {
      readonly kind: 'profile';
      /** Azimuths (deg) ascending, with one wrapped point added at each end. */
      readonly azimuthDeg: Float64Array;
      readonly elevationDeg: Float64Array;
      /** For each whole degree d in 0..359: index i of the segment [az[i], az[i+1]) holding d. */
      readonly bucket: Int32Array;
    };

const MODEL = 'geometry/mask';

function checkElevation(field: string, v: number): void {
  if (!Number.isFinite(v) || v < -90 || v > 90) throw new ModelRangeError(MODEL, field, v, '-90..90 deg');
}

/** Check and prepare a mask once (sort, wrap, index). */
export function prepareMask(mask: Mask): PreparedMask {
  if (mask.kind === 'constant') {
    checkElevation('elevationDeg', mask.elevationDeg);
    return { kind: 'constant', elevationDeg: mask.elevationDeg };
  }
  const n = mask.azimuthDeg.length;
  if (n === 0 || n !== mask.elevationDeg.length) {
    throw new ModelRangeError(MODEL, 'azimuthDeg.length', n, `>= 1 and equal to elevationDeg.length (${mask.elevationDeg.length})`);
  }
  const points: { az: number; el: number }[] = [];
  for (let i = 0; i < n; i++) {
    const az = mask.azimuthDeg[i]!;
    const el = mask.elevationDeg[i]!;
    if (!Number.isFinite(az)) throw new ModelRangeError(MODEL, `azimuthDeg[${i}]`, az, 'a finite angle');
    checkElevation(`elevationDeg[${i}]`, el);
    points.push({ az: ((az % 360) + 360) % 360, el });
  }
  points.sort((a, b) => a.az - b.az);
  const uniq: { az: number; el: number }[] = [];
  for (const p of points) {
    const last = uniq[uniq.length - 1];
    if (last !== undefined && last.az === p.az) {
      // 0 and 360 given with the same value is a closed profile, not a conflict.
      if (last.el !== p.el) throw new ModelRangeError(MODEL, 'azimuthDeg', p.az, 'distinct azimuths modulo 360 (or equal elevations)');
      continue;
    }
    uniq.push(p);
  }
  const m = uniq.length;
  const az = new Float64Array(m + 2);
  const el = new Float64Array(m + 2);
  const first = uniq[0]!;
  const last = uniq[m - 1]!;
  az[0] = last.az - 360;
  el[0] = last.el;
  for (let i = 0; i < m; i++) {
    az[i + 1] = uniq[i]!.az;
    el[i + 1] = uniq[i]!.el;
  }
  az[m + 1] = first.az + 360;
  el[m + 1] = first.el;
  const bucket = new Int32Array(360);
  let seg = 0;
  for (let d = 0; d < 360; d++) {
    while (az[seg + 1]! <= d) seg++;
    bucket[d] = seg;
  }
  return { kind: 'profile', azimuthDeg: az, elevationDeg: el, bucket };
}

/** Mask elevation (deg) at an azimuth (deg, any finite value, taken modulo 360). */
export function maskElevationDeg(mask: PreparedMask, azimuthDeg: number): number {
  if (mask.kind === 'constant') return mask.elevationDeg;
  let az = azimuthDeg % 360;
  if (az < 0) az += 360;
  if (az >= 360) az = 0; // -1e-15 + 360 rounds to 360
  const a = mask.azimuthDeg;
  const e = mask.elevationDeg;
  let i = mask.bucket[Math.floor(az)]!;
  while (a[i + 1]! <= az) i++;
  const a0 = a[i]!;
  const span = a[i + 1]! - a0;
  const w = (az - a0) / span;
  return e[i]! + w * (e[i + 1]! - e[i]!);
}
