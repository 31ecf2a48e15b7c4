// The edge of error handling: each domain error code's HTTP status, and the JSON error body every route handler
// answers with, `{ error: string, fields?: Record<string, string[]> }` (fields for validation failures).
import { ZodError } from 'zod';
import { DomainError, type DomainErrorCode, type FieldMessages } from '@/lib/domain-error';
import { LimitError, SpecError } from '@/lib/physics/errors';
import { fieldMessages } from '@/lib/validation-fields';
import { RateLimitedError } from '@/lib/rate-limit/rate-limited-error';

/** The JSON body of every error response. */
export interface ErrorBody {
  error: string;
  fields?: FieldMessages;
}

/** The HTTP status of each domain error code (the only place codes meet statuses). */
export const STATUS_OF_CODE: Record<DomainErrorCode, number> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'rate-limited': 429,
  'upstream-failed': 502,
  unavailable: 503,
};

/**
 * A JSON error response.
 *
 * @example
 * return jsonError(409, 'The manuscript has frozen snapshots');
 */
export function jsonError(status: number, error: string, fields?: FieldMessages): Response {
  const body: ErrorBody = fields ? { error, fields } : { error };
  return Response.json(body, { status });
}

/** 400 with per-field messages from a zod error. */
export function zodErrorResponse(error: ZodError, message = 'Some fields are not valid'): Response {
  return jsonError(400, message, fieldMessages(error.issues));
}

/**
 * Any thrown value as a JSON response: a DomainError answers with its code's status, message and fields; a ZodError
 * and the solver's SpecError with 400 and per-field messages; a LimitError with 400 and its message (it says what
 * to change); anything else is logged and answered with 500.
 */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof RateLimitedError) {
    const response = jsonError(STATUS_OF_CODE[error.code], error.message);
    response.headers.set('retry-after', String(error.retryAfterSeconds));
    return response;
  }
  if (error instanceof DomainError) return jsonError(STATUS_OF_CODE[error.code], error.message, error.fields);
  if (error instanceof ZodError) return zodErrorResponse(error);
  if (error instanceof SpecError) return jsonError(400, 'The parameters are not valid', fieldMessages(error.issues));
  if (error instanceof LimitError) return jsonError(400, error.message);
  console.error(error);
  return jsonError(500, 'Something went wrong on the server');
}
