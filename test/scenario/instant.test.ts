/**
 * parseInstant (src/scenario/load.ts) reads the plain UTC form itself, without luxon: it must
 * give exactly what luxon 3.7.2's DateTime.fromISO gives (zone utc, the 1957..2099 range),
 * the reference here, for valid and invalid dates, times, fractions of 1 to 9 digits, with
 * and without "Z", and leave every other form to luxon. Seeded random instants plus edge cases.
 */
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { MAX_INSTANT_MS, MIN_INSTANT_MS, parseInstant } from '../../src/scenario/load.js';
import { mulberry32 } from '../fixtures/prng.js';

function luxonInstant(text: string): number | undefined {
  const dt = DateTime.fromISO(text, { zone: 'utc', setZone: true });
  if (!dt.isValid || dt.offset < -12 * 60 || dt.offset > 14 * 60) return undefined;
  const ms = dt.toMillis();
  return ms >= MIN_INSTANT_MS && ms < MAX_INSTANT_MS ? ms : undefined;
}

const pad = (n: number, w: number) => String(n).padStart(w, '0');

describe('parseInstant', () => {
  it("gives luxon's epoch ms (or none) for plain UTC instants, bit for bit", () => {
    const rnd = mulberry32(20260302);
    const texts: string[] = [
      '2026-03-02T00:00:00.000Z',
      '2026-03-02T00:00:00Z',
      '2026-03-02T00:00:00',
      '2024-02-29T12:00:00Z',
      '2025-02-29T12:00:00Z',
      '2026-04-31T00:00:00Z',
      '2026-13-01T00:00:00Z',
      '2026-00-10T00:00:00Z',
      '2026-03-00T00:00:00Z',
      '2026-03-02T24:00:00Z',
      '2026-03-02T23:60:00Z',
      '2026-03-02T23:59:60Z',
      '1956-12-31T23:59:59.999Z',
      '1957-01-01T00:00:00Z',
      '2099-12-31T23:59:59.999999999Z',
      '2100-01-01T00:00:00Z',
      '2026-03-02T10:20:30.57Z',
      '2026-03-02T10:20:30.29Z',
      '2026-03-02T10:20:30.5',
      '2026-03-02T10:20:30+02:00',
      '2026-03-02T10:20:30.123-05:30',
      '2026-03-02',
      '2026-061T00:00:00Z',
      '2026-03-02 10:20:30Z',
      '2026-03-02T10:20Z',
      '2026-03-02T10:20:30.Z',
      '2026-03-02T10:20:30.1234567890Z',
      '',
      'soon',
    ];
    for (let n = 0; n < 4000; n++) {
      const digits = Math.floor(rnd() * 10);
      const frac = digits === 0 ? '' : `.${Array.from({ length: digits }, () => Math.floor(rnd() * 10)).join('')}`;
      const zone = rnd() < 0.7 ? 'Z' : '';
      texts.push(
        `${pad(1950 + Math.floor(rnd() * 160), 4)}-${pad(Math.floor(rnd() * 14), 2)}-${pad(Math.floor(rnd() * 33), 2)}` +
          `T${pad(Math.floor(rnd() * 25), 2)}:${pad(Math.floor(rnd() * 61), 2)}:${pad(Math.floor(rnd() * 61), 2)}${frac}${zone}`,
      );
    }
    let valid = 0;
    for (const t of texts) {
      const want = luxonInstant(t);
      expect(parseInstant(t), t).toBe(want);
      if (want !== undefined) valid++;
    }
    expect(valid).toBeGreaterThan(1000);
    expect(valid).toBeLessThan(texts.length - 1000);
  });
});
