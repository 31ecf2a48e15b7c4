// Nothing a person sees tells them that another group's manuscript or result exists: a new manuscript's address is the
// title plus a random suffix (never "title-2"), and a result first computed for another manuscript is not shown as cached.
import { eq, inArray } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { getRunById } from '@/db/queries/runs';
import { results, runs } from '@/db/schema';
import { executeRun } from '@/lib/jobs/run-job';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { inputHash } from '@/lib/runs/input-hash';
import { startRun } from '@/lib/runs/start-run';
import { signedInClient } from '../helpers/http-client';
import { createTestUser } from '../helpers/test-users';
import { createTestFigure, createWorld, SMALL_SPECTRUM } from '../runs/fixtures';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('manuscript addresses', () => {
  it('gives two groups with the same title addresses that say nothing about each other', async () => {
    const title = `Hidden twin ${Date.now()}`;
    const base = title.toLowerCase().replace(/ /g, '-');
    const slugs: string[] = [];
    for (const label of ['group-a', 'group-b']) {
      const client = await signedInClient(await createTestUser({ label }));
      const answer = await client.json('POST', '/api/manuscripts', { title });
      expect(answer.status).toBe(201);
      slugs.push((answer.body as { manuscript: { slug: string } }).manuscript.slug);
    }
    for (const slug of slugs) expect(slug).toMatch(new RegExp(`^${base}-[a-z0-9]{6}$`));
    expect(slugs[0]).not.toBe(slugs[1]);
  });
});

describe('results computed for another manuscript', () => {
  it('are reused but not shown as cached; the second use inside the same manuscript is', async () => {
    // An input of its own (a grid offset nobody else uses), with any stored result removed first.
    const params = { ...SMALL_SPECTRUM, grid: { h: 0.1, offset: [0.0313, 0.0171] } };
    const key = inputHash(parseTaskSpec(params), SOLVER_VERSION);
    const stale = db.select({ id: results.id }).from(results).where(eq(results.inputHash, key));
    await db.delete(runs).where(inArray(runs.resultId, stale));
    await db.delete(results).where(eq(results.inputHash, key));

    const groupA = await createWorld('author');
    const figureA = await createTestFigure(groupA, params);
    const computed = await startRun({ figure: figureA, user: groupA.user, enqueue: null });
    expect((await executeRun(computed.run.id)).status).toBe('succeeded');
    const resultId = (await getRunById({ id: computed.run.id }))?.resultId;
    expect(resultId).toBeTruthy();

    const groupB = await createWorld('author');
    const figureB = await createTestFigure(groupB, params);
    const first = await startRun({ figure: figureB, user: groupB.user, enqueue: null });
    expect(first.run.status).toBe('succeeded');
    expect(first.run.resultId).toBe(resultId);
    expect(first.fromCache).toBe(false);
    expect(first.run.fromCache).toBe(false);
    expect(first.run.message).not.toMatch(/cache/i);

    const again = await startRun({ figure: figureB, user: groupB.user, enqueue: null });
    expect(again.fromCache).toBe(true);
    expect(again.run.message).toMatch(/cache/i);
  });
});
