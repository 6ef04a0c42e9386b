/**
 * Candidate tracks: the periods the solver may book inside each contact
 * window, with the bits each can carry.
 *
 * Rules (stated in full):
 *  - A spacecraft without track limits has one candidate per window: the
 *    whole window (the plain case of plan/schedule.ts).
 *  - With limits [minTrackS, maxTrackS], starts and ends fall on the grid
 *    span start + k * gridS, or on the window's AOS/LOS. All such periods of
 *    an allowed length are candidates while a window has at most
 *    maxCandidatesPerWindow of them (the full grid). A longer window keeps
 *    its edges, the grid points before AOS - set-up and after LOS + set-up
 *    (0, 1, 2 grid steps) of the other windows, maintenance periods and fixed
 *    bookings at its station, UTC midnights,
 *    and a coarser grid (a whole multiple of gridS); each point pairs with
 *    the next 8 points and with point + minTrackS and + maxTrackS (on the
 *    grid), within the length limits.
 *  - Bits of a track: the contact's drain profile (recorder.ts drainProfile:
 *    each 15-min volume bin flowing uniformly over its part of the data
 *    span) restricted to the track minus the tracking time the mechanics
 *    lose. Each kept piece carries C(b) - C(a) of the floored cumulative C
 *    (cumulativeDrainBits), so the pieces of a track add up exactly, and the
 *    whole window with no loss carries the contact's volumeBits.
 *  - Station rules: a window at a denied station (or not on the allow-list)
 *    has no candidates; an antenna is not offered to a candidate whose
 *    [start - set-up, end + set-up] meets one of its maintenance periods or
 *    fixed bookings (a whole-station maintenance period takes every antenna).
 *  - A candidate that carries no bits is dropped (no feed for the band, no
 *    link, priority 0, or all of it lost to the mechanics).
 */
import { drainProfile, type DrainSegment } from '../recorder.js';
import type { Contact } from '../types.js';
import { overlapMs, type Intervals } from './mechanics.js';
import { pointingAt, type PointingSeries } from './pointing.js';
import type { BookingRules, Candidate, SpacecraftRules } from './types.js';

const DAY_MS = 86_400_000;

/**
 * cumulativeDrainBits of a profile in O(log n): the segments are in time
 * order and disjoint, so at most one is partly sent at t.
 */
export class CumulativeDrain {
  readonly base: DrainSegment[];
  private ends: Float64Array;
  private prefix: Float64Array;
  constructor(base: DrainSegment[]) {
    this.base = base;
    this.ends = Float64Array.from(base.map((s) => s.endMs));
    this.prefix = new Float64Array(base.length + 1);
    base.forEach((s, i) => (this.prefix[i + 1] = this.prefix[i]! + s.bits));
  }
  at(t: number): number {
    const b = this.base;
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.ends[mid]! < t) lo = mid + 1;
      else hi = mid;
    }
    let full = this.prefix[lo]!;
    let k = lo;
    for (; k < b.length && b[k]!.endMs === t; k++) if (b[k]!.endMs > b[k]!.startMs) full += b[k]!.bits;
    const seg = b[k];
    if (seg && seg.startMs < t && t < seg.endMs) full += Math.floor((seg.bits * (t - seg.startMs)) / (seg.endMs - seg.startMs));
    return full;
  }
}

/** The drain profile of [startMs, endMs] of a contact, minus the lost intervals (see the head comment). */
export function trackProfile(contact: Contact, startMs: number, endMs: number, lost: Intervals, drain?: CumulativeDrain): DrainSegment[] {
  const link = contact.link;
  if (!link) return [];
  const cum = drain ?? new CumulativeDrain(drainProfile(link));
  const base = cum.base;
  // kept pieces: [startMs, endMs] minus lost
  const keep: number[] = [];
  let cur = startMs;
  for (let i = 0; i + 1 < lost.length; i += 2) {
    const a = lost[i]!;
    const b = lost[i + 1]!;
    if (b <= cur || a >= endMs) continue;
    if (a > cur) keep.push(cur, a);
    cur = Math.max(cur, b);
  }
  if (cur < endMs) keep.push(cur, endMs);
  const out: DrainSegment[] = [];
  for (let k = 0; k + 1 < keep.length; k += 2) {
    const a = keep[k]!;
    const b = keep[k + 1]!;
    for (const seg of base) {
      const s = Math.max(a, seg.startMs);
      const e = Math.min(b, seg.endMs);
      if (e <= s) continue;
      const bits = cum.at(e) - cum.at(s);
      if (bits > 0) out.push({ startMs: s, endMs: e, bits });
    }
  }
  // a whole window with nothing lost: the profile itself (also its zero-length pieces)
  if (lost.length === 0 && startMs <= link.dataStartMs && endMs >= link.dataEndMs) return base;
  return out;
}

export const profileBits = (p: readonly DrainSegment[]): number => p.reduce((s, x) => s + x.bits, 0);

export interface WindowInput {
  contactIndex: number;
  contact: Contact;
  priority: number;
  rules: SpacecraftRules | undefined;
  antennaCount: number;
  setupS: number;
  /** Tracking lost to the mechanics, and the pointing series (null without mechanics). */
  lost: Intervals;
  pointing: PointingSeries | null;
  /** AOS/LOS of the other windows at the same station. */
  stationEvents: readonly number[];
  /** [startMs, endMs, antenna (-1 = all)] triplets of maintenance and fixed bookings at the station. */
  blocked: readonly number[];
}

function stationAllowed(rules: SpacecraftRules | undefined, stationId: string): boolean {
  if (!rules) return true;
  if (rules.denyStations.includes(stationId)) return false;
  return rules.allowStations === null || rules.allowStations.includes(stationId);
}

/** Start/end pairs of a window (see the head comment); times sorted, deterministic. */
export function trackPeriods(
  aosMs: number,
  losMs: number,
  minS: number,
  maxS: number,
  gridS: number,
  spanStartMs: number,
  maxCount: number,
  events: readonly number[],
  setupS: number,
): { periods: [number, number][]; stepS: number } {
  const g = gridS * 1000;
  const minMs = minS * 1000;
  const maxMs = maxS * 1000;
  if (losMs - aosMs < minMs) return { periods: [], stepS: gridS };
  const gridPoints = (stepMs: number): number[] => {
    const pts = [aosMs];
    let t = spanStartMs + Math.ceil((aosMs - spanStartMs) / stepMs) * stepMs;
    if (t === aosMs) t += stepMs;
    for (; t < losMs; t += stepMs) pts.push(t);
    pts.push(losMs);
    return pts;
  };
  const pairs = (starts: readonly number[], ends: readonly number[]): [number, number][] => {
    const out: [number, number][] = [];
    for (const s of starts) for (const e of ends) if (e > s && e - s >= minMs && e - s <= maxMs) out.push([s, e]);
    return out;
  };
  const full = gridPoints(g);
  const fullCount = (() => {
    let c = 0;
    for (let i = 0; i < full.length; i++) {
      for (let j = i + 1; j < full.length; j++) {
        const d = full[j]! - full[i]!;
        if (d > maxMs) break;
        if (d >= minMs) c++;
      }
      if (c > maxCount) return c;
    }
    return c;
  })();
  if (fullCount <= maxCount) return { periods: pairs(full, full), stepS: gridS };
  // coarse grid plus event points; each point pairs with its next NEXT_POINTS points and with start + min / max
  const W = losMs - aosMs;
  const m = Math.max(2, Math.ceil(W / (g * Math.max(1, Math.floor(maxCount / (2 * NEXT_POINTS))))));
  const setupMs = setupS * 1000;
  const floorG = (t: number) => spanStartMs + Math.floor((t - spanStartMs) / g) * g;
  const ceilG = (t: number) => spanStartMs + Math.ceil((t - spanStartMs) / g) * g;
  const set = new Set(gridPoints(g * m));
  for (const ev of events) {
    if (ev === aosMs || ev === losMs) continue; // the window's own edges
    if (ev < aosMs - setupMs - 3 * g || ev > losMs + setupMs + 3 * g) continue;
    for (let k = 0; k <= 2; k++) {
      for (const t of [floorG(ev - setupMs) - k * g, ceilG(ev + setupMs) + k * g]) if (t > aosMs && t < losMs) set.add(t);
    }
  }
  for (let d = spanStartMs - (spanStartMs % DAY_MS); d < losMs; d += DAY_MS) if (d > aosMs && d < losMs) set.add(d);
  const pts = [...set].sort((a, b) => a - b);
  const seen = new Set<string>();
  const periods: [number, number][] = [];
  const add = (a: number, b: number) => {
    if (!(b > a) || b > losMs || b - a < minMs || b - a > maxMs) return;
    const key = `${a}:${b}`;
    if (seen.has(key)) return;
    seen.add(key);
    periods.push([a, b]);
  };
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i]!;
    for (let j = i + 1; j < pts.length && j <= i + NEXT_POINTS; j++) add(a, pts[j]!);
    add(a, a + Math.ceil(minMs / g) * g);
    add(a, a + Math.floor(maxMs / g) * g);
    add(a, Math.min(losMs, a + Math.floor(maxMs / g) * g));
  }
  periods.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  return { periods, stepS: gridS * m };
}

/** In a long window, how many following points each point pairs with. */
const NEXT_POINTS = 8;

/** Antennas free for [a, b] given the blocked triplets. */
function freeAntennas(k: number, a: number, b: number, blocked: readonly number[]): number[] {
  const out: number[] = [];
  for (let ant = 0; ant < k; ant++) {
    let free = true;
    for (let i = 0; i + 2 < blocked.length; i += 3) {
      const s = blocked[i]!;
      const e = blocked[i + 1]!;
      const which = blocked[i + 2]!;
      if ((which === -1 || which === ant) && s < b && a < e) {
        free = false;
        break;
      }
    }
    if (free) out.push(ant);
  }
  return out;
}

export interface CandidateSet {
  candidates: Candidate[];
  /** Track profile of each candidate (same order). */
  profiles: DrainSegment[][];
  /** Coarsest grid step used in a window, s. */
  coarsestStepS: number;
}

/** Candidates of every window (ids in input order). */
export function buildCandidates(windows: readonly WindowInput[], rules: BookingRules, spanStartMs: number, firstId = 0): CandidateSet {
  const candidates: Candidate[] = [];
  const profiles: DrainSegment[][] = [];
  let coarsest = rules.gridS;
  let id = firstId;
  for (const w of windows) {
    const c = w.contact;
    if (!stationAllowed(w.rules, c.stationId) || !c.link || !(w.priority > 0)) continue;
    let periods: [number, number][];
    if (!w.rules || w.rules.minTrackS === null) periods = [[c.aosMs, c.losMs]];
    else {
      const r = trackPeriods(c.aosMs, c.losMs, w.rules.minTrackS, w.rules.maxTrackS ?? Infinity, rules.gridS, spanStartMs, rules.maxCandidatesPerWindow, w.stationEvents, w.setupS);
      periods = r.periods;
      coarsest = Math.max(coarsest, r.stepS);
    }
    const setupMs = w.setupS * 1000;
    const drain = new CumulativeDrain(drainProfile(c.link));
    for (const [s, e] of periods) {
      const antennas = freeAntennas(w.antennaCount, s - setupMs, e + setupMs, w.blocked);
      if (antennas.length === 0) continue;
      const profile = trackProfile(c, s, e, w.lost, drain);
      const bits = profileBits(profile);
      if (!(bits > 0)) continue;
      const noLoss = w.lost.length === 0 ? bits : drain.at(e) - drain.at(s);
      candidates.push({
        id: id++,
        contactIndex: w.contactIndex,
        spacecraftId: c.spacecraftId,
        stationId: c.stationId,
        startMs: s,
        endMs: e,
        bits,
        mechanicsLostBits: noLoss - bits,
        mechanicsLostS: overlapMs(w.lost, s, e) / 1000,
        value: (w.priority * bits) / 1e9,
        priority: w.priority,
        startPointing: w.pointing ? pointingAt(w.pointing, s) : null,
        endPointing: w.pointing ? pointingAt(w.pointing, e) : null,
        antennas,
      });
      profiles.push(profile);
    }
  }
  return { candidates, profiles, coarsestStepS: coarsest };
}
