/**
 * Onboard recorder: how much data each spacecraft stores, loses and sends
 * over the span, given the contacts it is granted.
 *
 * Rules (an engineering model, no published source; stated here in full):
 *  - Units: whole bits throughout. Cumulative generation G(t) = floor(rate x
 *    on-time since the span start); each step generates G(t_end) - G(t_start),
 *    so the total over the span is exact and never drifts.
 *  - Generation runs at generationBps, always, or for `duty.onS` then idles
 *    `duty.offS`, repeating from the span start.
 *  - Drain: a contact can send at most its link volume, spread as a drain-rate
 *    profile: each 15-min volume bin's bits (ContactLink.volumeBinsBits) flow
 *    at a uniform rate over that bin's part of the data span [dataStartMs,
 *    dataEndMs]. Cumulative capacity is floored to whole bits and reaches the
 *    contact's volumeBits exactly at its data end.
 *  - Several contacts of one spacecraft at once (no one-station rule): the
 *    spacecraft sends one stream, so the capacity of a step is the largest
 *    capacity offered, and the step's downlink is credited to that contact.
 *  - What is sent is capped by what is stored (plus what is generated in the
 *    step). Order inside a step: send (oldest first, FIFO), then store the new
 *    data; when the recorder is full, new data is refused and counted lost (no
 *    overwrite of stored data).
 *  - Grid: fixed steps of stepS (default 10 s) from the span start, the last
 *    one cut at the span end. Inside one step generation is taken as uniform
 *    in time (for the age of the data).
 *  - Age: the generation time of every stored bit is tracked in chunks (one per
 *    step); the age of the oldest data at a downlink is the start of the first
 *    step in which the contact sends, minus the generation time of the oldest
 *    stored bit then. Initial fill counts as generated at the span start.
 *  - Mass balance, exact in whole bits:
 *      initialFill + generated = downlinked + stored(end) + lost.
 *    An initial fill above the capacity is lost at the start.
 *
 * Pure: no I/O.
 */
import type { Spacecraft, Span } from '../scenario/types.js';
import type { ScheduleResult } from './schedule.js';
import { VOLUME_BIN_MS, type Contact, type ContactLink, type PlanResult } from './types.js';

export const DEFAULT_RECORDER_STEP_S = 10;
export const DEFAULT_SERIES_STEP_S = 300;

export interface RecorderOptions {
  /** Simulation step, s (default 10). */
  stepS?: number;
  /** Spacing of the reported series, s, rounded to a multiple of stepS (default 300). */
  seriesStepS?: number;
}

export type RecorderSpec = NonNullable<Spacecraft['recorder']>;

/** One piece of a contact's drain profile: `bits` at a uniform rate over [startMs, endMs]. */
export interface DrainSegment {
  startMs: number;
  endMs: number;
  bits: number;
}

export interface RecorderPass {
  contactIndex: number;
  stationId: string;
  dataStartMs: number;
  dataEndMs: number;
  /** Link volume the contact could carry. */
  offeredBits: number;
  /** What it carried from the recorder. */
  downlinkedBits: number;
  /** Stored when the contact first sent (start of that step), bits. */
  backlogAtStartBits: number;
  /** Age of the oldest stored bit when the contact first sent, s; null when the store was empty or it never sent. */
  oldestAgeAtStartS: number | null;
  /** Stored at the end of the contact's last step, bits. */
  backlogAtEndBits: number;
}

export interface RecorderSeries {
  tMs: number[];
  storedBits: number[];
  /** Cumulative since the span start. */
  generatedBits: number[];
  downlinkedBits: number[];
  lostBits: number[];
  oldestAgeS: (number | null)[];
}

export interface RecorderTrack {
  spacecraftId: string;
  capacityBits: number;
  generationBps: number;
  duty: { onS: number; offS: number } | null;
  initialBits: number;
  generatedBits: number;
  downlinkedBits: number;
  lostBits: number;
  finalBits: number;
  /** Link volume offered by the contacts used. */
  offeredBits: number;
  peakBits: number;
  peakAtMs: number;
  firstOverflowMs: number | null;
  /** Largest age of the oldest data at any downlink, s. */
  maxOldestAgeAtDownlinkS: number | null;
  passes: RecorderPass[];
  series: RecorderSeries;
}

export interface RecorderResult {
  stepS: number;
  seriesStepS: number;
  /** 'scheduled' when only the schedule's taken windows drain, 'booked tracks' for a booking, else 'all contacts'. */
  contactsUsed: 'scheduled' | 'all contacts' | 'booked tracks';
  tracks: RecorderTrack[];
}

/** The drain profile of a contact (see the head comment). */
export function drainProfile(link: ContactLink): DrainSegment[] {
  const out: DrainSegment[] = [];
  link.volumeBinsBits.forEach((bits, i) => {
    if (bits <= 0) return;
    const b0 = link.binStartMs + i * VOLUME_BIN_MS;
    const b1 = b0 + VOLUME_BIN_MS;
    let s = Math.max(b0, link.dataStartMs);
    let e = Math.min(b1, link.dataEndMs);
    if (e < s) {
      // the bin holds bits but misses the data span (cannot happen with midpoint binning): send at the nearest point
      s = e = Math.min(Math.max(b0, link.dataStartMs), link.dataEndMs);
    }
    out.push({ startMs: s, endMs: e, bits });
  });
  return out;
}

/** Whole bits the profile can have sent by tMs (floored; exact total after the last segment). */
export function cumulativeDrainBits(profile: readonly DrainSegment[], tMs: number): number {
  let full = 0;
  let partial = 0;
  for (const seg of profile) {
    if (tMs >= seg.endMs && (seg.endMs > seg.startMs || tMs > seg.startMs)) full += seg.bits;
    else if (tMs > seg.startMs && seg.endMs > seg.startMs) partial += (seg.bits * (tMs - seg.startMs)) / (seg.endMs - seg.startMs);
  }
  return full + Math.floor(partial);
}

/** Seconds of generation from the span start to elapsedMs (duty cycle applied). */
export function onTimeS(elapsedMs: number, duty: RecorderSpec['duty']): number {
  const eS = Math.max(0, elapsedMs) / 1000;
  if (!duty) return eS;
  const cycle = duty.onS + duty.offS;
  const full = Math.floor(eS / cycle);
  const rem = eS - full * cycle;
  return full * duty.onS + Math.min(rem, duty.onS);
}

interface Chunk {
  /** Generation time of the chunk's first and one-past-last bit. */
  t0Ms: number;
  t1Ms: number;
  bits: number;
  /** Bits already sent from the front of the chunk. */
  sent: number;
}

interface Drain {
  contactIndex: number;
  contact: Contact;
  profile: DrainSegment[];
  startMs: number;
  endMs: number;
  pass: RecorderPass;
  started: boolean;
}

/** Simulates one recorder over the span with the given contacts of its spacecraft. */
export function simulateRecorder(
  spacecraftId: string,
  recorder: RecorderSpec,
  contacts: readonly { contactIndex: number; contact: Contact; profile?: DrainSegment[] }[],
  span: Span,
  opts: RecorderOptions = {},
): RecorderTrack {
  const stepS = opts.stepS ?? DEFAULT_RECORDER_STEP_S;
  if (!(stepS > 0)) throw new Error('simulateRecorder: stepS must be > 0');
  const stepMs = stepS * 1000;
  const seriesEvery = Math.max(1, Math.round((opts.seriesStepS ?? DEFAULT_SERIES_STEP_S) / stepS));
  const cap = Math.round(recorder.capacityBits);
  const initial = Math.round(recorder.initialFillBits);
  const gen = (tMs: number) => Math.floor(recorder.generationBps * onTimeS(tMs - span.startMs, recorder.duty));

  const drains: Drain[] = contacts
    .filter((c) => c.contact.link && c.contact.link.volumeBits > 0)
    .map(({ contactIndex, contact, profile: given }) => {
      const link = contact.link!;
      const profile = given ?? drainProfile(link);
      return {
        contactIndex,
        contact,
        profile,
        startMs: Math.min(...profile.map((p) => p.startMs)),
        endMs: Math.max(...profile.map((p) => p.endMs)),
        started: false,
        pass: {
          contactIndex,
          stationId: contact.stationId,
          dataStartMs: link.dataStartMs,
          dataEndMs: link.dataEndMs,
          offeredBits: link.volumeBits,
          downlinkedBits: 0,
          backlogAtStartBits: 0,
          oldestAgeAtStartS: null,
          backlogAtEndBits: 0,
        },
      };
    })
    .sort((a, b) => a.startMs - b.startMs || a.contactIndex - b.contactIndex);

  const queue: Chunk[] = [];
  let qHead = 0;
  let stored = Math.min(initial, cap);
  let lost = initial - stored;
  if (stored > 0) queue.push({ t0Ms: span.startMs, t1Ms: span.startMs, bits: stored, sent: 0 });
  let generated = 0;
  let downlinked = 0;
  let peakBits = stored;
  let peakAtMs = span.startMs;
  let firstOverflowMs: number | null = lost > 0 ? span.startMs : null;
  const series: RecorderSeries = { tMs: [], storedBits: [], generatedBits: [], downlinkedBits: [], lostBits: [], oldestAgeS: [] };

  const oldestGenMs = (): number | null => {
    while (qHead < queue.length && queue[qHead]!.sent >= queue[qHead]!.bits) qHead++;
    const c = queue[qHead];
    if (!c) return null;
    return c.t0Ms + ((c.t1Ms - c.t0Ms) * c.sent) / c.bits;
  };
  const record = (tMs: number) => {
    const g = oldestGenMs();
    series.tMs.push(tMs);
    series.storedBits.push(stored);
    series.generatedBits.push(generated);
    series.downlinkedBits.push(downlinked);
    series.lostBits.push(lost);
    series.oldestAgeS.push(g === null ? null : (tMs - g) / 1000);
  };
  record(span.startMs);

  let next = 0;
  const active: Drain[] = [];
  let genPrev = gen(span.startMs);
  for (let k = 0; ; k++) {
    const a = span.startMs + k * stepMs;
    if (a >= span.endMs) break;
    const b = Math.min(a + stepMs, span.endMs);
    while (next < drains.length && drains[next]!.startMs <= b) active.push(drains[next++]!);
    // capacity of the step: the largest any contact in progress offers
    let capStep = 0;
    let by: Drain | undefined;
    for (const d of active) {
      const c = cumulativeDrainBits(d.profile, b) - cumulativeDrainBits(d.profile, a);
      if (c > capStep) {
        capStep = c;
        by = d;
      }
    }
    const genNow = gen(b);
    const g = genNow - genPrev;
    genPrev = genNow;
    generated += g;

    if (by && !by.started) {
      by.started = true;
      by.pass.backlogAtStartBits = stored;
      const t = oldestGenMs();
      by.pass.oldestAgeAtStartS = t === null ? null : (a - t) / 1000;
    }
    const d = Math.min(capStep, stored + g);
    const dOld = Math.min(d, stored);
    // send dOld from the front of the queue
    let rest = dOld;
    while (rest > 0) {
      const c = queue[qHead]!;
      const take = Math.min(rest, c.bits - c.sent);
      c.sent += take;
      rest -= take;
      if (c.sent >= c.bits) qHead++;
    }
    stored -= dOld;
    const dNew = d - dOld;
    const fresh = g - dNew;
    const accepted = Math.min(fresh, cap - stored);
    if (fresh > accepted) {
      lost += fresh - accepted;
      if (firstOverflowMs === null) firstOverflowMs = a;
    }
    if (accepted > 0) {
      const t0 = a + ((b - a) * dNew) / g;
      const t1 = a + ((b - a) * (dNew + accepted)) / g;
      queue.push({ t0Ms: t0, t1Ms: t1, bits: accepted, sent: 0 });
    }
    stored += accepted;
    downlinked += d;
    if (by) by.pass.downlinkedBits += d;
    if (stored > peakBits) {
      peakBits = stored;
      peakAtMs = b;
    }
    // close contacts that have ended
    for (let i = active.length - 1; i >= 0; i--) {
      const dr = active[i]!;
      if (dr.endMs <= b) {
        dr.pass.backlogAtEndBits = stored;
        active.splice(i, 1);
      }
    }
    if (qHead > 4096 && qHead * 2 > queue.length) {
      queue.splice(0, qHead);
      qHead = 0;
    }
    if ((k + 1) % seriesEvery === 0 || b === span.endMs) record(b);
  }
  for (const dr of active) dr.pass.backlogAtEndBits = stored;

  const passes = drains.map((d) => d.pass).sort((x, y) => x.dataStartMs - y.dataStartMs || x.contactIndex - y.contactIndex);
  const ages = passes.map((p) => p.oldestAgeAtStartS).filter((v): v is number => v !== null);
  return {
    spacecraftId,
    capacityBits: cap,
    generationBps: recorder.generationBps,
    duty: recorder.duty ?? null,
    initialBits: initial,
    generatedBits: generated,
    downlinkedBits: downlinked,
    lostBits: lost,
    finalBits: stored,
    offeredBits: drains.reduce((s, d) => s + d.pass.offeredBits, 0),
    peakBits,
    peakAtMs,
    firstOverflowMs,
    maxOldestAgeAtDownlinkS: ages.length > 0 ? Math.max(...ages) : null,
    passes,
    series,
  };
}

/**
 * Every spacecraft with a recorder, drained by its taken windows when a
 * schedule is given, else by all its contacts.
 */
export function simulateRecorders(
  plan: PlanResult,
  spacecraft: readonly Spacecraft[],
  schedule?: ScheduleResult,
  opts: RecorderOptions = {},
  /** Drain profile per contact index, in place of the contact's own (booked track periods). */
  profiles?: ReadonlyMap<number, DrainSegment[]>,
): RecorderResult {
  const allowed = schedule ? new Set(schedule.taken.map((t) => t.contactIndex)) : undefined;
  const tracks: RecorderTrack[] = [];
  for (const sc of spacecraft) {
    if (!sc.recorder) continue;
    const contacts = plan.contacts
      .map((contact, contactIndex) => {
        const profile = profiles?.get(contactIndex);
        return profile ? { contact, contactIndex, profile } : { contact, contactIndex };
      })
      .filter((c) => c.contact.spacecraftId === sc.id && (!allowed || allowed.has(c.contactIndex)));
    tracks.push(simulateRecorder(sc.id, sc.recorder, contacts, plan.span, opts));
  }
  const stepS = opts.stepS ?? DEFAULT_RECORDER_STEP_S;
  return {
    stepS,
    seriesStepS: Math.max(1, Math.round((opts.seriesStepS ?? DEFAULT_SERIES_STEP_S) / stepS)) * stepS,
    contactsUsed: profiles ? 'booked tracks' : schedule ? 'scheduled' : 'all contacts',
    tracks,
  };
}
