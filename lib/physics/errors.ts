// Error classes of the solver: invalid input (SpecError), exceeded budget (LimitError) and cancellation (AbortError).
// Callers map them to HTTP 400 / CLI exit 2 (SpecError, LimitError) and to a cancelled run (AbortError).

/** One problem with the input: a dotted path into the spec (e.g. "well.disk.radius") and a readable message. */
export interface SpecIssue {
  path: string;
  message: string;
}

/**
 * The input spec is invalid. `issues` lists every problem found, each with its path.
 *
 * @example
 * throw new SpecError([{ path: 'grid.h', message: 'must be positive' }]);
 */
export class SpecError extends Error {
  readonly issues: SpecIssue[];

  constructor(issues: SpecIssue[] | string, path = '') {
    const list = typeof issues === 'string' ? [{ path, message: issues }] : issues;
    super(list.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join('\n'));
    this.name = 'SpecError';
    this.issues = list;
  }
}

/** The request is valid but exceeds the configured budget; the message says what to change. */
export class LimitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LimitError';
  }
}

/** The computation was cancelled through its AbortSignal. */
export class AbortError extends Error {
  constructor(message = 'computation cancelled') {
    super(message);
    this.name = 'AbortError';
  }
}

/** Throws AbortError when `signal` has been aborted (call between units of work, never inside hot loops). */
export function throwIfAborted(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw new AbortError();
}
