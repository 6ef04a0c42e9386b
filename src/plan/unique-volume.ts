/**
 * The unique-volume rule: a spacecraft radio sends one stream, so its data counts once
 * however many stations receive it at the same time.
 *
 * Rule (ours, stated in full): at each instant the spacecraft's data is credited to the
 * best station in contact then, the one whose link supports the highest rate; the
 * spacecraft's volume is the integral of that largest rate over time. Equivalently, for
 * each cluster of overlapping windows (a chain of windows of the spacecraft, each
 * starting before the ones before it have all ended) the volume is the integral of the
 * maximum of the contacts' rate step functions (ContactLink.ratePieces, the same pieces
 * the per-contact volumes integrate); a window overlapping no other keeps its own volume
 * and its own 15-minute bins. Hence, per spacecraft:
 *   unique volume <= station-sum volume, equal where no two windows overlap;
 *   contact time = the length of the union of its windows (<= the span).
 * A station's own volume (per contact, per station-day) stays what that station can
 * receive: only totals across stations use this rule.
 * Whole bits: the cluster's 15-minute bins are rounded by their running sum
 * (wholeBitBins), then capped by the cluster's station-sum.
 * Expected volume (ContactLink.expectedVolumeBits; the volume where a contact has none)
 * counted once by the same rule on the expected rate (ContactLink.expectedRatePieces): at
 * each instant the station with the highest expected rate. That is the expected volume of
 * always using that station, a lower bound on the mean of the best station draw by draw of
 * the weather (stations' weather is not modelled jointly).
 * Pure: no I/O.
 */
import { VOLUME_BIN_MS, type Contact } from './types.js';

export interface UniqueVolume {
  spacecraftId: string;
  /** The data counted once (best station at each instant), whole bits. */
  volumeBits: number;
  /** The plain sum of the contacts' volumes (simultaneous reception counted at each station). */
  stationSumBits: number;
  /** Length of the union of the spacecraft's windows, s. */
  contactTimeS: number;
  /** Sum of the window durations over all stations, s. */
  stationSumContactTimeS: number;
  /** Unique volume per absolute 15-minute UTC bin: bin start ms -> whole bits. */
  binsBits: Map<number, number>;
  /** The expected volume counted once (see the head), its station-sum and its bins, whole bits. */
  expectedVolumeBits: number;
  stationSumExpectedBits: number;
  expectedBinsBits: Map<number, number>;
}

const expectedOf = (c: Contact): number => c.link?.expectedVolumeBits ?? c.link?.volumeBits ?? 0;

/**
 * Integral of max over contacts of their rate pieces (or, with expected, their expected-rate
 * pieces), into absolute 15-min bins (fractional bits): binKeys[0 .. n - 1] ascending with
 * their bits in binBits, n returned. The elementary intervals come in time order, so each
 * bin's bits are summed in that order from 0, as a running sum per bin would.
 */
let binKeys = new Float64Array(64);
let binBits = new Float64Array(64);
function maxRateBins(cluster: readonly Contact[], expected = false): number {
  const lists: number[][] = [];
  let count = 0;
  let minMs = Infinity;
  let maxMs = -Infinity;
  for (const c of cluster) {
    const p = expected ? c.link?.expectedRatePieces : c.link?.ratePieces;
    if (!p) {
      const bits = expected ? (c.link?.expectedVolumeBits ?? 0) : (c.link?.volumeBits ?? 0);
      if (bits > 0) throw new Error(`unique volume: contact of ${c.spacecraftId} at ${c.stationId} overlaps another but has no rate pieces (a bug)`);
      continue;
    }
    lists.push(p);
    for (let i = 0; i < p.length; i += 3) {
      minMs = Math.min(minMs, p[i]!, p[i + 1]!);
      maxMs = Math.max(maxMs, p[i]!, p[i + 1]!);
    }
    count += (2 * p.length) / 3;
  }
  if (count === 0) return 0;
  // every piece's ends and every 15-minute boundary inside, in one sorted list
  const first = Math.floor(minMs / VOLUME_BIN_MS) * VOLUME_BIN_MS;
  let boundaries = 0;
  for (let e = first + VOLUME_BIN_MS; e < maxMs; e += VOLUME_BIN_MS) boundaries++;
  const edges = new Float64Array(count + boundaries);
  let n = 0;
  for (const p of lists) {
    for (let i = 0; i < p.length; i += 3) {
      edges[n++] = p[i]!;
      edges[n++] = p[i + 1]!;
    }
  }
  for (let e = first + VOLUME_BIN_MS; e < maxMs; e += VOLUME_BIN_MS) edges[n++] = e;
  edges.sort();
  const ptr = new Int32Array(lists.length);
  let nBins = 0;
  let curBin = Number.NaN;
  let curBits = 0;
  for (let k = 0; k + 1 < edges.length; k++) {
    const a = edges[k]!;
    const b = edges[k + 1]!;
    if (!(b > a)) continue;
    const mid = 0.5 * (a + b);
    let best = 0;
    for (let j = 0; j < lists.length; j++) {
      const p = lists[j]!;
      let i = ptr[j]!;
      while (i < p.length && p[i + 1]! <= mid) i += 3;
      ptr[j] = i;
      if (i < p.length && p[i]! <= mid && p[i + 2]! > best) best = p[i + 2]!;
    }
    if (best <= 0) continue;
    const bin = Math.floor(mid / VOLUME_BIN_MS) * VOLUME_BIN_MS;
    if (bin !== curBin) {
      if (nBins > 0) binBits[nBins - 1] = curBits;
      if (nBins === binKeys.length) {
        const keys = new Float64Array(2 * nBins);
        keys.set(binKeys);
        binKeys = keys;
        const bits = new Float64Array(2 * nBins);
        bits.set(binBits);
        binBits = bits;
      }
      binKeys[nBins++] = bin;
      curBin = bin;
      curBits = 0;
    }
    curBits = curBits + (best * (b - a)) / 1000;
  }
  if (nBins > 0) binBits[nBins - 1] = curBits;
  return nBins;
}

function addBins(into: Map<number, number>, binStartMs: number, bins: readonly number[]): void {
  for (let i = 0; i < bins.length; i++) {
    const bits = bins[i]!;
    if (bits === 0) continue;
    const t = binStartMs + i * VOLUME_BIN_MS;
    into.set(t, (into.get(t) ?? 0) + bits);
  }
}

/** Whole bits of a cluster's fractional bins (binKeys / binBits, n of them) added into `into`, capped by the cluster's station-sum; returns their total. */
function onceInto(into: Map<number, number>, n: number, stationSumBits: number): number {
  // wholeBitBins of the bins in time order, inline
  let cum = 0;
  let prevRounded = 0;
  let total = 0;
  for (let k = 0; k < n; k++) {
    cum += binBits[k]!;
    const r = Math.round(cum);
    const wholeBits = r - prevRounded;
    prevRounded = r;
    // cap by the station-sum (rounding of whole bits could otherwise add a bit)
    const bits = Math.min(wholeBits, stationSumBits - total);
    total += bits;
    if (bits !== 0) {
      const key = binKeys[k]!;
      into.set(key, (into.get(key) ?? 0) + bits);
    }
  }
  return total;
}

/** One spacecraft's unique volume from its contacts (any order). */
export function uniqueVolumeOf(spacecraftId: string, contacts: readonly Contact[]): UniqueVolume {
  const list = contacts.filter((c) => c.spacecraftId === spacecraftId).sort((a, b) => a.aosMs - b.aosMs);
  const out: UniqueVolume = {
    spacecraftId,
    volumeBits: 0,
    stationSumBits: 0,
    contactTimeS: 0,
    stationSumContactTimeS: 0,
    binsBits: new Map(),
    expectedVolumeBits: 0,
    stationSumExpectedBits: 0,
    expectedBinsBits: new Map(),
  };
  let i = 0;
  while (i < list.length) {
    // one cluster of overlapping windows
    let reachMs = list[i]!.losMs;
    let j = i + 1;
    while (j < list.length && list[j]!.aosMs < reachMs) {
      reachMs = Math.max(reachMs, list[j]!.losMs);
      j++;
    }
    const cluster = list.slice(i, j);
    out.contactTimeS += (reachMs - cluster[0]!.aosMs) / 1000;
    let sum = 0;
    let expectedSum = 0;
    for (const c of cluster) {
      out.stationSumContactTimeS += c.durationS;
      sum += c.link?.volumeBits ?? 0;
      expectedSum += expectedOf(c);
    }
    out.stationSumBits += sum;
    out.stationSumExpectedBits += expectedSum;
    if (cluster.length === 1) {
      const l = cluster[0]!.link;
      if (l) {
        out.volumeBits += l.volumeBits;
        addBins(out.binsBits, l.binStartMs, l.volumeBinsBits);
        out.expectedVolumeBits += expectedOf(cluster[0]!);
        addBins(out.expectedBinsBits, l.binStartMs, l.expectedVolumeBinsBits ?? l.volumeBinsBits);
      }
    } else {
      out.volumeBits += onceInto(out.binsBits, maxRateBins(cluster), sum);
      const withExpected = cluster.some((c) => c.link?.expectedRatePieces !== undefined);
      out.expectedVolumeBits += withExpected ? onceInto(out.expectedBinsBits, maxRateBins(cluster, true), expectedSum) : onceInto(out.expectedBinsBits, maxRateBins(cluster), sum);
    }
    i = j;
  }
  return out;
}

/** Unique volumes of every spacecraft, in the given order. */
export function uniqueVolumes(spacecraftIds: readonly string[], contacts: readonly Contact[]): UniqueVolume[] {
  const bySc = new Map<string, Contact[]>();
  for (const c of contacts) {
    const l = bySc.get(c.spacecraftId);
    if (l) l.push(c);
    else bySc.set(c.spacecraftId, [c]);
  }
  return spacecraftIds.map((id) => uniqueVolumeOf(id, bySc.get(id) ?? []));
}

/** Unique bits (or, with expected, the expected volume counted once) of all spacecraft whose bin starts in [startMs, endMs). */
export function uniqueBitsIn(volumes: readonly UniqueVolume[], startMs: number, endMs: number, expected = false): number {
  let s = 0;
  for (const v of volumes) for (const [t, b] of expected ? v.expectedBinsBits : v.binsBits) if (t >= startMs && t < endMs) s += b;
  return s;
}
