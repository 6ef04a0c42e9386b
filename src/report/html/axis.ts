/** Tick choice for the report's charts (round values a reader expects). */

/** A "nice" step (1, 2, 2.5 or 5 times a power of ten) giving about `count` intervals over [0, max]. */
export function niceStep(max: number, count: number): number {
  if (!(max > 0)) return 1;
  const raw = max / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * p >= raw) return m * p;
  return 10 * p;
}

const MIN = 60_000;
const TIME_STEPS_MS = [1, 2, 5, 10, 15, 30, 60, 120, 180, 360, 720, 1440, 2880].map((m) => m * MIN);

/** A time tick interval giving at most about `count` ticks over a duration. */
export function timeStepMs(durationMs: number, count: number): number {
  for (const s of TIME_STEPS_MS) if (durationMs / s <= count) return s;
  return TIME_STEPS_MS[TIME_STEPS_MS.length - 1]!;
}
