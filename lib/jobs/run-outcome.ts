// How a run job ends (the outcome every step of lib/jobs/run-job.ts may return) and the error that asks the queue
// to retry the job later. Shared by the claim, watch and store steps and by the worker.

/** How a job ended. `requeued`: the run goes back to the queue and the caller must let pg-boss retry the job. */
export type RunJobOutcome =
  | { status: 'succeeded'; runId: string; fromCache: boolean; resultId: string; resultHash: string }
  | { status: 'failed'; runId: string; error: string }
  | { status: 'cancelled'; runId: string }
  | { status: 'skipped'; runId: string; reason: string };

/** Thrown when the job must be retried later (another live worker holds the run, the worker is stopping, a database error). */
export class RetryLaterError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'RetryLaterError';
  }
}

/** The message of anything thrown. */
export function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
