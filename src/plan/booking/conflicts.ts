/**
 * Which candidate tracks exclude each other (the feasibility rules every
 * solver and the checks share):
 *  - one antenna: for every pair of tracks a, b on it (a starting first, or
 *    the lower id at equal starts), b starts no earlier than a's end plus
 *    the station's set-up plus the slew from a's end pointing to b's start
 *    pointing (mechanics.ts slewTimeS; 0 without mechanics);
 *  - one spacecraft: two of its tracks do not overlap in time at one
 *    station, nor at two stations when oneStationAtATime is set.
 */
import { slewTimeS } from './mechanics.js';
import type { AntennaMechanics, Candidate } from './types.js';

export interface ConflictContext {
  setupMs: ReadonlyMap<string, number>;
  mechanics: ReadonlyMap<string, AntennaMechanics>;
  oneStationAtATime: boolean;
}

const first = (a: Candidate, b: Candidate): boolean => a.startMs < b.startMs || (a.startMs === b.startMs && a.id < b.id);

/** Slew from a's end to b's start, s (0 without mechanics or pointing). */
export function slewBetweenS(a: Candidate, b: Candidate, ctx: ConflictContext): number {
  const m = ctx.mechanics.get(a.stationId);
  if (!m || !a.endPointing || !b.startPointing) return 0;
  return slewTimeS(a.endPointing, b.startPointing, m);
}

/** True when a and b can share one antenna (same station assumed). */
export function antennaCompatible(x: Candidate, y: Candidate, ctx: ConflictContext): boolean {
  const [a, b] = first(x, y) ? [x, y] : [y, x];
  const setup = ctx.setupMs.get(a.stationId) ?? 0;
  if (a.endMs + setup > b.startMs) return false;
  return a.endMs + setup + slewBetweenS(a, b, ctx) * 1000 <= b.startMs;
}

/** True when the spacecraft rule forbids taking both. */
export function spacecraftConflict(a: Candidate, b: Candidate, ctx: ConflictContext): boolean {
  if (a.spacecraftId !== b.spacecraftId) return false;
  if (a.stationId !== b.stationId && !ctx.oneStationAtATime) return false;
  return a.startMs < b.endMs && b.startMs < a.endMs;
}

/** Largest slew a station's antennas can need, s (bound used to find neighbours). */
export function maxSlewS(m: AntennaMechanics | undefined): number {
  if (!m) return 0;
  return m.mount === 'el-az'
    ? Math.max(slewTimeS({ azimuthDeg: 0, elevationDeg: 0 }, { azimuthDeg: 180, elevationDeg: 0 }, m), slewTimeS({ azimuthDeg: 0, elevationDeg: 0 }, { azimuthDeg: 0, elevationDeg: 90 }, m))
    : slewTimeS({ azimuthDeg: 90, elevationDeg: 0.001 }, { azimuthDeg: 270, elevationDeg: 0.001 }, m) + slewTimeS({ azimuthDeg: 0, elevationDeg: 0.001 }, { azimuthDeg: 180, elevationDeg: 0.001 }, m);
}
