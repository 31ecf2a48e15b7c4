// Queries behind the rate limits: count the attempts of a (bucket, key) inside a sliding window and record a new one
// atomically (a transaction-scoped advisory lock per bucket and key), forget an attempt, prune old attempts.
import { and, asc, count, eq, gt, lt, sql } from 'drizzle-orm';
import { db } from '@/db';
import { rateLimitEvents } from '@/db/schema';

/** Attempts older than this are deleted whatever their bucket (the longest window in use is one day). */
export const RATE_LIMIT_RETENTION_SECONDS = 2 * 86_400;

export type RecordAttemptResult =
  | { allowed: true; id: string }
  | { allowed: false; retryAfterSeconds: number };

/**
 * Record one attempt of `key` in `bucket` unless `limit` attempts already lie within the last `windowSeconds`.
 * Refused attempts are not recorded. Concurrent callers on the same bucket and key are serialised.
 *
 * @example
 * const r = await recordAttemptWithinLimit({ bucket: 'password-account', key: 'a@b.org', limit: 20, windowSeconds: 900 });
 */
export async function recordAttemptWithinLimit({
  bucket,
  key,
  limit,
  windowSeconds,
}: {
  bucket: string;
  key: string;
  limit: number;
  windowSeconds: number;
}): Promise<RecordAttemptResult> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`SELECT pg_advisory_xact_lock(hashtextextended(${`${bucket}:${key}`}, 0))`);
    const since = sql`now() - make_interval(secs => ${windowSeconds})`;
    const inWindow = and(eq(rateLimitEvents.bucket, bucket), eq(rateLimitEvents.key, key), gt(rateLimitEvents.at, since));
    const [{ n }] = await tx.select({ n: count() }).from(rateLimitEvents).where(inWindow);
    if (n >= limit) {
      const [oldest] = await tx
        .select({ wait: sql<number>`extract(epoch from (${rateLimitEvents.at} + make_interval(secs => ${windowSeconds}) - now()))::float8` })
        .from(rateLimitEvents)
        .where(inWindow)
        .orderBy(asc(rateLimitEvents.at))
        .limit(1);
      return { allowed: false as const, retryAfterSeconds: Math.max(1, Math.ceil(Number(oldest?.wait ?? windowSeconds))) };
    }
    await tx
      .delete(rateLimitEvents)
      .where(and(eq(rateLimitEvents.bucket, bucket), eq(rateLimitEvents.key, key), lt(rateLimitEvents.at, since)));
    const [row] = await tx.insert(rateLimitEvents).values({ bucket, key }).returning({ id: rateLimitEvents.id });
    return { allowed: true as const, id: row.id };
  });
}

/** Delete one recorded attempt (e.g. a password sign-in that succeeded does not count against the account). */
export async function deleteAttemptById({ id }: { id: string }): Promise<void> {
  await db.delete(rateLimitEvents).where(eq(rateLimitEvents.id, id));
}

/** The number of attempts of `key` in `bucket` within the last `windowSeconds`. */
export async function countAttempts({ bucket, key, windowSeconds }: { bucket: string; key: string; windowSeconds: number }): Promise<number> {
  const [{ n }] = await db
    .select({ n: count() })
    .from(rateLimitEvents)
    .where(
      and(
        eq(rateLimitEvents.bucket, bucket),
        eq(rateLimitEvents.key, key),
        gt(rateLimitEvents.at, sql`now() - make_interval(secs => ${windowSeconds})`),
      ),
    );
  return n;
}

/** Delete every attempt older than the retention period, whatever its bucket. */
export async function pruneOldAttempts(): Promise<void> {
  await db
    .delete(rateLimitEvents)
    .where(lt(rateLimitEvents.at, sql`now() - make_interval(secs => ${RATE_LIMIT_RETENTION_SECONDS})`));
}
