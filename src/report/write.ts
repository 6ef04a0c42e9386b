/**
 * The only place that writes files. Every output is written to a temporary
 * file beside its target and renamed into place, so an interrupted run leaves
 * either the old file or the new one, never half of one. A run's set of files
 * is all-or-nothing: every file is written to its temp name first; only then are
 * they renamed, each previous output moved aside first, so that a rename failing
 * part-way puts every previous output back and removes every temp file.
 *
 * Temp names say which run made them (".plan.json.passbudget-<host>-<pid>-<start>.tmp",
 * previous outputs set aside as "....old"): a later run removes the ones of a
 * process that no longer exists (src/report/outdir.ts) and says so.
 */
import { lstatSync, mkdirSync, renameSync, rmSync, rmdirSync, createWriteStream } from 'node:fs';
import { mkdir, open, writeFile, type FileHandle } from 'node:fs/promises';
import { hostname } from 'node:os';
import { basename, dirname, join, relative } from 'node:path';
import { OutputError } from '../errors.js';

export interface OutputFile {
  /** Path relative to the output folder. */
  name: string;
  /**
   * The whole text, or its pieces in order (text, or UTF-8 bytes made elsewhere: a worker's
   * rendered contacts), made while the file is written, so a large output never exists as
   * one string: the pieces are gathered into WRITE_CHUNK_BYTES writes.
   */
  content: string | Iterable<string | Uint8Array> | Uint8Array;
}

/** Bytes gathered before one write of a streamed output. */
export const WRITE_CHUNK_BYTES = 1 << 20;

/** Writes all of `bytes` at the file's current position. */
async function writeAll(fh: FileHandle, bytes: Uint8Array): Promise<void> {
  let at = 0;
  while (at < bytes.length) {
    const { bytesWritten } = await fh.write(bytes, at, bytes.length - at);
    at += bytesWritten;
  }
}

/**
 * Pieces (text or UTF-8 bytes) gathered into chunks of `chunkBytes`; a piece larger than a
 * chunk comes on its own (text encoded). With `reuse`, two buffers take turns: a chunk is
 * valid until the next but one is asked for (a writer awaits one write before starting
 * the next); without it every chunk is a new buffer (a stream may hold on to it).
 */
export function* byteChunks(pieces: Iterable<string | Uint8Array>, chunkBytes: number, reuse: boolean): Generator<Uint8Array> {
  const buffers = reuse ? [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)] : [];
  let turn = 0;
  let chunk = reuse ? buffers[0]! : Buffer.allocUnsafe(chunkBytes);
  let pos = 0;
  const take = (): Uint8Array => {
    const out = chunk.subarray(0, pos);
    turn = 1 - turn;
    chunk = reuse ? buffers[turn]! : Buffer.allocUnsafe(chunkBytes);
    pos = 0;
    return out;
  };
  for (const piece of pieces) {
    const most = typeof piece === 'string' ? piece.length * 3 : piece.length;
    if (pos + most > chunk.length) {
      if (pos > 0) yield take();
      if (most > chunk.length) {
        // (without reuse, a copy: a piece may be a view into a buffer its maker reuses)
        yield typeof piece === 'string' ? Buffer.from(piece, 'utf8') : reuse ? piece : Buffer.from(piece);
        continue;
      }
    }
    if (typeof piece === 'string') pos += chunk.write(piece, pos, 'utf8');
    else {
      chunk.set(piece, pos);
      pos += piece.length;
    }
  }
  if (pos > 0) yield take();
}

/**
 * Writes `content` to `path` (a new file): text as UTF-8, piece by piece for an iterable
 * (in 1 MiB chunks, one gathered while the one before is being written); bytes as they are.
 */
async function writeContent(path: string, content: OutputFile['content']): Promise<void> {
  if (typeof content === 'string' || content instanceof Uint8Array) {
    await writeFile(path, content);
    return;
  }
  const fh = await open(path, 'w');
  let pending: Promise<void> = Promise.resolve();
  try {
    for (const chunk of byteChunks(content, WRITE_CHUNK_BYTES, true)) {
      await pending; // the buffer the next chunk is gathered in is free again
      pending = writeAll(fh, chunk);
      pending.catch(() => undefined); // awaited below; never an unhandled rejection meanwhile
    }
    await pending;
  } finally {
    await fh.close();
  }
}

/** Host names as they may appear in a file name. */
export function hostTag(host = hostname()): string {
  return host.replace(/[^A-Za-z0-9_]/g, '_').slice(0, 40) || 'host';
}

/** This run's mark in its temp names: host, pid, start time (base 36). */
export const RUN_TAG = `passbudget-${hostTag()}-${process.pid}-${Date.now().toString(36)}`;

/** What a temp or set-aside name of any run looks like: [whole, target base name, host, pid, kind]. */
export const TEMP_NAME = /^\.(.+)\.passbudget-([A-Za-z0-9_]+)-(\d+)-[0-9a-z]+\.(tmp|old)$/;

function besideWith(path: string, kind: 'tmp' | 'old'): string {
  return join(dirname(path), `.${basename(path)}.${RUN_TAG}.${kind}`);
}

/** Temp files being written now, so an interrupted run can remove them. */
const openTemps = new Set<string>();
/** Temp folders (a run's spilled contact texts: report/contact-store.ts) removed the same way. */
const openTempDirs = new Set<string>();

/**
 * A temp folder of this run under `base` (named like a temp file, so a later run removes
 * it when this one was killed: outdir.ts); removed by removeTempDir, or on a signal.
 */
export function makeTempDir(base: string, what: string): string {
  const dir = join(base, `.${what}.${RUN_TAG}.tmp`);
  try {
    mkdirSync(dir, { recursive: true });
  } catch (err) {
    throw outputErrorOf(err, dir) ?? err;
  }
  openTempDirs.add(dir);
  return dir;
}

export function removeTempDir(dir: string): void {
  rmSync(dir, { recursive: true, force: true });
  openTempDirs.delete(dir);
}

/**
 * Removes every temp file still being written (the CLI calls this on SIGINT/SIGTERM
 * or a closed stdout): the targets were never renamed, so nothing half-written is
 * left behind.
 */
export function removeOpenTemps(): void {
  for (const t of openTemps) rmSync(t, { force: true });
  openTemps.clear();
  for (const d of openTempDirs) rmSync(d, { recursive: true, force: true });
  openTempDirs.clear();
}

/** A failed write or rename as one line: which path and what went wrong. */
export function outputErrorOf(err: unknown, path: string): OutputError | undefined {
  if (err instanceof OutputError) return err;
  const code = (err as NodeJS.ErrnoException | undefined)?.code;
  if (typeof code !== 'string') return undefined;
  const undone = 'nothing was replaced (temp files removed)';
  const why: Record<string, string> = {
    ENOSPC: `no space left on the device while writing; ${undone}`,
    EDQUOT: `disk quota exceeded while writing; ${undone}`,
    EROFS: `is on a read-only file system; ${undone}`,
    EACCES: `permission denied; ${undone}`,
    EPERM: `operation not permitted; ${undone}`,
    ENOTDIR: `a part of this path is a file, not a folder; ${undone}`,
    EISDIR: `is a folder, not a file; ${undone}`,
    ENOTEMPTY: `is a folder, not a file; ${undone}`,
    EEXIST: `exists and is not a folder; ${undone}`,
  };
  return new OutputError(path, why[code] ?? `cannot be written (${code}); ${undone}`);
}

interface Staged {
  temp: string;
  final: string;
  /** The previous output, moved aside while the new one is renamed in. */
  aside?: string;
  renamed?: boolean;
}

/** Writes all files under `dir`, all or nothing; returns their final paths. */
export async function writeOutputs(dir: string, files: OutputFile[]): Promise<string[]> {
  const staged: Staged[] = [];
  const madeDirs: string[] = [];
  const discard = (): void => {
    for (const s of staged) {
      rmSync(s.temp, { force: true });
      openTemps.delete(s.temp);
    }
    for (const d of madeDirs.reverse()) {
      try {
        rmdirSync(d);
      } catch {
        // not empty or gone: leave it
      }
    }
  };
  let at = dir;
  try {
    for (const f of files) {
      const final = join(dir, f.name);
      at = final;
      const made = await mkdir(dirname(final), { recursive: true });
      if (made !== undefined) madeDirs.push(made);
      const temp = besideWith(final, 'tmp');
      openTemps.add(temp);
      staged.push({ temp, final });
      await writeContent(temp, f.content);
    }
  } catch (err) {
    discard();
    throw outputErrorOf(err, at) ?? err;
  }
  // Every temp is written: rename them all in one go (no await from here on, so a
  // signal is acted on either before any rename or after all of them).
  for (const s of staged) {
    const st = lstatSync(s.final, { throwIfNoEntry: false });
    if (st && !st.isFile()) {
      discard();
      throw new OutputError(s.final, `is ${st.isDirectory() ? 'a folder' : 'not a regular file'}, not replaced by the output file; nothing was replaced (temp files removed)`);
    }
  }
  try {
    for (const s of staged) {
      at = s.final;
      if (lstatSync(s.final, { throwIfNoEntry: false })) {
        const aside = besideWith(s.final, 'old');
        renameSync(s.final, aside);
        s.aside = aside;
      }
      renameSync(s.temp, s.final);
      s.renamed = true;
      openTemps.delete(s.temp);
    }
  } catch (err) {
    rollBack(staged);
    discard();
    throw outputErrorOf(err, at) ?? err;
  }
  for (const s of staged) if (s.aside) rmSync(s.aside, { force: true });
  return staged.map((s) => s.final);
}

/** Puts every previous output back where a rename failed part-way. */
function rollBack(staged: Staged[]): void {
  for (const s of [...staged].reverse()) {
    try {
      if (s.renamed) rmSync(s.final, { force: true });
      if (s.aside) renameSync(s.aside, s.final);
    } catch {
      // best effort; the ".old" file stays and a later run restores it (outdir.ts)
    }
  }
}

/** A path for messages: relative to the current folder when under it. */
export function shownPath(path: string): string {
  const r = relative(process.cwd(), path);
  return r === '' || r.startsWith('..') ? path : r;
}

/**
 * A streamed output (large CSV): rows go to a temp file as they are made and
 * the file is renamed into place only by `commit()`. `abort()` removes it.
 * A failing write (a full disk) rejects with an OutputError naming the path.
 */
export interface StreamedOutput {
  write(chunk: string): Promise<void>;
  commit(): Promise<string>;
  abort(): void;
  /** The first write error, as an OutputError naming the target. */
  failure(): OutputError | undefined;
}

/** Resolves on `event` or when the stream closes (after an error), leaving no listener behind. */
function settled(stream: NodeJS.EventEmitter, event: string): Promise<void> {
  return new Promise((resolve) => {
    const done = (): void => {
      stream.off(event, done);
      stream.off('close', done);
      resolve();
    };
    stream.on(event, done);
    stream.on('close', done);
  });
}

export function openStreamedOutput(path: string): StreamedOutput {
  try {
    mkdirSync(dirname(path), { recursive: true });
  } catch (err) {
    throw outputErrorOf(err, dirname(path)) ?? err;
  }
  const temp = besideWith(path, 'tmp');
  openTemps.add(temp);
  const stream = createWriteStream(temp, { encoding: 'utf8' });
  let failed: OutputError | undefined;
  stream.on('error', (err) => {
    failed ??= outputErrorOf(err, path) ?? new OutputError(path, `cannot be written (${err.message})`);
  });
  const check = (): void => {
    if (failed) throw failed;
  };
  return {
    async write(chunk: string) {
      check();
      if (!stream.write(chunk)) {
        await settled(stream, 'drain');
        check();
      }
    },
    async commit() {
      check();
      stream.end();
      await settled(stream, 'finish');
      check();
      try {
        const st = lstatSync(path, { throwIfNoEntry: false });
        if (st && !st.isFile()) throw new OutputError(path, `is ${st.isDirectory() ? 'a folder' : 'not a regular file'}, not replaced by the output file; nothing was replaced (temp files removed)`);
        renameSync(temp, path);
      } catch (err) {
        throw outputErrorOf(err, path) ?? err;
      }
      openTemps.delete(temp);
      return path;
    },
    abort() {
      stream.destroy();
      rmSync(temp, { force: true });
      openTemps.delete(temp);
    },
    failure: () => failed,
  };
}
