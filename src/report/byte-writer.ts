/**
 * A growing byte buffer that texts are written into as UTF-8 directly, without a JS string
 * per text: the plan workers' contact texts (report/batch-text.ts) are hundreds of MB for a
 * large fleet, and building them as strings first cost the garbage collector and a second
 * pass (the UTF-8 encoding) more than the formatting itself.
 *
 * The formatting methods give exactly the bytes of the string functions they stand for
 * (String of a number, time/format.ts isoUtc, report/calendar.ts icalUtc, formatDuration,
 * report/table.ts formatBits, RFC 5545 folding of report/calendar.ts foldLine): they do the
 * same arithmetic in the same order and only write the characters as bytes, and hand
 * anything outside their fast range to the string function itself.
 * test/report/byte-writer.test.ts checks each against its string function on a million
 * values or more.
 */
import { clockOfDay, formatDuration, isoUtc, type ClockParts } from '../time/format.js';
import { roundedText } from './contact-text.js';

const DAY_MS = 86_400_000;
/** Days from 1970 to the end of 9999 (time/format.ts isoMs's fast range). */
const LAST_DAY = 2_932_897;
const C0 = 48; // '0'

export class ByteWriter {
  buf: Buffer;
  pos = 0;

  constructor(bytes = 1 << 16) {
    this.buf = Buffer.allocUnsafeSlow(Math.max(1024, bytes));
  }

  /** Makes room for `n` more bytes. */
  room(n: number): void {
    if (this.pos + n > this.buf.length) this.grow(n);
  }

  private grow(n: number): void {
    const bigger = Buffer.allocUnsafeSlow(Math.max(this.pos + n, this.buf.length * 2));
    this.buf.copy(bigger, 0, 0, this.pos);
    this.buf = bigger;
  }

  byte(b: number): void {
    if (this.pos >= this.buf.length) this.grow(1);
    this.buf[this.pos++] = b;
  }

  bytes(b: Uint8Array): void {
    const n = b.length;
    if (this.pos + n > this.buf.length) this.grow(n);
    const buf = this.buf;
    let p = this.pos;
    if (n > 48) {
      buf.set(b, p);
      p += n;
    } else for (let i = 0; i < n; i++) buf[p++] = b[i]!;
    this.pos = p;
  }

  /** Bytes [start, end) of another writer (a value formatted once, written in several forms). */
  copyOf(from: ByteWriter, start: number, end: number): void {
    const n = end - start;
    if (this.pos + n > this.buf.length) this.grow(n);
    const buf = this.buf;
    const src = from.buf;
    let p = this.pos;
    for (let i = start; i < end; i++) buf[p++] = src[i]!;
    this.pos = p;
  }

  /** A string known to be ASCII (number texts, fixed words): one byte per character. */
  ascii(s: string): void {
    const n = s.length;
    if (this.pos + n > this.buf.length) this.grow(n);
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < n; i++) buf[p++] = s.charCodeAt(i);
    this.pos = p;
  }

  /** The first `end` characters of a string known to be ASCII. */
  asciiTo(s: string, end: number): void {
    if (this.pos + end > this.buf.length) this.grow(end);
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < end; i++) buf[p++] = s.charCodeAt(i);
    this.pos = p;
  }

  /** Any string, as UTF-8 (Buffer's encoder beyond ASCII: lone surrogates as U+FFFD). */
  text(s: string): void {
    const n = s.length;
    if (this.pos + 3 * n > this.buf.length) this.grow(3 * n);
    const buf = this.buf;
    const start = this.pos;
    let p = start;
    for (let i = 0; i < n; i++) {
      const c = s.charCodeAt(i);
      if (c >= 0x80) {
        this.pos = start + buf.write(s, start, 'utf8');
        return;
      }
      buf[p++] = c;
    }
    this.pos = p;
  }

  /** A non-negative safe integer's decimal digits. */
  private digits(v: number): void {
    if (v < 1e9) {
      this.small(v);
      return;
    }
    // v = hi * 1e9 + lo, both exact (v < 2^53); the quotient's rounding corrected
    let hi = Math.floor(v / 1e9);
    let lo = v - hi * 1e9;
    if (lo < 0) {
      hi--;
      lo += 1e9;
    } else if (lo >= 1e9) {
      hi++;
      lo -= 1e9;
    }
    this.small(hi);
    this.room(9);
    const buf = this.buf;
    let p = this.pos + 9;
    this.pos = p;
    let x = lo | 0;
    for (let i = 0; i < 9; i++) {
      const q = (x / 10) | 0;
      buf[--p] = C0 + x - 10 * q;
      x = q;
    }
  }

  /** The digits of an integer 0 <= v < 1e9. */
  private small(v: number): void {
    let x = v | 0;
    let n = 1;
    for (let t = x; t >= 10; n++) t = (t / 10) | 0;
    if (this.pos + n > this.buf.length) this.grow(n);
    const buf = this.buf;
    let p = this.pos + n;
    this.pos = p;
    do {
      const q = (x / 10) | 0;
      buf[--p] = C0 + x - 10 * q;
      x = q;
    } while (x > 0);
  }

  /** `d` digits of an integer 0 <= v < 10^d, zeros in front. */
  private padded(v: number, d: number): void {
    if (this.pos + d > this.buf.length) this.grow(d);
    const buf = this.buf;
    let p = this.pos + d;
    this.pos = p;
    let x = v;
    for (let i = 0; i < d; i++) {
      const r = x % 10;
      buf[--p] = C0 + r;
      x = (x - r) / 10;
    }
  }

  /** v.toFixed(d) (d 0..6). */
  fixed(v: number, d: number): void {
    const n = scaledRound(v < 0 ? -v : v, d);
    if (n < 0) {
      this.ascii(v.toFixed(d)); // not finite, large, or too near a half to be sure
      return;
    }
    if (v < 0) this.byte(45); // toFixed's sign: also of a value rounded to zero, never of -0
    const scale = POW10[d]!;
    const frac = n % scale;
    this.digits((n - frac) / scale);
    if (d > 0) {
      this.byte(46);
      this.padded(frac, d);
    }
  }

  /** report/contact-text.ts roundedText(v, d) (d 0..6): toFixed's digits, trailing zeros dropped, "null" when not finite. */
  rounded(v: number, d: number): void {
    if (!Number.isFinite(v)) {
      this.ascii('null');
      return;
    }
    const n = scaledRound(v < 0 ? -v : v, d);
    if (n < 0) {
      this.ascii(roundedText(v, d));
      return;
    }
    if (n === 0) {
      this.byte(C0); // "0", "-0" included
      return;
    }
    if (v < 0) this.byte(45);
    const scale = POW10[d]!;
    let frac = n % scale;
    this.digits((n - frac) / scale);
    if (frac === 0) return;
    let k = d;
    for (let r = frac % 10; r === 0; r = frac % 10) {
      frac /= 10;
      k--;
    }
    this.byte(46);
    this.padded(frac, k);
  }

  /** String(v) of a number (safe integers by their digits, anything else through String). */
  number(v: number): void {
    if (Number.isSafeInteger(v)) {
      if (v < 0) {
        this.byte(45); // '-'
        this.digits(-v);
      } else this.digits(v); // -0 is "0" as in String(-0)
    } else this.ascii(String(v));
  }

  /** JSON's text of a number: String(v), "null" when not finite. */
  jsonNumber(v: number): void {
    if (Number.isFinite(v)) this.number(v);
    else this.ascii('null');
  }

  /** Two digits of 0..99. */
  private two(v: number): void {
    const buf = this.buf;
    const t = v % 10;
    buf[this.pos++] = C0 + (v - t) / 10;
    buf[this.pos++] = C0 + t;
  }

  /** time/format.ts isoUtc(tMs, decimals) (decimals 0..3). */
  iso(tMs: number, decimals: number): void {
    const scale = ISO_SCALE[decimals]!; // 10 ** (3 - decimals)
    const ms = Math.round(tMs / scale) * scale;
    if (!splitMs(ms)) {
      this.ascii(isoUtc(tMs, decimals)); // outside 1970..9999 (or not a time: the same error)
      return;
    }
    if (this.pos + 24 > this.buf.length) this.grow(24);
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < 11; i++) buf[p++] = dayText[i]!; // "YYYY-MM-DDT"
    let v = part.h;
    let q = (v / 10) | 0;
    buf[p++] = C0 + q;
    buf[p++] = C0 + v - 10 * q;
    buf[p++] = 58; // ':'
    v = part.m;
    q = (v / 10) | 0;
    buf[p++] = C0 + q;
    buf[p++] = C0 + v - 10 * q;
    buf[p++] = 58;
    v = part.s;
    q = (v / 10) | 0;
    buf[p++] = C0 + q;
    buf[p++] = C0 + v - 10 * q;
    if (decimals > 0) {
      buf[p++] = 46; // '.'
      const milli = part.milli;
      const d100 = (milli / 100) | 0;
      const rest = milli - 100 * d100;
      const d10 = (rest / 10) | 0;
      buf[p++] = C0 + d100;
      if (decimals > 1) buf[p++] = C0 + d10;
      if (decimals > 2) buf[p++] = C0 + rest - 10 * d10;
    }
    buf[p++] = 90; // 'Z'
    this.pos = p;
  }

  /** report/calendar.ts icalUtc(tMs, round): "YYYYMMDDTHHMMSSZ", the fraction dropped by `ceil` or floor. */
  icalUtc(tMs: number, ceil: boolean): void {
    const s = ceil ? Math.ceil(tMs / 1000) : Math.floor(tMs / 1000);
    // isoUtc(s * 1000, 0)'s arithmetic
    const ms = Math.round((s * 1000) / 1000) * 1000;
    if (!splitMs(ms)) {
      const t = isoUtc(s * 1000, 0);
      this.ascii(`${t.slice(0, 4)}${t.slice(5, 7)}${t.slice(8, 13)}${t.slice(14, 16)}${t.slice(17, 19)}Z`);
      return;
    }
    this.room(16);
    const buf = this.buf;
    for (let i = 0; i < 4; i++) buf[this.pos++] = dayText[i]!;
    buf[this.pos++] = dayText[5]!;
    buf[this.pos++] = dayText[6]!;
    buf[this.pos++] = dayText[8]!;
    buf[this.pos++] = dayText[9]!;
    buf[this.pos++] = 84; // 'T'
    this.two(part.h);
    this.two(part.m);
    this.two(part.s);
    buf[this.pos++] = 90;
  }

  /** time/format.ts formatDuration(seconds): "1h02m03s", "2m03s". */
  duration(seconds: number): void {
    const s = Math.round(seconds);
    if (!(s >= 0 && s < 1e12)) {
      this.ascii(formatDuration(seconds));
      return;
    }
    const h = Math.floor(s / 3600);
    const m = Math.floor((s % 3600) / 60);
    const r = s % 60;
    if (h > 0) {
      this.digits(h);
      this.room(7);
      this.buf[this.pos++] = 104; // 'h'
    } else {
      this.digits(m);
      this.room(4);
      this.buf[this.pos++] = 109; // 'm'
      this.two(r);
      this.buf[this.pos++] = 115; // 's'
      return;
    }
    this.two(m);
    this.buf[this.pos++] = 109;
    this.two(r);
    this.buf[this.pos++] = 115;
  }

  /** report/table.ts formatBits(bits): bits in Mbit, Gbit, Tbit. */
  bits(bits: number): void {
    if (bits >= 1e12) {
      this.fixed(bits / 1e12, 2);
      this.ascii(' Tbit');
    } else if (bits >= 1e9) {
      this.fixed(bits / 1e9, 2);
      this.ascii(' Gbit');
    } else if (bits >= 1e6) {
      this.fixed(bits / 1e6, 1);
      this.ascii(' Mbit');
    } else if (bits >= 1e3) {
      this.fixed(bits / 1e3, 1);
      this.ascii(' kbit');
    } else {
      this.number(Math.round(bits));
      this.ascii(' bit');
    }
  }

  /**
   * RFC 5545 §3.1 folding (report/calendar.ts foldLine) of the content line written from
   * `start`: at most 75 octets a line, continuations start with a space, never inside a
   * UTF-8 character (a break before a continuation byte moves back to its lead byte).
   */
  fold(start: number): void {
    const end = this.pos;
    if (end - start <= 75) return;
    const buf = this.buf;
    let k = 0;
    let p = start;
    let limit = 75;
    while (end - p > limit) {
      let q = p + limit;
      while ((buf[q]! & 0xc0) === 0x80) q--;
      if (k === breaks.length) breaks = grown(breaks);
      breaks[k++] = q;
      p = q;
      limit = 74; // the leading space counts
    }
    this.room(3 * k);
    const b = this.buf;
    for (let j = k - 1; j >= 0; j--) {
      const from = breaks[j]!;
      const to = j === k - 1 ? end : breaks[j + 1]!;
      const shift = 3 * (j + 1);
      b.copyWithin(from + shift, from, to);
      b[from + shift - 3] = 13;
      b[from + shift - 2] = 10;
      b[from + shift - 1] = 32;
    }
    this.pos = end + 3 * k;
  }
}

const POW10 = [1, 10, 100, 1000, 1e4, 1e5, 1e6];
const ISO_SCALE = [1000, 100, 10, 1];
/** 2^40: below it a product a * 10^d is within 2^-13 of its exact value. */
const EXACT_BELOW = 1_099_511_627_776;
/** Half of the band about .5 where the product's rounding error could change the rounding (2^-10, eight times the error). */
const HALF_BAND = 1 / 1024;

/**
 * round(a * 10^d) (a >= 0, d 0..6) as toFixed rounds it: the exact value of the double
 * rounded to d decimals. a * 10^d is computed in doubles, within 2^-13 of the exact product
 * below 2^40, so its rounding is the exact one wherever the fraction is not within 2^-10
 * of one half. -1 where that is not proven (not finite, 2^40 or more, near a half): the
 * caller then asks toFixed.
 */
function scaledRound(a: number, d: number): number {
  const p = a * POW10[d]!;
  if (!(p < EXACT_BELOW)) return -1;
  const whole = Math.floor(p);
  const f = p - whole; // exact
  if (f > 0.5 - HALF_BAND && f < 0.5 + HALF_BAND) return -1;
  return f > 0.5 ? whole + 1 : whole;
}

let breaks: Int32Array = new Int32Array(16);
const grown = (a: Int32Array): Int32Array => {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
};

/** The parts of a whole-ms UTC time (time/format.ts isoMs's arithmetic), the day's text cached. */
const part: ClockParts = { h: 0, m: 0, s: 0, milli: 0 };
let cachedDay = Number.NaN;
const dayText = new Uint8Array(11);

function splitMs(ms: number): boolean {
  const day = Math.floor(ms / DAY_MS);
  if (!(day >= 0 && day < LAST_DAY)) return false;
  if (day !== cachedDay) {
    cachedDay = day;
    const t = new Date(day * DAY_MS).toISOString();
    for (let i = 0; i < 11; i++) dayText[i] = t.charCodeAt(i);
  }
  clockOfDay(ms - day * DAY_MS, part);
  return true;
}
