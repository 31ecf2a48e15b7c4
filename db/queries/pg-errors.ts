// Recognise PostgreSQL error codes through Drizzle's error wrapper (the driver error sits in `cause`).
// Used by queries that turn a constraint violation into a clear `conflict`.
/** SQLSTATE 23505: a unique constraint was violated. */
export const UNIQUE_VIOLATION = '23505';

/** The SQLSTATE code of a database error, looking through wrapper errors; undefined for other errors. */
export function pgErrorCode(error: unknown): string | undefined {
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
    current = (current as { cause?: unknown }).cause;
  }
  return undefined;
}
