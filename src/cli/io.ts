/** What a command may touch of the outside: two text sinks and the clock. */
export interface CliIo {
  out(text: string): void;
  /** Bytes (UTF-8 text made elsewhere) to stdout; absent: outPieces decodes them for out(). */
  outBytes?(bytes: Uint8Array): void;
  err(text: string): void;
  /** True when stderr is an interactive terminal (progress is shown only then). */
  isTty: boolean;
  nowMs(): number;
}

export const processIo: CliIo = {
  out: (t) => process.stdout.write(t),
  outBytes: (b) => process.stdout.write(b),
  err: (t) => process.stderr.write(t),
  isTty: Boolean(process.stderr.isTTY) && !process.env.CI,
  nowMs: () => Date.now(),
};

/** Bytes gathered before one io.out / io.outBytes call when printing a large output in pieces. */
const OUT_CHUNK_BYTES = 1 << 20;

/** Prints an output made in pieces (text or UTF-8 bytes), a large part at a time (never the whole text as one string). */
export function outPieces(io: CliIo, pieces: Iterable<string | Uint8Array>): void {
  let buf = Buffer.allocUnsafe(OUT_CHUNK_BYTES);
  let pos = 0;
  const flush = (): void => {
    if (pos === 0) return;
    if (io.outBytes) {
      io.outBytes(buf.subarray(0, pos));
      buf = Buffer.allocUnsafe(OUT_CHUNK_BYTES); // the stream may still hold the last one
    } else io.out(buf.toString('utf8', 0, pos));
    pos = 0;
  };
  for (const p of pieces) {
    const most = typeof p === 'string' ? p.length * 3 : p.length;
    if (pos + most > buf.length) {
      flush();
      if (most > buf.length) {
        if (typeof p === 'string') io.out(p);
        else if (io.outBytes) io.outBytes(p);
        else io.out(Buffer.from(p.buffer, p.byteOffset, p.length).toString('utf8'));
        continue;
      }
    }
    if (typeof p === 'string') pos += buf.write(p, pos, 'utf8');
    else {
      buf.set(p, pos);
      pos += p.length;
    }
  }
  flush();
}
