/**
 * How the program stops when the outside world stops it (README "Failure
 * behaviour"):
 *  - SIGINT (Ctrl-C) / SIGTERM: the plan workers are terminated, every temp file
 *    being written is removed (no output was renamed yet, so the previous outputs
 *    stay as they were), one note on stderr, exit 130 / 143 (128 + the signal
 *    number, what a shell reports for a process the signal stopped).
 *  - stdout closed by its reader (EPIPE, e.g. `| head -1`): the run ends at once,
 *    quietly, the same way (nothing new written), exit 141 (128 + SIGPIPE, what a
 *    shell reports for a writer stopped by a closed pipe), for every command.
 * The heavy work of `plan` and `margin` runs on worker threads (src/plan/parallel.ts)
 * and writing is asynchronous (src/report/write.ts), so the main thread gets to
 * these handlers promptly.
 */
import { removeOpenTemps } from '../report/write.js';
import { terminateWorkers } from '../plan/workers.js';

export const EXIT_SIGINT = 130;
export const EXIT_SIGTERM = 143;
export const EXIT_PIPE_CLOSED = 141;

let stopping = false;

/** Ends the run now: workers stopped, temp files removed, `code` returned to the shell. */
export function stopNow(code: number, note?: string): never {
  if (!stopping) {
    stopping = true;
    terminateWorkers();
    removeOpenTemps();
    if (note !== undefined) {
      try {
        process.stderr.write(note);
      } catch {
        // stderr gone too: nothing more to say
      }
    }
  }
  process.exit(code);
}

export function installStopHandlers(): void {
  process.on('SIGINT', () => stopNow(EXIT_SIGINT, '\ninterrupted (SIGINT): stopped; no output was written or replaced\n'));
  process.on('SIGTERM', () => stopNow(EXIT_SIGTERM, 'terminated (SIGTERM): stopped; no output was written or replaced\n'));
  const onStreamError = (err: NodeJS.ErrnoException): void => {
    if (err.code === 'EPIPE' || err.code === 'ERR_STREAM_DESTROYED') stopNow(EXIT_PIPE_CLOSED);
    throw err;
  };
  process.stdout.on('error', onStreamError);
  // a closed stderr is not worth stopping for; the exit code still tells
  process.stderr.on('error', () => {});
}
