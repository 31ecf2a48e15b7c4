// Test data for the runs tests: a unique person, manuscript and figure per test (so files never collide), small
// solver specs with known cost, and a wait helper. Real PostgreSQL on DATABASE_URL; nothing is mocked.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { createFigure } from '@/db/queries/figures';
import { figures, type Figure, type Manuscript, type MemberRole } from '@/db/schema';
import type { FigureParams } from '@/lib/figure-kinds/registry';
import { createFigureSchema, type CreateFigureInput } from '@/lib/validations/figure';
import { createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';

/** A fast spectrum: unit disk, half tube at the centre, coarse grid (a few hundred unknowns). */
export const SMALL_SPECTRUM = {
  task: 'spectrum',
  well: { disk: { center: [0, 0], radius: 1 } },
  grid: { h: 0.1 },
  tubes: [{ at: [0, 0], alpha: 0.5 }],
  levels: 4,
} as const;

/**
 * A spectral flow that takes a few seconds (120 flux steps, ~800 unknowns): long enough to cancel or kill mid-run, with
 * many short steps so the solver yields to the event loop (progress writes, cancel checks) often.
 */
export const SLOW_FLUX_SWEEP = {
  task: 'flux-sweep',
  well: { disk: { center: [0, 0], radius: 1 } },
  grid: { h: 1 / 16 },
  tubes: [{ at: [0.25, 0.125], alpha: 0 }],
  sweep: { tube: 0, from: 0, to: 1, steps: 120 },
  levels: 4,
} as const;

export interface TestWorld {
  user: TestUser;
  manuscript: Manuscript;
}

/** A fresh user who is `role` of a fresh manuscript. */
export async function createWorld(role: MemberRole = 'author'): Promise<TestWorld> {
  const user = await createTestUser({ label: 'runs' });
  const manuscript = await createTestManuscript({ title: 'Flux tubes test', members: [{ user, role }] });
  return { user, manuscript };
}

/** A figure of the world's manuscript with `params` (validated like the API does). */
export async function createTestFigure(
  world: TestWorld,
  params: Record<string, unknown>,
  extra: Partial<CreateFigureInput> = {},
): Promise<Figure> {
  const input = createFigureSchema.parse({
    label: `fig-${randomUUID().slice(0, 8)}`,
    kind: params.task,
    caption: 'Test figure',
    params,
    ...extra,
  });
  return createFigure({ manuscriptId: world.manuscript.id, input, userId: world.user.id });
}

/** Set a figure's params directly, unchecked (runs must validate them again). */
export async function setFigureParams(figureId: string, params: Record<string, unknown>): Promise<Figure> {
  const [row] = await db
    .update(figures)
    .set({ params: params as FigureParams })
    .where(eq(figures.id, figureId))
    .returning();
  return row;
}

/** Poll `check` every `intervalMs` until it returns a value other than undefined, or fail after `timeoutMs`. */
export async function waitFor<T>(
  what: string,
  check: () => Promise<T | undefined>,
  { timeoutMs = 60_000, intervalMs = 200 }: { timeoutMs?: number; intervalMs?: number } = {},
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}
