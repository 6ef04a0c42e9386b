/**
 * One progress line on stderr, rewritten in place with "\r", shown only when
 * stderr is an interactive terminal (io.isTty: never in a pipe or in CI).
 * Updates closer than `minIntervalMs` apart are dropped (the clock is io.nowMs).
 *
 * Use: const p = progressLine(io, 'plan'); p.update('spacecraft 3/6'); ... p.end();
 * or hand `countHook(p, 'spacecraft')` to a stage that reports (done, total).
 */
import type { CliIo } from './io.js';

export const PROGRESS_MIN_INTERVAL_MS = 200;

export interface ProgressLine {
  /** Shows "<command>: <text>"; `force` ignores the rate limit. */
  update(text: string, force?: boolean): void;
  /** Clears the line (call once at the end, also after an error). */
  end(): void;
}

const SILENT: ProgressLine = { update() {}, end() {} };

export function progressLine(io: CliIo, command: string, minIntervalMs = PROGRESS_MIN_INTERVAL_MS): ProgressLine {
  if (!io.isTty) return SILENT;
  let lastMs = -Infinity;
  let shown = 0;
  return {
    update(text, force = false) {
      const now = io.nowMs();
      if (!force && now - lastMs < minIntervalMs) return;
      lastMs = now;
      const line = `${command}: ${text}`;
      io.err(`\r${line}${' '.repeat(Math.max(0, shown - line.length))}`);
      shown = line.length;
    },
    end() {
      if (shown > 0) io.err(`\r${' '.repeat(shown)}\r`);
      shown = 0;
    },
  };
}

/** A (done, total) callback that shows "<noun> done/total" (e.g. "plan: spacecraft 3/6"). */
export function countHook(line: ProgressLine, noun: string): (done: number, total: number, label?: string) => void {
  return (done, total, label) => line.update(`${noun} ${done}/${total}${label ? ` (${label})` : ''}`, done === total);
}
