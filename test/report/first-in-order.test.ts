// firstInOrder (src/report/html/contact-list.ts) against Array.prototype.sort, which is
// stable by the ECMAScript 2019 specification: the first k of a stable sort, ties in input
// order, on 400 seeded lists with many equal keys (k from 0 past the list's length).
import { describe, it, expect } from 'vitest';
import { firstInOrder } from '../../src/report/html/contact-list.js';
import { mulberry32 } from '../fixtures/prng.js';

describe('firstInOrder', () => {
  it('is the head of a stable sort', () => {
    const rnd = mulberry32(4242);
    for (let trial = 0; trial < 400; trial++) {
      const n = Math.floor(rnd() * 300);
      const items = Array.from({ length: n }, (_, i) => ({ i, v: Math.floor(rnd() * 12), w: Math.floor(rnd() * 3) }));
      const cmp = (a: { v: number; w: number }, b: { v: number; w: number }) => b.v - a.v || a.w - b.w;
      const k = Math.floor(rnd() * (n + 20));
      expect(firstInOrder(items, k, cmp).map((x) => x.i)).toEqual([...items].sort(cmp).slice(0, k).map((x) => x.i));
    }
  });
});
