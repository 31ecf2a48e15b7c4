// Claim step of a run job: skip runs that are gone or finished, take the run's liveness lock (lib/jobs/run-lock.ts),
// mark the run running and read its spec (a spec that no longer parses fails the run).
import type { Db } from '@/db';
import { claimRun, failRun, getRunById } from '@/db/queries/runs';
import type { Run } from '@/db/schema';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { messageOf, RetryLaterError, type RunJobOutcome } from './run-outcome';
import { tryLockRun, type RunLock } from './run-lock';

/** The parsed spec of a claimed run. */
export type RunSpec = ReturnType<typeof parseTaskSpec>;

/**
 * Takes the lock of a queued or running run.
 * @returns the held lock, or the 'skipped' outcome when the run is gone or already finished
 * @throws RetryLaterError when another live worker holds the run
 */
export async function lockJobRun(runId: string, database: Db): Promise<{ lock: RunLock } | { outcome: RunJobOutcome }> {
  const existing = await getRunById({ id: runId, database });
  if (!existing) return { outcome: { status: 'skipped', runId, reason: 'the run no longer exists' } };
  if (existing.status !== 'queued' && existing.status !== 'running') {
    return { outcome: { status: 'skipped', runId, reason: `the run is already ${existing.status}` } };
  }
  const lock = await tryLockRun(database.$client, runId);
  if (!lock) throw new RetryLaterError(`run ${runId} is being computed by another worker`);
  return { lock };
}

/**
 * Marks the locked run running and parses its spec. Call with the run's lock held.
 * @returns the run and its spec, or the outcome when the run finished meanwhile ('skipped') or its spec is invalid ('failed')
 */
export async function startJobRun(runId: string, database: Db): Promise<{ run: Run; spec: RunSpec } | { outcome: RunJobOutcome }> {
  const run = await claimRun({ id: runId, database });
  if (!run) return { outcome: { status: 'skipped', runId, reason: 'the run finished meanwhile' } };
  try {
    return { run, spec: parseTaskSpec(run.params) };
  } catch (error) {
    const message = messageOf(error);
    await failRun({ id: runId, error: message, database });
    return { outcome: { status: 'failed', runId, error: message } };
  }
}
