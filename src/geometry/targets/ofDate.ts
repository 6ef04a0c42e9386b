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
