/**
 * Durations as users write them: "10s", "1.5m", "2h", "7d", "1h30m", or a
 * plain number of seconds. Returns seconds, or undefined when unreadable.
 */
const UNIT_S: Record<string, number> = { ms: 0.001, s: 1, m: 60, min: 60, h: 3600, d: 86_400, w: 604_800 };

export function parseDurationS(text: string): number | undefined {
  const t = text.trim().toLowerCase();
  if (t === '') return undefined;
  if (/^\d+(\.\d+)?$/.test(t)) return Number(t);
  const re = /(\d+(?:\.\d+)?)\s*(ms|min|s|m|h|d|w)/gy;
  let total = 0;
  let pos = 0;
  let m: RegExpExecArray | null;
  while ((m = re.exec(t)) !== null) {
    total += Number(m[1]) * (UNIT_S[m[2]!] ?? Number.NaN);
    pos = re.lastIndex;
  }
  return pos === t.length && Number.isFinite(total) ? total : undefined;
}
