/**
 * Look angles of a contact for the mechanics model: sampled every
 * COARSE_STEP_S, and every FINE_STEP_S inside the coarse intervals where an
 * axis moves faster than half its rate limit or the elevation comes within
 * 2 deg of a limit (and one coarse interval either side). The command the
 * mechanics model follows is linear between these samples.
 */
import { lookFrom, newLook } from '../../geometry/topocentric.js';
import type { Site, Target } from '../../geometry/types.js';
import { toXY, unwrapDeg } from './mechanics.js';
import type { AntennaMechanics } from './types.js';

export const COARSE_STEP_S = 30;
export const FINE_STEP_S = 1;

export interface PointingSeries {
  tMs: Float64Array;
  azimuthDeg: Float64Array;
  elevationDeg: Float64Array;
}

function sampleAt(target: Target, site: Site, times: readonly number[]): PointingSeries {
  const state = new Float64Array(6);
  const look = newLook();
  const t: number[] = [];
  const az: number[] = [];
  const el: number[] = [];
  for (const tm of times) {
    if (!target.stateEcefAt(tm, state)) continue;
    lookFrom(site, state, look);
    t.push(tm);
    az.push(look.azimuthDeg);
    el.push(look.elevationDeg);
  }
  return { tMs: Float64Array.from(t), azimuthDeg: Float64Array.from(az), elevationDeg: Float64Array.from(el) };
}

/** Evenly spaced times from a to b (both included). */
function grid(a: number, b: number, stepMs: number): number[] {
  const out: number[] = [];
  for (let t = a; t < b; t += stepMs) out.push(t);
  out.push(b);
  return out;
}

export function samplePointing(target: Target, site: Site, aosMs: number, losMs: number, m: AntennaMechanics): PointingSeries {
  const coarse = sampleAt(target, site, grid(aosMs, losMs, COARSE_STEP_S * 1000));
  const n = coarse.tMs.length;
  if (n < 2) return coarse;
  let a1: Float64Array;
  let a2: Float64Array;
  if (m.mount === 'el-az') {
    a1 = unwrapDeg(coarse.azimuthDeg);
    a2 = coarse.elevationDeg;
  } else {
    a1 = new Float64Array(n);
    a2 = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const p = toXY(coarse.azimuthDeg[i]!, coarse.elevationDeg[i]!);
      a1[i] = p.xDeg;
      a2[i] = p.yDeg;
    }
  }
  const flag = new Uint8Array(n - 1);
  for (let i = 0; i + 1 < n; i++) {
    const dt = (coarse.tMs[i + 1]! - coarse.tMs[i]!) / 1000;
    const r1 = Math.abs(a1[i + 1]! - a1[i]!) / dt;
    const r2 = Math.abs(a2[i + 1]! - a2[i]!) / dt;
    const elHi = Math.max(coarse.elevationDeg[i]!, coarse.elevationDeg[i + 1]!);
    const elLo = Math.min(coarse.elevationDeg[i]!, coarse.elevationDeg[i + 1]!);
    const nearLimit = elHi > m.elevationMaxDeg - 2 || elLo < m.elevationMinDeg + 2 || (m.mount === 'x-y' && elLo < 20);
    if (r1 > 0.5 * m.axis1RateDegS || r2 > 0.5 * m.axis2RateDegS || nearLimit) flag[i] = 1;
  }
  const fine: number[] = [];
  for (let i = 0; i + 1 < n; i++) {
    fine.push(coarse.tMs[i]!);
    if (flag[i] || (i > 0 && flag[i - 1]) || (i + 2 < n && flag[i + 1])) {
      for (let t = coarse.tMs[i]! + FINE_STEP_S * 1000; t < coarse.tMs[i + 1]!; t += FINE_STEP_S * 1000) fine.push(t);
    }
  }
  fine.push(coarse.tMs[n - 1]!);
  return fine.length === n ? coarse : sampleAt(target, site, fine);
}

/** Look angles at tMs by linear interpolation of the series (azimuth the short way round). */
export function pointingAt(s: PointingSeries, tMs: number): { azimuthDeg: number; elevationDeg: number } | null {
  const n = s.tMs.length;
  if (n === 0) return null;
  if (tMs <= s.tMs[0]!) return { azimuthDeg: s.azimuthDeg[0]!, elevationDeg: s.elevationDeg[0]! };
  if (tMs >= s.tMs[n - 1]!) return { azimuthDeg: s.azimuthDeg[n - 1]!, elevationDeg: s.elevationDeg[n - 1]! };
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (s.tMs[mid]! <= tMs) lo = mid;
    else hi = mid;
  }
  const f = (tMs - s.tMs[lo]!) / (s.tMs[hi]! - s.tMs[lo]!);
  let da = s.azimuthDeg[hi]! - s.azimuthDeg[lo]!;
  if (da > 180) da -= 360;
  else if (da < -180) da += 360;
  const az = (((s.azimuthDeg[lo]! + f * da) % 360) + 360) % 360;
  return { azimuthDeg: az, elevationDeg: s.elevationDeg[lo]! + f * (s.elevationDeg[hi]! - s.elevationDeg[lo]!) };
}
