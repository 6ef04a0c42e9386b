// isoUtc against the reference it reproduces: Date.prototype.toISOString (ECMA-262
// §21.4.4.36, "YYYY-MM-DDTHH:mm:ss.sssZ"), cut to the decimals asked for, over seeded
// random instants 1970..2200, day and second boundaries, and rounding up across midnight.
import { describe, expect, it } from 'vitest';
import { isoUtc } from '../../src/time/format.js';

function reference(tMs: number, decimals: number): string {
  const scale = 10 ** (3 - decimals);
  const s = new Date(Math.round(tMs / scale) * scale).toISOString();
  return decimals === 3 ? s : decimals === 0 ? `${s.slice(0, 19)}Z` : `${s.slice(0, 20 + decimals)}Z`;
}

describe('isoUtc', () => {
  it('equals toISOString cut to 0..3 decimals', () => {
    let seed = 12345;
    const rnd = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    const times = [0, 86_399_999.6, 86_400_000, Date.UTC(2026, 2, 5, 23, 59, 59, 999.95), Date.UTC(2024, 1, 29, 12), Date.UTC(2199, 11, 31, 23, 59, 59, 950)];
    for (let i = 0; i < 20_000; i++) times.push(rnd() * Date.UTC(2200, 0, 1) + rnd());
    for (const t of times) for (const d of [0, 1, 2, 3]) expect(isoUtc(t, d)).toBe(reference(t, d));
  });
});
