// Starting a run of a figure: validate its parameters with the solver's schema, serve an identical earlier input
// from the stored result (content hash), otherwise queue a new run for the workers.
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { getResultByInputHash } from '@/db/queries/results';
import { failRun, insertRun, setRunJobId } from '@/db/queries/runs';
import type { Figure, Run } from '@/db/schema';
import { conflict, invalid, unavailable } from '@/lib/domain-error';
import { figureKind, isFigureKind } from '@/lib/figure-kinds/registry';
import { enqueueRun } from '@/lib/jobs/queue';
import { SpecError } from '@/lib/physics/errors';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { fieldMessages } from '@/lib/validation-fields';
import { inputHash } from './input-hash';

export interface StartedRun {
  run: Run;
  /** True when an earlier identical input was reused and nothing is computed. */
  fromCache: boolean;
}

/**
 * Start a run of `figure` with its current parameters.
 *
 * - A figure whose kind has no solver task (uploaded data) is refused with a 409: there is nothing to compute.
 * - Parameters are validated by the solver's schema (the same as the CLI and the forms); invalid ones throw a
 *   DomainError `invalid` with per-field messages keyed like the figure form's fields (`params.grid.h`), and nothing
 *   is written.
 * - Cache: when a result exists for the same input hash (parameters + solver version), the run is created already
 *   succeeded with `fromCache` and no job.
 * - Otherwise the run is created 'queued' and put on the queue; its job id is recorded.
 *
 * @example
 * const { run, fromCache } = await startRun({ figure, user });
 */
export async function startRun({
  figure,
  user,
  database = defaultDb,
  enqueue = enqueueRun,
}: {
  /** The figure; its stored `params` are validated again here, so they are taken as they come. */
  figure: Pick<Figure, 'id' | 'kind'> & { params: unknown };
  user: { id: string } | null;
  database?: Db;
  /** How to queue the run (the seed computes in-process and passes a no-op). */
  enqueue?: ((runId: string) => Promise<string | null>) | null;
}): Promise<StartedRun> {
  if (isFigureKind(figure.kind) && figureKind(figure.kind).task === null) {
    throw conflict(`Figures of kind "${figure.kind}" are not computed: their data is uploaded, so there is nothing to run`);
  }
  let spec;
  try {
    spec = parseTaskSpec(figure.params);
  } catch (error) {
    if (error instanceof SpecError) {
      throw invalid("The figure's parameters are not valid", fieldMessages(error.issues, { prefix: 'params' }));
    }
    throw error;
  }
  const key = inputHash(spec, SOLVER_VERSION);
  const common = { figureId: figure.id, params: spec, inputHash: key, solverVersion: SOLVER_VERSION, startedById: user?.id ?? null };

  const cached = await getResultByInputHash({ inputHash: key, database });
  if (cached) {
    const now = new Date();
    const run = await insertRun({
      values: {
        ...common,
        status: 'succeeded',
        resultId: cached.id,
        fromCache: true,
        progress: 1,
        message: 'Served from the cache',
        startedAt: now,
        finishedAt: now,
      },
      database,
    });
    return { run, fromCache: true };
  }

  const run = await insertRun({ values: { ...common, status: 'queued', message: 'Waiting for a worker' }, database });
  if (!enqueue) return { run, fromCache: false };
  try {
    const jobId = await enqueue(run.id);
    if (jobId) {
      await setRunJobId({ id: run.id, jobId, database });
      return { run: { ...run, jobId }, fromCache: false };
    }
    return { run, fromCache: false };
  } catch (error) {
    await failRun({ id: run.id, error: 'The run could not be queued; try again in a moment', database });
    console.error('[runs] enqueue failed', error);
    throw unavailable('The run queue is not available; try again in a moment');
  }
}
