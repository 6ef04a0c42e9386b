/**
 * Contacts as columns: a batch's contacts packed by the plan worker into a few typed
 * arrays (numbers, flags, 15-minute bins, MODCOD times; ids as indices into one string
 * table) that cross to the main thread as transferable buffers, and read there through
 * small view objects with the Contact and ContactLink shape.
 *
 * Why: a contact that crosses threads as an object graph weighs about 1.2 kB on the main
 * thread (every number of an object is a heap number of its own); as columns it weighs
 * about 0.38 kB (leo50: 335 B of columns, 42 B of views), and the main thread of a
 * 1,000-spacecraft week holds 800,000 of them.
 *
 * Only for plans whose contacts the main thread reads and never changes (every window
 * shown as found: no schedule, no booking, no shard file): a view has getters only, so an
 * assignment to it throws instead of being lost. Every number is stored as the float64 it
 * was, so whatever reads a view gets the same values, bit for bit, as from the object.
 * The rate step functions (ContactLink.ratePieces, expectedRatePieces) are left out: only
 * the unique volumes read them, and the worker has made those. A contact's other radios
 * (otherLinks) cross as plain objects, being rare.
 */
import type { Contact, ContactLink } from './types.js';

/** Numbers kept per contact, in this order (PackedContact and PackedLink read them by these offsets). */
const AOS = 0;
const LOS = 1;
const TCA = 2;
const MAX_EL = 3;
const AOS_AZ = 4;
const LOS_AZ = 5;
const AOS_EL = 6;
const LOS_EL = 7;
const DURATION = 8;
const AOS_TX = 9;
const LOS_TX = 10;
const LIGHT_TIME = 11;
const VOLUME = 12;
const DATA_START = 13;
const DATA_END = 14;
const CLOSED = 15;
const WORST_MARGIN = 16;
const WORST_AT = 17;
const WORST_EL = 18;
const PEAK_RATE = 19;
const SAMPLES = 20;
const BIN_START = 21;
const EXPECTED = 22;
const EXPECTED_BOUND = 23;
export const PACK_NUMBERS = 24;

/** Flag bits: which optional fields a contact has, and its booleans. */
const HAS_AOS_EL = 1 << 0;
const HAS_LOS_EL = 1 << 1;
const AOS_CLIPPED = 1 << 2;
const LOS_CLIPPED = 1 << 3;
const HAS_TRACK_ENDED = 1 << 4;
const TRACK_ENDED = 1 << 5;
const HAS_AOS_TX = 1 << 6;
const HAS_LOS_TX = 1 << 7;
const HAS_LIGHT_TIME = 1 << 8;
const HAS_LINK = 1 << 9;
const HAS_EXPECTED = 1 << 10;
const HAS_EXPECTED_BINS = 1 << 11;
const HAS_EXPECTED_BOUND = 1 << 12;

/** A batch's contacts as columns (structured-clone safe; the typed arrays' buffers are transferable). */
export interface ContactPack {
  count: number;
  /** count x PACK_NUMBERS numbers. */
  numbers: Float64Array;
  flags: Uint16Array;
  /** count x 3 indices into `strings`: spacecraft id, station id, the link's radio id (0 without a link). */
  ids: Uint16Array | Uint32Array;
  strings: string[];
  /** Contact i's volume bins: bins[binFrom[i] .. binFrom[i + 1]). */
  binFrom: Uint32Array;
  bins: Float64Array;
  /** Its expected-volume bins likewise (none unless HAS_EXPECTED_BINS). */
  expectedFrom: Uint32Array;
  expectedBins: Float64Array;
  /** Its MODCOD times: names strings[modcodName[k]] and seconds modcodS[k], k in modcodFrom[i] .. modcodFrom[i + 1]. */
  modcodFrom: Uint32Array;
  modcodName: Uint16Array | Uint32Array;
  modcodS: Float64Array;
  /** Other radios' links of the contacts that have them, by contact index. */
  otherLinks: [number, ContactLink[]][];
}

/** Packs `contacts` (left as they are). Rate step functions are left out (see the module note). */
export function packContacts(contacts: readonly Contact[]): ContactPack {
  const n = contacts.length;
  const strings: string[] = [''];
  const index = new Map<string, number>([['', 0]]);
  const intern = (s: string): number => {
    let k = index.get(s);
    if (k === undefined) {
      k = strings.length;
      strings.push(s);
      index.set(s, k);
    }
    return k;
  };
  let binCount = 0;
  let expectedCount = 0;
  let modcodCount = 0;
  for (const c of contacts) {
    const l = c.link;
    if (!l) continue;
    binCount += l.volumeBinsBits.length;
    expectedCount += l.expectedVolumeBinsBits?.length ?? 0;
    modcodCount += Object.keys(l.timeInModcodS).length;
  }
  const numbers = new Float64Array(n * PACK_NUMBERS).fill(Number.NaN);
  const flags = new Uint16Array(n);
  const ids = new Uint32Array(n * 3);
  const binFrom = new Uint32Array(n + 1);
  const bins = new Float64Array(binCount);
  const expectedFrom = new Uint32Array(n + 1);
  const expectedBins = new Float64Array(expectedCount);
  const modcodFrom = new Uint32Array(n + 1);
  const modcodName = new Uint32Array(modcodCount);
  const modcodS = new Float64Array(modcodCount);
  const otherLinks: [number, ContactLink[]][] = [];
  let b = 0;
  let e = 0;
  let m = 0;
  /** An optional number into numbers[at]: its flag when present, else 0 (the slot stays NaN). */
  const optional = (v: number | undefined, flag: number, at: number): number => {
    if (v === undefined) return 0;
    numbers[at] = v;
    return flag;
  };
  for (let i = 0; i < n; i++) {
    const c = contacts[i]!;
    const o = i * PACK_NUMBERS;
    let f = 0;
    numbers[o + AOS] = c.aosMs;
    numbers[o + LOS] = c.losMs;
    numbers[o + TCA] = c.tcaMs;
    numbers[o + MAX_EL] = c.maxElevationDeg;
    numbers[o + AOS_AZ] = c.aosAzimuthDeg;
    numbers[o + LOS_AZ] = c.losAzimuthDeg;
    numbers[o + DURATION] = c.durationS;
    f |= optional(c.aosElevationDeg, HAS_AOS_EL, o + AOS_EL);
    f |= optional(c.losElevationDeg, HAS_LOS_EL, o + LOS_EL);
    if (c.aosClipped) f |= AOS_CLIPPED;
    if (c.losClipped) f |= LOS_CLIPPED;
    if (c.losTrackEnded !== undefined) f |= HAS_TRACK_ENDED | (c.losTrackEnded ? TRACK_ENDED : 0);
    f |= optional(c.aosTransmitMs, HAS_AOS_TX, o + AOS_TX);
    f |= optional(c.losTransmitMs, HAS_LOS_TX, o + LOS_TX);
    f |= optional(c.lightTimeS, HAS_LIGHT_TIME, o + LIGHT_TIME);
    ids[3 * i] = intern(c.spacecraftId);
    ids[3 * i + 1] = intern(c.stationId);
    const l = c.link;
    if (l) {
      f |= HAS_LINK;
      ids[3 * i + 2] = intern(l.radioId);
      numbers[o + VOLUME] = l.volumeBits;
      numbers[o + DATA_START] = l.dataStartMs;
      numbers[o + DATA_END] = l.dataEndMs;
      numbers[o + CLOSED] = l.closedS;
      numbers[o + WORST_MARGIN] = l.worstMarginDb;
      numbers[o + WORST_AT] = l.worstMarginAtMs;
      numbers[o + WORST_EL] = l.worstMarginElevationDeg;
      numbers[o + PEAK_RATE] = l.peakRateBps;
      numbers[o + SAMPLES] = l.samples;
      numbers[o + BIN_START] = l.binStartMs;
      for (const v of l.volumeBinsBits) bins[b++] = v;
      f |= optional(l.expectedVolumeBits, HAS_EXPECTED, o + EXPECTED);
      if (l.expectedVolumeBinsBits !== undefined) {
        f |= HAS_EXPECTED_BINS;
        for (const v of l.expectedVolumeBinsBits) expectedBins[e++] = v;
      }
      f |= optional(l.expectedVolumeBoundBits, HAS_EXPECTED_BOUND, o + EXPECTED_BOUND);
      for (const name in l.timeInModcodS) {
        modcodName[m] = intern(name);
        modcodS[m] = l.timeInModcodS[name]!;
        m++;
      }
    }
    if (c.otherLinks) otherLinks.push([i, c.otherLinks.map(withoutPieces)]);
    flags[i] = f;
    binFrom[i + 1] = b;
    expectedFrom[i + 1] = e;
    modcodFrom[i + 1] = m;
  }
  // indices in 16 bits where the string table allows (it nearly always does)
  const narrow = (a: Uint32Array): Uint16Array | Uint32Array => (strings.length <= 0xffff ? Uint16Array.from(a) : a);
  return { count: n, numbers, flags, ids: narrow(ids), strings, binFrom, bins, expectedFrom, expectedBins, modcodFrom, modcodName: narrow(modcodName), modcodS, otherLinks };
}

function withoutPieces(l: ContactLink): ContactLink {
  if (l.ratePieces === undefined && l.expectedRatePieces === undefined) return l;
  const { ratePieces: _r, expectedRatePieces: _e, ...rest } = l;
  return rest;
}

/** The buffers of a pack, to transfer rather than copy. */
export function packTransferables(p: ContactPack): ArrayBuffer[] {
  return [p.numbers, p.flags, p.ids, p.binFrom, p.bins, p.expectedFrom, p.expectedBins, p.modcodFrom, p.modcodName, p.modcodS].map((a) => a.buffer as ArrayBuffer);
}

/** What the views read: the pack with its other links by contact index. */
interface PackReader extends ContactPack {
  others: Map<number, ContactLink[]>;
}

/**
 * The contacts of a pack, as views (one small object each; a contact's link view is a new
 * small object on every read, not kept). `shared` maps each id to the string to hand out (the scenario's
 * own, so that a million views do not each carry a copy).
 */
export function unpackContacts(pack: ContactPack, shared?: (id: string) => string): Contact[] {
  const reader: PackReader = { ...pack, strings: shared ? pack.strings.map(shared) : pack.strings, others: new Map(pack.otherLinks) };
  const out: Contact[] = new Array<Contact>(pack.count);
  for (let i = 0; i < pack.count; i++) out[i] = new PackedContact(reader, i) as unknown as Contact;
  return out;
}

/** One contact's row of a pack: what its views read (names kept clear of the Contact and ContactLink fields). */
class PackedRow {
  constructor(
    protected readonly p: PackReader,
    protected readonly i: number,
  ) {}
  /** Number k of the row. */
  protected rowNumber(k: number): number {
    return this.p.numbers[this.i * PACK_NUMBERS + k]!;
  }
  /** Number k of the row when the flag says it is there, else undefined. */
  protected rowOptional(flag: number, k: number): number | undefined {
    return this.rowFlag(flag) ? this.rowNumber(k) : undefined;
  }
  /** Whether the row's flag bit is set. */
  protected rowFlag(flag: number): boolean {
    return (this.p.flags[this.i]! & flag) !== 0;
  }
  /** String j (0 spacecraft, 1 station, 2 radio) of the row. */
  protected rowId(j: number): string {
    return this.p.strings[this.p.ids[3 * this.i + j]!]!;
  }
}

class PackedContact extends PackedRow {
  get spacecraftId(): string {
    return this.rowId(0);
  }
  get stationId(): string {
    return this.rowId(1);
  }
  get aosMs(): number {
    return this.rowNumber(AOS);
  }
  get losMs(): number {
    return this.rowNumber(LOS);
  }
  get tcaMs(): number {
    return this.rowNumber(TCA);
  }
  get maxElevationDeg(): number {
    return this.rowNumber(MAX_EL);
  }
  get aosAzimuthDeg(): number {
    return this.rowNumber(AOS_AZ);
  }
  get losAzimuthDeg(): number {
    return this.rowNumber(LOS_AZ);
  }
  get aosElevationDeg(): number | undefined {
    return this.rowOptional(HAS_AOS_EL, AOS_EL);
  }
  get losElevationDeg(): number | undefined {
    return this.rowOptional(HAS_LOS_EL, LOS_EL);
  }
  get aosClipped(): boolean {
    return this.rowFlag(AOS_CLIPPED);
  }
  get losClipped(): boolean {
    return this.rowFlag(LOS_CLIPPED);
  }
  get losTrackEnded(): boolean | undefined {
    return this.rowFlag(HAS_TRACK_ENDED) ? this.rowFlag(TRACK_ENDED) : undefined;
  }
  get durationS(): number {
    return this.rowNumber(DURATION);
  }
  get aosTransmitMs(): number | undefined {
    return this.rowOptional(HAS_AOS_TX, AOS_TX);
  }
  get losTransmitMs(): number | undefined {
    return this.rowOptional(HAS_LOS_TX, LOS_TX);
  }
  get lightTimeS(): number | undefined {
    return this.rowOptional(HAS_LIGHT_TIME, LIGHT_TIME);
  }
  get link(): ContactLink | undefined {
    if (!this.rowFlag(HAS_LINK)) return undefined;
    return new PackedLink(this.p, this.i) as unknown as ContactLink;
  }
  get otherLinks(): ContactLink[] | undefined {
    return this.p.others.get(this.i);
  }
}

/** The link of a contact of a pack (the ContactLink shape; no rate step functions). */
class PackedLink extends PackedRow {
  get radioId(): string {
    return this.rowId(2);
  }
  get volumeBits(): number {
    return this.rowNumber(VOLUME);
  }
  get dataStartMs(): number {
    return this.rowNumber(DATA_START);
  }
  get dataEndMs(): number {
    return this.rowNumber(DATA_END);
  }
  get closedS(): number {
    return this.rowNumber(CLOSED);
  }
  get worstMarginDb(): number {
    return this.rowNumber(WORST_MARGIN);
  }
  get worstMarginAtMs(): number {
    return this.rowNumber(WORST_AT);
  }
  get worstMarginElevationDeg(): number {
    return this.rowNumber(WORST_EL);
  }
  get peakRateBps(): number {
    return this.rowNumber(PEAK_RATE);
  }
  get samples(): number {
    return this.rowNumber(SAMPLES);
  }
  get binStartMs(): number {
    return this.rowNumber(BIN_START);
  }
  /** A new object on every read (in the order the worker's record had). */
  get timeInModcodS(): Record<string, number> {
    const p = this.p;
    const out: Record<string, number> = {};
    for (let k = p.modcodFrom[this.i]!; k < p.modcodFrom[this.i + 1]!; k++) out[p.strings[p.modcodName[k]!]!] = p.modcodS[k]!;
    return out;
  }
  /** A new array on every read. */
  get volumeBinsBits(): number[] {
    return arrayOf(this.p.bins, this.p.binFrom[this.i]!, this.p.binFrom[this.i + 1]!);
  }
  get expectedVolumeBits(): number | undefined {
    return this.rowOptional(HAS_EXPECTED, EXPECTED);
  }
  /** A new array on every read. */
  get expectedVolumeBinsBits(): number[] | undefined {
    if (!this.rowFlag(HAS_EXPECTED_BINS)) return undefined;
    return arrayOf(this.p.expectedBins, this.p.expectedFrom[this.i]!, this.p.expectedFrom[this.i + 1]!);
  }
  get expectedVolumeBoundBits(): number | undefined {
    return this.rowOptional(HAS_EXPECTED_BOUND, EXPECTED_BOUND);
  }
}

/** values[from..to) as a new plain array (a loop: Array.from over a typed array's iterator cost ~2 us per contact in dailyTotals). */
function arrayOf(values: Float64Array, from: number, to: number): number[] {
  const out: number[] = [];
  for (let k = from; k < to; k++) out.push(values[k]!);
  return out;
}
