// The byte writer's formatting (src/report/byte-writer.ts) against the string functions it
// stands for, and against the engine's own conversions where they define the text:
// - numbers: String(v) and JSON.stringify(v) (ECMA-262 Number::toString), v.toFixed(d)
//   (ECMA-262 Number.prototype.toFixed), String(Number(v.toFixed(d))) for the rounded
//   columns (report/contact-text.ts roundedText's definition);
// - times: Date.prototype.toISOString (ECMA-262 Date Time String Format) and
//   time/format.ts isoUtc, report/calendar.ts icalUtc;
// - formatDuration, formatBits (report/table.ts), RFC 5545 §3.1 folding (report/calendar.ts
//   foldLine) and UTF-8 (Buffer.from(s, 'utf8'), Node's encoder).
// Exact equality of the bytes on a million seeded values or more per function, with the
// edge cases named (halves at the rounding digit and their neighbours, -0, not finite,
// 2^53, the fast ranges' bounds, years outside 1970..9999, lone surrogates).
import { describe, it, expect } from 'vitest';
import { ByteWriter } from '../../src/report/byte-writer.js';
import { formatDuration, isoUtc } from '../../src/time/format.js';
import { formatBits } from '../../src/report/table.js';
import { foldLine, icalUtc } from '../../src/report/calendar.js';
import { mulberry32 } from '../fixtures/prng.js';

const w = new ByteWriter(64);
/** What `write` puts into a fresh writer, as text (latin1: the writer's ASCII, one char a byte). */
function written(write: (w: ByteWriter) => void): string {
  w.pos = 0;
  write(w);
  return w.buf.toString('latin1', 0, w.pos);
}

/** Collects mismatches (a million expect() calls would be the test's whole cost). */
function check(n: number, draw: (i: number) => [got: () => string, want: () => string, what: string]): void {
  const bad: string[] = [];
  for (let i = 0; i < n; i++) {
    const [got, want, what] = draw(i);
    let g: string;
    let e: string;
    try {
      e = want();
    } catch (err) {
      e = `throws ${(err as Error).name}`;
    }
    try {
      g = got();
    } catch (err) {
      g = `throws ${(err as Error).name}`;
    }
    if (g !== e && bad.length < 5) bad.push(`${what}: got ${g}, want ${e}`);
  }
  expect(bad).toEqual([]);
}

const rnd = mulberry32(20261203);
const bits = new DataView(new ArrayBuffer(8));
/** Any double from random bits (every exponent, NaN and infinities included). */
function anyDouble(): number {
  bits.setUint32(0, (rnd() * 2 ** 32) >>> 0);
  bits.setUint32(4, (rnd() * 2 ** 32) >>> 0);
  return bits.getFloat64(0);
}
/** A double of about 10^k, k in [lo, hi), 53 random bits of mantissa, either sign. */
function scaled(lo: number, hi: number): number {
  const m = rnd() + rnd() * 2 ** -32;
  const v = m * 10 ** (lo + Math.floor(rnd() * (hi - lo)));
  return rnd() < 0.3 ? -v : v;
}
/** A decimal half at digit d (k + 0.5) / 10^d as the nearest double, or one of its neighbours. */
function nearHalf(d: number, maxWhole: number): number {
  const k = Math.floor(rnd() * maxWhole);
  let v = (k + 0.5) / 10 ** d;
  const step = rnd();
  if (step < 0.25) v = nextUp(v);
  else if (step < 0.5) v = nextDown(v);
  return rnd() < 0.3 ? -v : v;
}
function nextUp(v: number): number {
  bits.setFloat64(0, v);
  bits.setBigUint64(0, bits.getBigUint64(0) + 1n);
  return bits.getFloat64(0);
}
function nextDown(v: number): number {
  bits.setFloat64(0, v);
  bits.setBigUint64(0, bits.getBigUint64(0) - 1n);
  return bits.getFloat64(0);
}

const EDGES = [
  0, -0, 0.5, -0.5, 1.5, 2.5, 0.05, 0.005, 0.015, 1.005, 2.675, -1.125, 9.995, -9.995, 1e-7, 123456789.125, 1e15 + 0.5, 1e21, 1e22, 2 ** 40, 2 ** 40 - 0.5,
  2 ** 53 - 1, 2 ** 53, 2 ** 53 + 2, -(2 ** 53 - 1), 999_999_999, 1e9, 1e9 + 1, 999_999_999_999, Number.MIN_VALUE, Number.MAX_VALUE, Number.EPSILON, NaN, Infinity, -Infinity,
];

describe('byte writer numbers', () => {
  it('number() is String(v) and jsonNumber() is JSON.stringify(v) on 1,200,000 values', () => {
    const values = (i: number): number => {
      if (i < EDGES.length) return EDGES[i]!;
      const r = i % 4;
      if (r === 0) return Math.round(scaled(0, 16)); // safe integers of every length
      if (r === 1) return Math.floor(rnd() * 2 ** 53) * (rnd() < 0.5 ? -1 : 1);
      if (r === 2) return scaled(-10, 25);
      return anyDouble();
    };
    check(600_000, (i) => {
      const v = values(i);
      return [() => written((x) => x.number(v)), () => String(v), `String(${v})`];
    });
    check(600_000, (i) => {
      const v = values(i);
      return [() => written((x) => x.jsonNumber(v)), () => JSON.stringify(v), `JSON.stringify(${v})`];
    });
  });

  it('fixed(v, d) is v.toFixed(d) on 1,000,000 values, d 0..6', () => {
    check(1_000_000, (i) => {
      const d = i % 7;
      const r = Math.floor(i / 7) % 5;
      const v = i < 7 * EDGES.length ? EDGES[Math.floor(i / 7)]! : r === 0 ? scaled(-9, 14) : r === 1 ? nearHalf(d, 1e6) : r === 2 ? nearHalf(d, 2 ** 40 / 10 ** d) : r === 3 ? scaled(-3, 4) : anyDouble();
      return [() => written((x) => x.fixed(v, d)), () => v.toFixed(d), `(${v}).toFixed(${d})`];
    });
  });

  it('rounded(v, d) is String(Number(v.toFixed(d))) ("null" when not finite) on 1,000,000 values, d 0..6', () => {
    check(1_000_000, (i) => {
      const d = i % 7;
      const r = Math.floor(i / 7) % 5;
      const v = i < 7 * EDGES.length ? EDGES[Math.floor(i / 7)]! : r === 0 ? scaled(-9, 14) : r === 1 ? nearHalf(d, 1e6) : r === 2 ? nearHalf(d, 2 ** 40 / 10 ** d) : r === 3 ? scaled(-3, 4) : anyDouble();
      return [() => written((x) => x.rounded(v, d)), () => (Number.isFinite(v) ? String(Number(v.toFixed(d))) : 'null'), `rounded(${v}, ${d})`];
    });
  });

  it('bits() is formatBits and duration() is formatDuration on 1,000,000 values each', () => {
    check(1_000_000, (i) => {
      const v = i < EDGES.length ? EDGES[i]! : i % 3 === 0 ? Math.abs(scaled(0, 15)) : i % 3 === 1 ? nearHalf(2, 1e6) * 10 ** (3 * Math.floor(rnd() * 5)) : scaled(-3, 15);
      return [() => written((x) => x.bits(v)), () => formatBits(v), `formatBits(${v})`];
    });
    check(1_000_000, (i) => {
      const v = i < EDGES.length ? EDGES[i]! : i % 3 === 0 ? rnd() * 100_000 : i % 3 === 1 ? Math.floor(rnd() * 200_000) + 0.5 : scaled(-3, 14);
      return [() => written((x) => x.duration(v)), () => formatDuration(v), `formatDuration(${v})`];
    });
  });
});

describe('byte writer times', () => {
  const Y2026 = Date.UTC(2026, 2, 2);
  const END_9999 = Date.UTC(9999, 11, 31, 23, 59, 59, 999);
  const timeEdges = [0, -0, -1, 0.4999, 0.5, 999.5, 86_399_999.5, Y2026, Y2026 - 0.5, Y2026 + 49.999, Y2026 + 50, Y2026 + 500, Y2026 - 500.0001, END_9999, END_9999 + 0.5, END_9999 + 1, -1e10, 1e16, NaN, Infinity];
  const time = (i: number): number => {
    if (i < timeEdges.length) return timeEdges[i]!;
    const r = i % 5;
    if (r === 0) return Y2026 + rnd() * 28 * 86_400_000; // a plan's span, fractional ms
    if (r === 1) return Y2026 + Math.floor(rnd() * 28 * 86_400) * 1000 + [0, 0.5, 49.5, 50, 499.5, 500, 999.5][Math.floor(rnd() * 7)]! + (rnd() < 0.5 ? 0 : rnd() < 0.5 ? 1e-6 : -1e-6);
    if (r === 2) return rnd() * END_9999 * 1.01; // every year, a few past 9999
    if (r === 3) return Math.floor(rnd() * END_9999); // whole ms
    return (rnd() - 0.5) * 1e13;
  };

  it('iso(t, decimals) is isoUtc on 1,000,000 times and Date.toISOString on the whole-ms ones', () => {
    check(1_000_000, (i) => {
      const t = time(i >> 2);
      const d = i & 3;
      return [() => written((x) => x.iso(t, d)), () => isoUtc(t, d), `isoUtc(${t}, ${d})`];
    });
    check(1_000_000, (i) => {
      const t = i < 2 ? [0, END_9999][i]! : Math.floor(rnd() * END_9999);
      return [() => written((x) => x.iso(t, 3)), () => new Date(t).toISOString(), `toISOString(${t})`];
    });
  });

  it('icalUtc(t, ceil) is report/calendar.ts icalUtc on 1,000,000 times', () => {
    check(1_000_000, (i) => {
      const t = time(i >> 1);
      const ceil = (i & 1) === 1;
      return [() => written((x) => x.icalUtc(t, ceil)), () => icalUtc(t, ceil ? 'ceil' : 'floor'), `icalUtc(${t}, ${ceil})`];
    });
  });
});

describe('byte writer text', () => {
  const pieces = ['a', 'Z', ' ', ',', '\\', ';', 'é', 'Ø', '✓', '€', '𝄞', '😀', '\ud800', '\udc00', 'x'.repeat(70), 'ü'.repeat(40)];
  const randomText = (): string => {
    let s = '';
    const n = Math.floor(rnd() * 60);
    for (let k = 0; k < n; k++) s += rnd() < 0.7 ? String.fromCharCode(32 + Math.floor(rnd() * 95)) : pieces[Math.floor(rnd() * pieces.length)]!;
    return s;
  };

  it("text() is Buffer.from(s, 'utf8') and fold() is foldLine on 200,000 strings (ASCII, 2- to 4-byte characters, lone surrogates)", () => {
    const bad: string[] = [];
    for (let i = 0; i < 200_000; i++) {
      const s = randomText();
      w.pos = 0;
      w.text('x'); // a line that does not start at 0
      const start = w.pos;
      w.text(s);
      if (!Buffer.from(s, 'utf8').equals(w.buf.subarray(start, w.pos)) && bad.length < 5) bad.push(`text ${JSON.stringify(s)}`);
      w.fold(start);
      const want = Buffer.from(foldLine(s), 'utf8');
      if (!want.equals(w.buf.subarray(start, w.pos)) && bad.length < 5) bad.push(`fold ${JSON.stringify(s)}`);
    }
    expect(bad).toEqual([]);
  });

  it('grows from a small buffer without losing bytes', () => {
    const small = new ByteWriter(1);
    let want = '';
    for (let i = 0; i < 5000; i++) {
      const s = `${i},Ø${'y'.repeat(i % 97)}`;
      small.text(s);
      small.number(i * 7919);
      want += `${s}${i * 7919}`;
    }
    expect(small.buf.toString('utf8', 0, small.pos)).toBe(want);
  });
});
