// Count one attempt against a limit kept in PostgreSQL (so that every app process shares it): a sliding window of
// `windowSeconds` that admits `limit` attempts; the next one is refused with a RateLimitedError until the oldest expires.
import { deleteAttemptById, pruneOldAttempts, recordAttemptWithinLimit } from '@/db/queries/rate-limits';
import { RateLimitedError } from './rate-limited-error';

/** A counted attempt; pass it to {@link forgetHit} when it should not count after all. */
export interface RateLimitHit {
  id: string;
}

export interface HitOptions {
  /** What is limited, e.g. 'password-account'. */
  bucket: string;
  /** Whose attempts, e.g. an e-mail address, a client address or a manuscript id. */
  key: string;
  /** Attempts admitted per window. */
  limit: number;
  windowSeconds: number;
  /** The refusal's message for the user. */
  message?: string;
}

/** Keys longer than this are cut (a hostile key must not bloat the table). */
const MAX_KEY_LENGTH = 320;
/** One call in this many also deletes expired attempts of every bucket (common practice: amortised clean-up). */
const PRUNE_EVERY = 200;

/**
 * Count an attempt, or refuse it.
 *
 * @throws RateLimitedError when `limit` attempts already lie within the window (the refused attempt is not counted)
 * @example
 * await hit({ bucket: 'invitation-manuscript', key: manuscriptId, limit: 50, windowSeconds: 86_400 });
 */
export async function hit({ bucket, key, limit, windowSeconds, message }: HitOptions): Promise<RateLimitHit> {
  // PostgreSQL text cannot hold NUL; a hostile key must neither crash the count nor escape it.
  const safeKey = key.replace(/\u0000/g, '\uFFFD').slice(0, MAX_KEY_LENGTH);
  const result = await recordAttemptWithinLimit({ bucket, key: safeKey, limit, windowSeconds });
  if (Math.floor(Math.random() * PRUNE_EVERY) === 0) await pruneOldAttempts();
  if (!result.allowed) throw new RateLimitedError(message ?? 'Too many requests; try again later', result.retryAfterSeconds);
  return { id: result.id };
}

/** Take back a counted attempt (a sign-in that succeeded, an action that failed before doing anything). */
export async function forgetHit(counted: RateLimitHit): Promise<void> {
  await deleteAttemptById({ id: counted.id });
}
