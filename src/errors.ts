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
