// Queries about computed results: content-addressed by the input hash (params + solver version), shared by every run
// with the same input. A result row is written only together with the run that produced it (see db/queries/runs.ts).
import { eq } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { results, type Result } from '@/db/schema';

/** The stored result for an input hash, or null (the cache look-up). */
export async function getResultByInputHash({ inputHash, database = db }: { inputHash: string; database?: Db }): Promise<Result | null> {
  const [row] = await database.select().from(results).where(eq(results.inputHash, inputHash)).limit(1);
  return row ?? null;
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
