// Queries about computed results: content-addressed by the input hash (params + solver version), shared by every run
// with the same input. A result row is written only together with the run that produced it (see db/queries/runs.ts).
import { and, eq, ne, sql } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { figures, results, runs, type Result } from '@/db/schema';

/** The stored result for an input hash, or null (the cache look-up). */
export async function getResultByInputHash({ inputHash, database = db }: { inputHash: string; database?: Db }): Promise<Result | null> {
  const [row] = await database.select().from(results).where(eq(results.inputHash, inputHash)).limit(1);
  return row ?? null;
}

/**
 * Whether the result `resultId` was already used (computed or reused) by a run of a manuscript: the manuscript
 * `manuscriptId`, or the one that run `ofRun` belongs to (that run itself does not count).
 */
export async function resultKnownToManuscript({
  resultId,
  manuscript,
  database = db,
}: {
  resultId: string;
  manuscript: { id: string } | { ofRun: string };
  database?: Db;
}): Promise<boolean> {
  const inManuscript =
    'id' in manuscript
      ? eq(figures.manuscriptId, manuscript.id)
      : and(
          ne(runs.id, manuscript.ofRun),
          sql`${figures.manuscriptId} = (select f.manuscript_id from figures f join runs r on r.figure_id = f.id where r.id = ${manuscript.ofRun})`,
        );
  const [row] = await database
    .select({ id: runs.id })
    .from(runs)
    .innerJoin(figures, eq(figures.id, runs.figureId))
    .where(and(eq(runs.resultId, resultId), inManuscript))
    .limit(1);
  return row !== undefined;
}

/** A result by id, or null. */
export async function getResultById({ id, database = db }: { id: string; database?: Db }): Promise<Result | null> {
  const [row] = await database.select().from(results).where(eq(results.id, id)).limit(1);
  return row ?? null;
}

/** The full solver result as the solver returned it: the stored data with its diagnostics put back. */
export function fullResult(result: Pick<Result, 'data' | 'diagnostics'>): Record<string, unknown> {
  return { ...(result.data as Record<string, unknown>), diagnostics: result.diagnostics };
}
