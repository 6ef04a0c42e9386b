import { once } from 'node:events';
import { byteChunks } from '../report/write.js';

/** What a command may touch of the outside: two text sinks and the clock. */
export interface CliIo {
  out(text: string): void;
  /** Bytes (UTF-8 text made elsewhere) to stdout; absent: outPieces decodes them for out(). */
  outBytes?(bytes: Uint8Array): void;
  /** Resolves when stdout has taken what it was given (a pipe to a slow reader); absent: at once. */
  drained?(): Promise<void> | undefined;
  err(text: string): void;
  /** True when stderr is an interactive terminal (progress is shown only then). */
  isTty: boolean;
  nowMs(): number;
}

export const processIo: CliIo = {
  out: (t) => process.stdout.write(t),
  outBytes: (b) => process.stdout.write(b),
  drained: () => (process.stdout.writableNeedDrain ? once(process.stdout, 'drain').then(() => undefined) : undefined),
  err: (t) => process.stderr.write(t),
  isTty: Boolean(process.stderr.isTTY) && !process.env.CI,
  nowMs: () => Date.now(),
};

/** Bytes gathered before one io.out / io.outBytes call when printing a large output in pieces. */
const OUT_CHUNK_BYTES = 1 << 20;

/**
 * Prints an output made in pieces (text or UTF-8 bytes), a large part at a time (never the
 * whole text as one string), waiting for stdout to drain before the next part (a slow
 * reader of a pipe holds the run back instead of the run holding the output in memory).
 */
export async function outPieces(io: CliIo, pieces: Iterable<string | Uint8Array>): Promise<void> {
  // new buffers each time: the stream may still hold the last one
  for (const chunk of byteChunks(pieces, OUT_CHUNK_BYTES, false)) {
    if (io.outBytes) io.outBytes(chunk);
    else io.out(Buffer.from(chunk.buffer, chunk.byteOffset, chunk.length).toString('utf8'));
    await io.drained?.();
  }
}
