/** UTC days of a span and the pieces of an interval inside each (for the station-day views). */
export const DAY_MS = 86_400_000;

/** Start of every UTC day the span touches. */
export function utcDays(startMs: number, endMs: number): number[] {
  const out: number[] = [];
  for (let d = Math.floor(startMs / DAY_MS) * DAY_MS; d < endMs; d += DAY_MS) out.push(d);
  return out;
}

/** "2026-03-05" of a UTC day start. */
export const dayKey = (dayMs: number): string => new Date(dayMs).toISOString().slice(0, 10);

/** "HH:MM:SS" UTC of an instant (rounded to the second). */
export function hhmmssUtc(tMs: number): string {
  return new Date(Math.round(tMs / 1000) * 1000).toISOString().slice(11, 19);
}
