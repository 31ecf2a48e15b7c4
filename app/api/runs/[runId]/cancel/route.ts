// POST /api/runs/[runId]/cancel: cancel a queued or running run (authors). 409 when it has already finished.
// The worker computing it notices within a fraction of a second and stops.
import { route } from '@/lib/http/handler';
import { cancelRun } from '@/lib/runs/cancel-run';
import { authorizeRun } from '@/lib/runs/resource-access';
import { runParamsSchema } from '@/lib/validations/figure';
import type { CancelRunBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const POST = route({ params: runParamsSchema }, async ({ params, user }) => {
  const { run } = await authorizeRun({ user, runId: params.runId, need: 'run' });
  return { run: await cancelRun({ run }) } satisfies CancelRunBody;
});
