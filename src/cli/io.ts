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
