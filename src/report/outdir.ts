/**
 * The output folder, checked before a run starts its work (README "Failure
 * behaviour"): `--out` must not be empty, must be a folder or a path that can
 * become one (not a file, not under a file), must be writable, and the names the
 * run writes must not be taken by folders. Each problem is an OutputError: one
 * line naming the path and what is wrong, exit 2, nothing computed yet.
 *
 * Also removes the temp files a stopped run left (killed with SIGKILL, power
 * lost): names made by src/report/write.ts on this host whose process no longer
 * exists. A previous output such a run had set aside (".old") while renaming is
 * put back when its file is missing, else removed.
 */
import { closeSync, existsSync, lstatSync, openSync, readdirSync, renameSync, rmSync, statSync, statfsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { OutputError, UsageError } from '../errors.js';
import { RUN_TAG, TEMP_NAME, hostTag, outputErrorOf, shownPath } from './write.js';

/** Free space below which a run refuses to start writing, bytes. */
export const MIN_FREE_BYTES = 256 * 1024;

export interface OutDirCheck {
  /** Files the run writes (relative to the folder), checked not to be folders. */
  names?: readonly string[];
  /** Told about stale temp files removed (one line each call). */
  note?: (line: string) => void;
}

export function checkOutputDir(dir: string, opts: OutDirCheck = {}): void {
  if (dir.trim() === '') throw new UsageError('--out: "" is empty; valid: a folder name (e.g. out, or . for the current folder)');
  const abs = resolve(dir);
  const shown = shownPath(dir);
  // the folder itself, or the nearest part of its path that exists
  let existing = abs;
  while (!existsSync(existing)) {
    const up = dirname(existing);
    if (up === existing) break;
    existing = up;
  }
  let st;
  try {
    st = statSync(existing);
  } catch (err) {
    throw outputErrorOf(err, shown) ?? err;
  }
  if (!st.isDirectory()) {
    if (existing === abs) throw new OutputError(shown, 'is a file, not a folder; valid: a folder (or a path where one can be made)');
    throw new OutputError(shown, `sits under ${shownPath(existing)}, which is a file, not a folder`);
  }
  // writable: make and remove a probe file (catches read-only mounts, where root's rights do not help)
  const probe = join(existing, `.probe.${RUN_TAG}.tmp`);
  try {
    closeSync(openSync(probe, 'wx'));
    rmSync(probe, { force: true });
  } catch (err) {
    const e = outputErrorOf(err, existing === abs ? shown : shownPath(existing));
    throw e ? new OutputError(e.path, `${e.reason.replace(/; nothing was replaced.*$/, '')}: the output folder cannot be written`) : err;
  }
  try {
    const fs = statfsSync(existing);
    const free = Number(fs.bavail) * Number(fs.bsize);
    if (free < MIN_FREE_BYTES) throw new OutputError(shown, `only ${free} bytes free on its device; valid: at least ${MIN_FREE_BYTES} bytes to write the outputs`);
  } catch (err) {
    if (err instanceof OutputError) throw err;
    // statfs unsupported here: the write itself reports a full disk
  }
  if (existing !== abs) return; // the folder is new: no names taken, no stale temps
  for (const name of opts.names ?? []) {
    const target = join(abs, name);
    const t = lstatSync(target, { throwIfNoEntry: false });
    if (t && !t.isFile()) throw new OutputError(shownPath(target), `is ${t.isDirectory() ? 'a folder' : 'not a regular file'}; the run writes a file of that name there`);
  }
  const removed = removeStaleTemps(abs);
  if (removed.files > 0) {
    opts.note?.(
      `note: removed ${removed.files} temp file${removed.files > 1 ? 's' : ''} left in ${shown} by stopped run${removed.pids.length > 1 ? 's' : ''} (pid ${removed.pids.join(', ')})` +
        (removed.restored > 0 ? `; ${removed.restored} previous output${removed.restored > 1 ? 's' : ''} put back` : '') +
        '\n',
    );
  }
}

function processAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Removes temp files of dead runs of this host in `dir` and its sub-folders (one level). */
export function removeStaleTemps(dir: string): { files: number; restored: number; pids: number[] } {
  const host = hostTag();
  const pids = new Set<number>();
  let files = 0;
  let restored = 0;
  const scan = (d: string, depth: number): void => {
    let entries;
    try {
      entries = readdirSync(d, { withFileTypes: true });
    } catch {
      return;
    }
    for (const e of entries) {
      if (e.isDirectory()) {
        // a stopped run's temp folder (its spilled contact texts) goes whole
        const t = TEMP_NAME.exec(e.name);
        if (t && t[2] === host && t[4] === 'tmp' && !processAlive(Number(t[3]))) {
          try {
            rmSync(join(d, e.name), { recursive: true, force: true });
            files++;
            pids.add(Number(t[3]));
          } catch {
            // cannot remove it: leave it
          }
          continue;
        }
        if (depth > 0) scan(join(d, e.name), depth - 1);
        continue;
      }
      const m = TEMP_NAME.exec(e.name);
      if (!m || m[2] !== host) continue;
      const pid = Number(m[3]);
      if (processAlive(pid)) continue;
      const path = join(d, e.name);
      const target = join(d, m[1]!);
      try {
        if (m[4] === 'old' && !existsSync(target)) {
          renameSync(path, target);
          restored++;
        } else rmSync(path, { force: true });
        files++;
        pids.add(pid);
      } catch {
        // cannot remove it: leave it
      }
    }
  };
  scan(dir, 1);
  return { files, restored, pids: [...pids].sort((a, b) => a - b) };
}
