// Typed HTTP errors and the JSON error body every route handler answers with:
// `{ error: string, fields?: Record<string, string[]> }` (fields only for 400 validation failures).
import { ZodError } from 'zod';
import { RateLimitedError } from '@/lib/rate-limit/rate-limited-error';

/** The JSON body of every error response. */
export interface ErrorBody {
  error: string;
  fields?: Record<string, string[]>;
}

/**
 * An error that knows its HTTP status. Thrown by lib/ and db/queries, turned into a JSON response by
 * {@link toErrorResponse} (route handlers) or shown as a message (pages).
 *
 * @example
 * throw new HttpError(404, 'Manuscript not found');
 */
export class HttpError extends Error {
  readonly status: number;
  readonly fields?: Record<string, string[]>;

  constructor(status: number, message: string, fields?: Record<string, string[]>) {
    super(message);
    this.name = 'HttpError';
    this.status = status;
    this.fields = fields;
  }
}

/** 401: the request carries no valid session. */
export const unauthorized = (message = 'Sign in to continue') => new HttpError(401, message);
/** 403: signed in, but the role does not allow this action. */
export const forbidden = (message = 'Your role does not allow this action') => new HttpError(403, message);
/** 404: does not exist, or the caller may not know that it exists. */
export const notFound = (message = 'Not found') => new HttpError(404, message);
/** 409: the request conflicts with the current state (last owner, frozen snapshots, duplicates…). */
export const conflict = (message: string, fields?: Record<string, string[]>) => new HttpError(409, message, fields);

/**
 * A JSON error response.
 *
 * @example
 * return jsonError(409, 'The manuscript has frozen snapshots');
 */
export function jsonError(status: number, error: string, fields?: Record<string, string[]>): Response {
  const body: ErrorBody = fields ? { error, fields } : { error };
  return Response.json(body, { status });
}

/**
 * Per-field messages from a zod error: the key is the dotted path of the field (`'email'`, `'members.0.role'`);
 * issues that concern the whole value are stored under `'_'`.
 */
export function zodFieldErrors(error: ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

/** 400 with per-field messages from a zod error. */
export function zodErrorResponse(error: ZodError, message = 'Some fields are not valid'): Response {
  return jsonError(400, message, zodFieldErrors(error));
}

/** Any thrown value as a JSON response: HttpError keeps its status; anything else is logged and answered with 500. */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof HttpError) return jsonError(error.status, error.message, error.fields);
  if (error instanceof RateLimitedError) {
    const response = jsonError(429, error.message);
    response.headers.set('retry-after', String(error.retryAfterSeconds));
    return response;
  }
  if (error instanceof ZodError) return zodErrorResponse(error);
  console.error(error);
  return jsonError(500, 'Something went wrong on the server');
}
