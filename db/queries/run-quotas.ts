// Queueing a run within the quotas of active (queued or running) runs per person and per figure, or joining the active run
// of an identical input: one transaction under advisory locks (person, then figure), so concurrent starts cannot overshoot.
import { and, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { runs, type Run } from '@/db/schema';

/** Runs that still hold a worker or a place in the queue. */
export const ACTIVE_RUN_STATUSES = ['queued', 'running'] as const;

export type QueueRunOutcome =
  | { outcome: 'queued'; run: Run }
  | { outcome: 'joined'; run: Run }
  | { outcome: 'over-quota'; scope: 'person' | 'figure'; limit: number };

/**
 * Insert a queued run, unless an active run of the same figure has the same input hash (then that run is returned), or
 * the person or the figure already has its quota of active runs.
 *
 * @example
 * const r = await queueRunWithinQuota({ values, perPerson: 4, perFigure: 2 });
 * if (r.outcome === 'over-quota') throw …;
 */
export async function queueRunWithinQuota({
  values,
  perPerson,
  perFigure,
  database = db,
}: {
  values: typeof runs.$inferInsert & { figureId: string; inputHash: string };
  perPerson: number;
  perFigure: number;
  database?: Db;
}): Promise<QueueRunOutcome> {
  return database.transaction(async (tx) => {
    const personId = values.startedById ?? null;
    if (personId) await tx.execute(sql`SELECT pg_advisory_xact_lock(hashtextextended(${`run-quota-person:${personId}`}, 0))`);
    await tx.execute(sql`SELECT pg_advisory_xact_lock(hashtextextended(${`run-quota-figure:${values.figureId}`}, 0))`);
    const active = inArray(runs.status, [...ACTIVE_RUN_STATUSES]);

    const [same] = await tx
      .select()
      .from(runs)
      .where(and(eq(runs.figureId, values.figureId), eq(runs.inputHash, values.inputHash), active))
      .orderBy(desc(runs.createdAt))
      .limit(1);
    if (same) return { outcome: 'joined' as const, run: same };

    if (personId) {
      const [{ n }] = await tx.select({ n: count() }).from(runs).where(and(eq(runs.startedById, personId), active));
      if (n >= perPerson) return { outcome: 'over-quota' as const, scope: 'person' as const, limit: perPerson };
    }
    const [{ n: onFigure }] = await tx.select({ n: count() }).from(runs).where(and(eq(runs.figureId, values.figureId), active));
    if (onFigure >= perFigure) return { outcome: 'over-quota' as const, scope: 'figure' as const, limit: perFigure };

    const [run] = await tx.insert(runs).values(values).returning();
    return { outcome: 'queued' as const, run };
  });
}
