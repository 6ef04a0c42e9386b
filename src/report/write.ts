/**
 * The only place that writes files. Every output is written to a temporary
 * file beside its target and renamed into place, so an interrupted run leaves
 * either the old file or the new one, never half of one. A set of outputs is
 * renamed only after all of them have been written.
 */
import { mkdirSync, writeFileSync, renameSync, rmSync, createWriteStream } from 'node:fs';
import { dirname, join } from 'node:path';
import { once } from 'node:events';

export interface OutputFile {
  /** Path relative to the output folder. */
  name: string;
  content: string;
}

function tempBeside(path: string): string {
  return join(dirname(path), `.${path.split('/').pop() ?? 'out'}.${process.pid}.tmp`);
}

/** Temp files being written now, so an interrupted run can remove them. */
const openTemps = new Set<string>();

/**
 * Removes every temp file still being written (the CLI calls this on SIGINT/SIGTERM):
 * the targets were never renamed, so nothing half-written is left behind.
 */
export function removeOpenTemps(): void {
  for (const t of openTemps) rmSync(t, { force: true });
  openTemps.clear();
}

/** Writes all files atomically under `dir`; returns their final paths. */
export function writeOutputs(dir: string, files: OutputFile[]): string[] {
  const staged: { temp: string; final: string }[] = [];
  try {
    for (const f of files) {
      const final = join(dir, f.name);
      mkdirSync(dirname(final), { recursive: true });
      const temp = tempBeside(final);
      openTemps.add(temp);
      writeFileSync(temp, f.content, 'utf8');
      staged.push({ temp, final });
    }
  } catch (err) {
    for (const s of staged) rmSync(s.temp, { force: true });
    removeOpenTemps();
    throw err;
  }
  for (const s of staged) {
    renameSync(s.temp, s.final);
    openTemps.delete(s.temp);
  }
  return staged.map((s) => s.final);
}

/**
 * A streamed output (large CSV): rows go to a temp file as they are made and
 * the file is renamed into place only by `commit()`. `abort()` removes it.
 */
export interface StreamedOutput {
  write(chunk: string): Promise<void>;
  commit(): Promise<string>;
  abort(): void;
}

export function openStreamedOutput(path: string): StreamedOutput {
  mkdirSync(dirname(path), { recursive: true });
  const temp = tempBeside(path);
  openTemps.add(temp);
  const stream = createWriteStream(temp, { encoding: 'utf8' });
  return {
    async write(chunk: string) {
      if (!stream.write(chunk)) await once(stream, 'drain');
    },
    async commit() {
      stream.end();
      await once(stream, 'finish');
      renameSync(temp, path);
      openTemps.delete(temp);
      return path;
    },
    abort() {
      stream.destroy();
      rmSync(temp, { force: true });
      openTemps.delete(temp);
    },
  };
}
