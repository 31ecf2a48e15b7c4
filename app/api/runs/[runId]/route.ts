// GET /api/runs/[runId]: a run's status, progress and message (polled by the progress bar); the failure reason when
// it failed; the result (data and diagnostics) when it succeeded.
import { getResultById } from '@/db/queries/results';
import { route } from '@/lib/http/handler';
import { authorizeRun } from '@/lib/runs/resource-access';
import { runParamsSchema } from '@/lib/validations/figure';
import type { RunBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: runParamsSchema }, async ({ params, user }) => {
  const { run } = await authorizeRun({ user, runId: params.runId, need: 'read' });
  if (run.status !== 'succeeded' || !run.resultId) return { run, result: null } satisfies RunBody;
  const result = await getResultById({ id: run.resultId });
  return {
    run,
    result: result
      ? { id: result.id, resultHash: result.resultHash, solverVersion: result.solverVersion, data: result.data, diagnostics: result.diagnostics }
      : null,
  } satisfies RunBody;
});
