// The database itself refuses to change or remove a frozen snapshot: UPDATE, DELETE and TRUNCATE fail, for the app
// role (rows inserted in a rolled-back transaction, each refused statement in its own savepoint) and for the owner.
import { eq, sql, TransactionRollbackError } from 'drizzle-orm';
import postgres from 'postgres';
import { describe, expect, it } from 'vitest';
import { figures, manuscripts, results, snapshots, users } from '@/db/schema';
import type { TaskSpec } from '@/lib/physics/schemas';
import { ownerDatabaseUrl, testDb, uniqueTag } from '../helpers/db';
import { rejectionOf } from '../helpers/thrown';

/** A valid spectrum spec for rows that only need to exist; nothing computes it. */
const ROW_SPEC: TaskSpec = { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.25 }, tubes: [], levels: 4 };

/** The PostgreSQL error under Drizzle's wrapper (DrizzleQueryError keeps it as `cause`). */
function pgError(error: unknown): { code?: string; message: string } {
  let e = error as { cause?: unknown; code?: string; message: string };
  while (e && !e.code && e.cause) e = e.cause as typeof e;
  return e;
}

type Tx = Parameters<Parameters<typeof testDb.transaction>[0]>[0];

async function refused(tx: Tx, statement: (sp: Tx) => Promise<unknown>): Promise<{ code?: string; message: string }> {
  const error = await rejectionOf(
    tx.transaction(async (sp) => {
      await statement(sp);
    }),
  );
  return pgError(error);
}

describe('snapshot immutability (database trigger)', () => {
  it('refuses UPDATE, DELETE and TRUNCATE of a snapshot', async () => {
    const tag = uniqueTag();
    const outcome = testDb.transaction(async (tx) => {
      const [user] = await tx.insert(users).values({ email: `freezer.${tag}@tests.fluxfolio.example.org` }).returning();
      const [manuscript] = await tx
        .insert(manuscripts)
        .values({ title: `Immutable ${tag}`, slug: `immutable-${tag}`, createdById: user.id })
        .returning();
      const [figure] = await tx
        .insert(figures)
        .values({ manuscriptId: manuscript.id, label: `fig-${tag}`, kind: 'spectrum', params: ROW_SPEC })
        .returning();
      const [result] = await tx
        .insert(results)
        .values({
          inputHash: `input-${tag}`,
          solverVersion: 'test',
          params: ROW_SPEC,
          data: { energies: [1, 2, 3, 4] },
          diagnostics: {},
          resultHash: `result-${tag}`,
        })
        .returning();
      const [snapshot] = await tx
        .insert(snapshots)
        .values({
          figureId: figure.id,
          manuscriptId: manuscript.id,
          version: 1,
          kind: figure.kind,
          label: figure.label,
          caption: 'frozen',
          params: figure.params,
          solverVersion: 'test',
          resultId: result.id,
          resultHash: result.resultHash,
          frozenById: user.id,
        })
        .returning();

      const update = await refused(tx, (sp) => sp.update(snapshots).set({ caption: 'changed' }).where(eq(snapshots.id, snapshot.id)));
      expect(update.message).toMatch(/snapshots are immutable \(UPDATE refused/);
      expect(update.code).toBe('23000');

      const remove = await refused(tx, (sp) => sp.delete(snapshots).where(eq(snapshots.id, snapshot.id)));
      expect(remove.message).toMatch(/snapshots are immutable \(DELETE refused/);

      // The app role may not even try: TRUNCATE is not among its rights.
      const truncate = await refused(tx, (sp) => sp.execute(sql`TRUNCATE snapshots CASCADE`));
      expect(truncate.code).toBe('42501');
      expect(truncate.message).toMatch(/permission denied for table snapshots/);

      const [still] = await tx.select().from(snapshots).where(eq(snapshots.id, snapshot.id));
      expect(still.caption).toBe('frozen');
      tx.rollback();
    });
    await expect(outcome).rejects.toBeInstanceOf(TransactionRollbackError);
  });

  it('refuses TRUNCATE to the owner role too (statement trigger)', async () => {
    const owner = postgres(ownerDatabaseUrl(), { max: 1, onnotice: () => {} });
    try {
      const attempt = owner.begin(async (tx) => {
        await tx`TRUNCATE snapshots CASCADE`;
        throw new Error('TRUNCATE was not refused'); // rolls the transaction back
      });
      await expect(attempt).rejects.toThrow(/snapshots are immutable \(TRUNCATE refused/);
    } finally {
      await owner.end({ timeout: 5 });
    }
  });
});
