// Starting a run of a figure: validate its parameters with the solver's schema, serve an identical earlier input
// from the stored result (content hash), join an identical active run, otherwise queue a new run within the quotas.
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { getResultByInputHash, resultKnownToManuscript } from '@/db/queries/results';
import { queueRunWithinQuota } from '@/db/queries/run-quotas';
import { failRun, insertRun, setRunJobId } from '@/db/queries/runs';
import type { Figure, Run } from '@/db/schema';
import { conflict, invalid, unavailable } from '@/lib/domain-error';
import { figureKind, isFigureKind } from '@/lib/figure-kinds/registry';
import { enqueueRun } from '@/lib/jobs/queue';
import { RateLimitedError } from '@/lib/rate-limit/rate-limited-error';
import { SpecError } from '@/lib/physics/errors';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { fieldMessages } from '@/lib/validation-fields';
import { inputHash } from './input-hash';

export interface StartedRun {
  run: Run;
  /** True when an earlier identical input was reused and nothing is computed. */
  fromCache: boolean;
  /** True when an identical input was already queued or running for the figure: `run` is that run. */
  joined?: boolean;
}

/** Active (queued or running) runs one person may have at once (common practice: a few, so one person cannot fill the queue). */
export const ACTIVE_RUNS_PER_PERSON = 4;
/** Active runs one figure may have at once. */
export const ACTIVE_RUNS_PER_FIGURE = 2;
/** The Retry-After hint of a quota refusal: runs of the sizes the limits allow usually finish within this. */
const RUN_QUOTA_RETRY_AFTER_SECONDS = 30;

/**
 * Start a run of `figure` with its current parameters.
 *
 * - A figure whose kind has no solver task (uploaded data) is refused with a 409: there is nothing to compute.
 * - Parameters are validated by the solver's schema (the same as the CLI and the forms); invalid ones throw a
 *   DomainError `invalid` with per-field messages keyed like the figure form's fields (`params.grid.h`), and nothing
 *   is written.
 * - Cache: when a result exists for the same input hash (parameters + solver version), the run is created already
 *   succeeded with no job. It says `fromCache` only when a run of the same manuscript used that result before: a
 *   result first computed for another group's manuscript is served like a fresh one, so nobody learns it exists.
 * - An identical input already queued or running for the figure is joined: that run is returned, nothing new is queued.
 * - Otherwise, within the quotas of active runs per person and per figure (a RateLimitedError beyond them), the run is
 *   created 'queued' and put on the queue; its job id is recorded.
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
  figure: Pick<Figure, 'id' | 'kind' | 'manuscriptId'> & { params: unknown };
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
    const fromCache = await resultKnownToManuscript({ resultId: cached.id, manuscript: { id: figure.manuscriptId }, database });
    const run = await insertRun({
      values: {
        ...common,
        status: 'succeeded',
        resultId: cached.id,
        fromCache,
        progress: 1,
        message: fromCache ? 'Served from the cache' : 'Finished',
        startedAt: now,
        finishedAt: now,
      },
      database,
    });
    return { run, fromCache };
  }

  const queued = await queueRunWithinQuota({
    values: { ...common, status: 'queued', message: 'Waiting for a worker' },
    perPerson: ACTIVE_RUNS_PER_PERSON,
    perFigure: ACTIVE_RUNS_PER_FIGURE,
    database,
  });
  if (queued.outcome === 'joined') return { run: queued.run, fromCache: false, joined: true };
  if (queued.outcome === 'over-quota') {
    throw new RateLimitedError(
      queued.scope === 'person'
        ? `You already have ${queued.limit} runs queued or running; wait for one to finish or cancel one`
        : `This figure already has ${queued.limit} runs queued or running; wait for one to finish or cancel one`,
      RUN_QUOTA_RETRY_AFTER_SECONDS,
    );
  }
  const run = queued.run;
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
