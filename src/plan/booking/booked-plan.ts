/**
 * The plan as a booking leaves it: one contact per booked track, cut to the
 * track period, with the bits the track carries (its drain profile binned
 * into the 15-minute volume bins; the expected volume in each bin scaled by
 * the share of that bin's volume the track keeps), and the recorders drained by exactly
 * those profiles, so the booking and the recorder simulation agree to the bit.
 */
import type { Spacecraft } from '../../scenario/types.js';
import { simulateRecorders, type DrainSegment, type RecorderResult } from '../recorder.js';
import { VOLUME_BIN_MS, type Contact, type PlanResult } from '../types.js';
import type { BookingResult } from './solve.js';

function clipContact(c: Contact, startMs: number, endMs: number, profile: readonly DrainSegment[]): Contact {
  const link = c.link!;
  const bits = profile.reduce((s, p) => s + p.bits, 0);
  const binStartMs = link.binStartMs + Math.floor((startMs - link.binStartMs) / VOLUME_BIN_MS) * VOLUME_BIN_MS;
  const nBins = Math.max(1, Math.ceil((endMs - binStartMs) / VOLUME_BIN_MS));
  const bins = new Array<number>(nBins).fill(0);
  for (const p of profile) {
    const k = Math.min(nBins - 1, Math.max(0, Math.floor((p.startMs - binStartMs) / VOLUME_BIN_MS)));
    bins[k]! += p.bits;
  }
  const first = profile.length > 0 ? profile[0]!.startMs : startMs;
  const last = profile.length > 0 ? profile[profile.length - 1]!.endMs : startMs;
  const { ratePieces, expectedRatePieces, expectedVolumeBits, expectedVolumeBinsBits, expectedVolumeBoundBits, ...rest } = link;
  // rate pieces (for unique volume) cut to the times the track sends
  const cut = (src: readonly number[]): number[] => {
    const pieces: number[] = [];
    for (let i = 0; i + 2 < src.length; i += 3) {
      for (const p of profile) {
        const a = Math.max(src[i]!, p.startMs);
        const b = Math.min(src[i + 1]!, p.endMs);
        if (b > a) pieces.push(a, b, src[i + 2]!);
      }
    }
    return pieces;
  };
  // the expected volume: each bin's expected bits in the share of that bin's volume the track keeps
  const expected: Partial<typeof link> = {};
  if (expectedVolumeBinsBits) {
    const offset = Math.round((binStartMs - link.binStartMs) / VOLUME_BIN_MS);
    const eb = bins.map((b, k) => {
      const whole = link.volumeBinsBits[offset + k] ?? 0;
      return whole > 0 ? Math.floor(((expectedVolumeBinsBits[offset + k] ?? 0) * b) / whole) : 0;
    });
    const total = eb.reduce((a, b) => a + b, 0);
    expected.expectedVolumeBinsBits = eb;
    expected.expectedVolumeBits = total;
    if (expectedVolumeBoundBits !== undefined && expectedVolumeBits) expected.expectedVolumeBoundBits = Math.ceil((expectedVolumeBoundBits * total) / expectedVolumeBits);
  }
  if (expectedRatePieces) expected.expectedRatePieces = cut(expectedRatePieces);
  const { otherLinks: _others, ...whole } = c; // the other radios' volumes are for the whole window
  return {
    ...whole,
    aosMs: startMs,
    losMs: endMs,
    aosClipped: c.aosClipped && startMs === c.aosMs,
    losClipped: c.losClipped && endMs === c.losMs,
    durationS: (endMs - startMs) / 1000,
    link: { ...rest, volumeBits: bits, dataStartMs: first, dataEndMs: last, binStartMs, volumeBinsBits: bins, ...(ratePieces ? { ratePieces: cut(ratePieces) } : {}), ...expected },
  };
}

export interface BookedPlan {
  plan: PlanResult;
  recorders: RecorderResult;
}

export function bookedPlan(plan: PlanResult, booking: BookingResult, spacecraft: readonly Spacecraft[]): BookedPlan {
  const contacts = booking.tracks.map((t, i) => clipContact(plan.contacts[t.candidate.contactIndex]!, t.candidate.startMs, t.candidate.endMs, booking.profiles[i]!));
  const profiles = new Map(booking.profiles.map((p, i) => [i, p]));
  const booked: PlanResult = { ...plan, contacts };
  return { plan: booked, recorders: simulateRecorders(booked, spacecraft, undefined, {}, profiles) };
}
