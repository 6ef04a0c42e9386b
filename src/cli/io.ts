/** What a command may touch of the outside: two text sinks and the clock. */
export interface CliIo {
  out(text: string): void;
  err(text: string): void;
  /** True when stderr is an interactive terminal (progress is shown only then). */
  isTty: boolean;
  nowMs(): number;
}

export const processIo: CliIo = {
  out: (t) => process.stdout.write(t),
  err: (t) => process.stderr.write(t),
  isTty: Boolean(process.stderr.isTTY) && !process.env.CI,
  nowMs: () => Date.now(),
};

/** Characters gathered before one io.out call when printing a large output in pieces. */
const OUT_CHUNK_CHARS = 1 << 20;

/** Prints an output made in pieces, a large part at a time (never the whole text as one string). */
export function outPieces(io: CliIo, pieces: Iterable<string>): void {
  let buf = '';
  for (const p of pieces) {
    buf += p;
    if (buf.length >= OUT_CHUNK_CHARS) {
      io.out(buf);
      buf = '';
    }
  }
  if (buf.length > 0) io.out(buf);
}
