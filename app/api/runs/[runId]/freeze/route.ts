// POST /api/runs/[runId]/freeze: freeze a succeeded run as the next numbered snapshot of its figure (authors)
// -> 201 { snapshot }. 409 when the run has not succeeded or is already frozen.
import { route } from '@/lib/http/handler';
import { authorizeRun } from '@/lib/runs/resource-access';
import { freezeRun } from '@/lib/snapshots/freeze';
import { runParamsSchema } from '@/lib/validations/figure';
import type { FreezeRunBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const POST = route({ params: runParamsSchema, status: 201 }, async ({ params, user }) => {
  const { run } = await authorizeRun({ user, runId: params.runId, need: 'freeze' });
  return { snapshot: await freezeRun({ runId: run.id, user }) } satisfies FreezeRunBody;
});
