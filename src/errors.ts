/**
 * Errors a user can cause. The CLI prints each as one line and exits 2.
 * Anything else that is thrown is a bug and is allowed to crash.
 */

/** One problem in an input file: which file, which field, the value and what is valid. */
export interface Problem {
  file: string;
  /** Field path such as "stations[2].mask.elevationDeg" ("" for the whole file). */
  path: string;
  message: string;
}

export function formatProblem(p: Problem): string {
  return p.path ? `${p.file}: ${p.path}: ${p.message}` : `${p.file}: ${p.message}`;
}

/** Bad input files: carries every problem found, not only the first. */
export class ScenarioError extends Error {
  readonly problems: Problem[];
  constructor(problems: Problem[]) {
    super(problems.map(formatProblem).join('\n'));
    this.name = 'ScenarioError';
    this.problems = problems;
  }
}

/**
 * A model asked for outside the range where it is valid (e.g. P.618 above 55 GHz).
 * `context` says where it was asked for (e.g. "radio X-DATA at station EQP"), as data:
 * callers that add it keep the class, so a caller up the stack can still tell a model's
 * range from a bad file.
 */
export class ModelRangeError extends Error {
  constructor(
    readonly model: string,
    readonly field: string,
    readonly value: number,
    readonly valid: string,
    readonly context?: string,
  ) {
    super(`${context ? `${context}: ` : ''}${model}: ${field} = ${value} is outside its valid range (${valid})`);
    this.name = 'ModelRangeError';
  }

  /** The same error with `context` set (the innermost context is kept when one is already there). */
  withContext(context: string): ModelRangeError {
    if (this.context !== undefined) return this;
    const e = new ModelRangeError(this.model, this.field, this.value, this.valid, context);
    if (this.stack !== undefined) e.stack = this.stack;
    return e;
  }
}

/** A bad command-line value (flag name, value, what is valid). */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/**
 * The output folder cannot take the run's files (it is a file, sits under a file,
 * is not writable, the disk is full): one line naming the path and what is wrong,
 * exit 2. Nothing was replaced when this is thrown.
 */
export class OutputError extends Error {
  constructor(
    readonly path: string,
    readonly reason: string,
  ) {
    super(`${path}: ${reason}`);
    this.name = 'OutputError';
  }
}

/** Most problems printed for one run; the rest are counted ("... and N more"). */
export const MAX_PROBLEMS_PRINTED = 50;

/** The lines a ScenarioError prints: at most MAX_PROBLEMS_PRINTED, then a count of the rest. */
export function problemLines(problems: readonly Problem[], max = MAX_PROBLEMS_PRINTED): string[] {
  const lines: string[] = [];
  for (let i = 0; i < problems.length && i < max; i++) lines.push(formatProblem(problems[i]!));
  if (problems.length > max) lines.push(`... and ${problems.length - max} more problems (${problems.length} in all; the first ${max} are shown)`);
  return lines;
}

/**
 * Appends `more` to `into` without spreading it into arguments (a spread of
 * 100,000 problems overflows the call stack).
 */
export function appendAll<T>(into: T[], more: readonly T[]): void {
  for (let i = 0; i < more.length; i++) into.push(more[i]!);
}

/** A user's error as plain data, to cross a worker-thread boundary (structured clone keeps no class). */
export type SerializedError =
  | { kind: 'ScenarioError'; problems: Problem[] }
  | { kind: 'ModelRangeError'; model: string; field: string; value: number; valid: string }
  | { kind: 'UsageError'; message: string }
  | { kind: 'OutputError'; path: string; reason: string }
  | { kind: 'other'; name: string; message: string; stack?: string };

export function serializeError(err: unknown): SerializedError {
  if (err instanceof ScenarioError) return { kind: 'ScenarioError', problems: err.problems };
  if (err instanceof ModelRangeError) return { kind: 'ModelRangeError', model: err.model, field: err.field, value: err.value, valid: err.valid };
  if (err instanceof UsageError) return { kind: 'UsageError', message: err.message };
  if (err instanceof OutputError) return { kind: 'OutputError', path: err.path, reason: err.reason };
  const e = err instanceof Error ? err : new Error(String(err));
  return { kind: 'other', name: e.name, message: e.message, ...(e.stack !== undefined ? { stack: e.stack } : {}) };
}

/** The error serializeError described, as its own class again (a bug stays a plain Error with its stack). */
export function reviveError(s: SerializedError): Error {
  switch (s.kind) {
    case 'ScenarioError':
      return new ScenarioError(s.problems);
    case 'ModelRangeError':
      return new ModelRangeError(s.model, s.field, s.value, s.valid);
    case 'UsageError':
      return new UsageError(s.message);
    case 'OutputError':
      return new OutputError(s.path, s.reason);
    case 'other': {
      const e = new Error(s.message);
      e.name = s.name;
      if (s.stack !== undefined) e.stack = s.stack;
      return e;
    }
  }
}
