/**
 * Equator-of-date helpers shared by the Moon and fixed-sky targets: the rotation from
 * the J2000 mean equator (EQJ) to the true equator and equinox of date (EQD), and the
 * offset that turns our GMST into Greenwich apparent sidereal time (GAST).
 *
 * Model: astronomy-engine 2.1.19 `Rotation_EQJ_EQD` (IAU 2006 precession, IAU 2000B
 * nutation) and `SiderealTime` (GAST from the Earth rotation angle plus the equation of
 * the equinoxes). EQD rotated by GAST about z gives the same pseudo-Earth-fixed frame as
 * TEME rotated by GMST (frames.ts): both are "true equator of date", differing only in
 * where x points (true vs mean equinox). `siderealOffsetRad` = GAST - GMST(IAU-1982,
 * satellite.js) is the equation of the equinoxes (|.| < 1.2 s of time) plus the tiny
 * difference between the two GMST expressions; it changes slowly (days), so callers
 * sample it coarsely. UT1 = UTC (astronomy-engine does the same).
 * Units: epoch ms in; radians, unitless matrices out.
 */
import { astronomyLib } from '../../lazy.js';
import { gmstRadAt } from '../frames.js';

/** Unix ms of J2000.0 as astronomy-engine counts UT days: 2000-01-01T12:00:00 UTC. */
const J2000_UNIX_MS = 946_728_000_000;
const MS_PER_DAY = 86_400_000;

/** astronomy-engine's time argument: UT days since J2000. */
export function astroDays(tMs: number): number {
  return (tMs - J2000_UNIX_MS) / MS_PER_DAY;
}

/** EQJ -> EQD rotation at tMs, row-major 3x3 (out[3*row + col]), applied as v' = M v. */
export function eqjToEqdMatrix(tMs: number, out: Float64Array): void {
  const rot = astronomyLib().Rotation_EQJ_EQD(astroDays(tMs)).rot;
  // astronomy-engine applies rot as v'_j = sum_i v_i rot[i][j] (RotateVector).
  for (let row = 0; row < 3; row++) {
    for (let col = 0; col < 3; col++) out[3 * row + col] = rot[col]![row]!;
  }
}

/** GAST (astronomy-engine) minus GMST (satellite.js), rad, wrapped to (-pi, pi]. */
export function siderealOffsetRad(tMs: number): number {
  const gastRad = (astronomyLib().SiderealTime(astroDays(tMs)) * Math.PI) / 12;
  let d = gastRad - gmstRadAt(tMs);
  while (d > Math.PI) d -= 2 * Math.PI;
  while (d <= -Math.PI) d += 2 * Math.PI;
  return d;
}

/** out = M v for a row-major 3x3 M; vector indices 0..2 of v and out (may not alias). */
export function rotate3(m: Float64Array, v: ArrayLike<number>, out: Float64Array, outOffset = 0): void {
  const x = v[0]!;
  const y = v[1]!;
  const z = v[2]!;
  out[outOffset] = m[0]! * x + m[1]! * y + m[2]! * z;
  out[outOffset + 1] = m[3]! * x + m[4]! * y + m[5]! * z;
  out[outOffset + 2] = m[6]! * x + m[7]! * y + m[8]! * z;
}

/** Node spacing of EqdTable, ms (nutation's shortest large term has a 13.7-day period). */
export const EQD_TABLE_STEP_MS = 6 * 3_600_000;

/**
 * EQJ -> EQD rotation and the GAST - GMST offset tabulated over a span every
 * EQD_TABLE_STEP_MS, linearly interpolated (element by element; the matrix stays
 * orthonormal to ~1e-12 over a node interval: error well below 1 mas), with the
 * rotation's time derivative from the node difference. Allocation-free lookups.
 */
export class EqdTable {
  private readonly t0Ms: number;
  private readonly n: number;
  private readonly m: Float64Array;
  private readonly off: Float64Array;

  constructor(startMs: number, endMs: number) {
    this.t0Ms = startMs - EQD_TABLE_STEP_MS;
    this.n = Math.ceil((endMs + EQD_TABLE_STEP_MS - this.t0Ms) / EQD_TABLE_STEP_MS) + 1;
    this.m = new Float64Array(9 * this.n);
    this.off = new Float64Array(this.n);
    const tmp = new Float64Array(9);
    for (let k = 0; k < this.n; k++) {
      const t = this.t0Ms + k * EQD_TABLE_STEP_MS;
      eqjToEqdMatrix(t, tmp);
      this.m.set(tmp, 9 * k);
      this.off[k] = siderealOffsetRad(t);
    }
  }

  /** M(t) into m, dM/dt (per s) into mDot; returns GAST - GMST at t, rad. */
  at(tMs: number, m: Float64Array, mDot: Float64Array): number {
    const x = (tMs - this.t0Ms) / EQD_TABLE_STEP_MS;
    const k = Math.min(this.n - 2, Math.max(0, Math.floor(x)));
    const s = x - k;
    const a = 9 * k;
    const b = a + 9;
    const tab = this.m;
    for (let i = 0; i < 9; i++) {
      const ma = tab[a + i]!;
      const mb = tab[b + i]!;
      m[i] = ma + s * (mb - ma);
      mDot[i] = (mb - ma) / (EQD_TABLE_STEP_MS / 1000);
    }
    return this.off[k]! + s * (this.off[k + 1]! - this.off[k]!);
  }
}
