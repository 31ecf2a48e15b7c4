// Liveness of a computing run across processes and machines: the worker computing a run holds a PostgreSQL
// session advisory lock on it. The lock dies with the worker's connection, so a free lock on a 'running' run means
// its worker was lost (kill -9, crash, machine gone) and the run can be handed to another worker.
import { sql, type SQL } from 'drizzle-orm';
import type postgres from 'postgres';

/** SQL expression of the lock key of a run (64-bit hash of a namespaced run id). */
const LOCK_KEY = (runId: string) => `fluxfolio-run:${runId}`;

/** A held run lock: release it when the run's final state is committed. */
export interface RunLock {
  release(): Promise<void>;
}

/**
 * Try to take the lock of a run on a connection reserved for the duration of the computation.
 *
 * @returns the held lock, or null when another live worker holds it
 */
export async function tryLockRun(sql: postgres.Sql, runId: string): Promise<RunLock | null> {
  const connection = await sql.reserve();
  try {
    const [row] = await connection<{ locked: boolean }[]>`
      SELECT pg_try_advisory_lock(hashtextextended(${LOCK_KEY(runId)}, 0)) AS locked`;
    if (!row?.locked) {
      connection.release();
      return null;
    }
  } catch (error) {
    connection.release();
    throw error;
  }
  let released = false;
  return {
    async release() {
      if (released) return;
      released = true;
      try {
        await connection`SELECT pg_advisory_unlock(hashtextextended(${LOCK_KEY(runId)}, 0))`;
      } finally {
        connection.release();
      }
    },
  };
}

/** Anything that runs a Drizzle SQL statement: the database or a transaction. */
interface SqlExecutor {
  execute(query: SQL): PromiseLike<unknown>;
}

/**
 * True when no live session holds the run's lock. Uses a transaction-scoped try-lock, so call it inside a
 * transaction: while that transaction lasts the lock stays taken and the answer can be acted on atomically.
 */
export async function isRunLockFree(tx: SqlExecutor, runId: string): Promise<boolean> {
  const rows = (await tx.execute(
    sql`SELECT pg_try_advisory_xact_lock(hashtextextended(${LOCK_KEY(runId)}, 0)) AS free`,
  )) as unknown as { free: boolean }[];
  return Boolean(rows[0]?.free);
}
