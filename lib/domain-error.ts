// The one error type of Fluxfolio's domain: a code (not-found, forbidden, conflict, invalid, …), a message for people
// and optional per-field messages. Thrown by lib/ and db/queries; only lib/http turns a code into an HTTP status.

/** What went wrong, in the domain's words; lib/http/errors.ts maps each code to a status. */
export const DOMAIN_ERROR_CODES = [
  /** The input breaks a rule of its schema (per-field messages in `fields`). */
  'invalid',
  /** No valid session. */
  'unauthenticated',
  /** Signed in, but the role (or the identity) does not allow this action. */
  'forbidden',
  /** Does not exist, or the caller may not know that it exists. */
  'not-found',
  /** Conflicts with the current state: last owner, frozen snapshots, duplicates, finished runs, used invitations… */
  'conflict',
  /** The request is larger than anything a route takes. */
  'too-large',
  /** Too many attempts of this kind in a time window (sign-ins, mails, invitations, run starts). */
  'rate-limited',
  /** A service we hand work to (the mail server) refused or failed. */
  'upstream-failed',
  /** A service we need (the run queue) is not available right now; trying again later may work. */
  'unavailable',
] as const;

export type DomainErrorCode = (typeof DOMAIN_ERROR_CODES)[number];

/** Per-field messages: the key is the dotted path of the field (`'email'`, `'params.grid.h'`), `'_'` the whole value. */
export type FieldMessages = Record<string, string[]>;

/**
 * An error of the domain. lib/http answers it with its code's status and `{ error: message, fields }`; pages
 * inspect `code` (e.g. `not-found` becomes Next's notFound()).
 *
 * @example
 * throw new DomainError('not-found', 'Manuscript not found');
 */
export class DomainError extends Error {
  readonly code: DomainErrorCode;
  readonly fields?: FieldMessages;

  constructor(code: DomainErrorCode, message: string, fields?: FieldMessages) {
    super(message);
    this.name = 'DomainError';
    this.code = code;
    if (fields) this.fields = fields;
  }
}

/** True when `error` is a DomainError (of `code`, when given). */
export function isDomainError(error: unknown, code?: DomainErrorCode): error is DomainError {
  return error instanceof DomainError && (code === undefined || error.code === code);
}

/** The input is not valid; `fields` says which field is wrong and why. */
export const invalid = (message = 'Some fields are not valid', fields?: FieldMessages) =>
  new DomainError('invalid', message, fields);
/** No valid session. */
export const unauthenticated = (message = 'Sign in to continue') => new DomainError('unauthenticated', message);
/** Signed in, but not allowed. */
export const forbidden = (message = 'Your role does not allow this action') => new DomainError('forbidden', message);
/** Unknown, or not to be revealed. */
export const notFound = (message = 'Not found') => new DomainError('not-found', message);
/** Conflicts with the current state. */
export const conflict = (message: string, fields?: FieldMessages) => new DomainError('conflict', message, fields);
/** Larger than allowed. */
export const tooLarge = (message = 'The request body is too large') => new DomainError('too-large', message);
/** A service we hand work to failed (the message says what to do). */
export const upstreamFailed = (message: string) => new DomainError('upstream-failed', message);
/** A service we need is down for now (the message says what to do). */
export const unavailable = (message: string) => new DomainError('unavailable', message);
