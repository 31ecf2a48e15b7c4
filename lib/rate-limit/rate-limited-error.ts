// The refusal of a rate limit: a domain error of code 'rate-limited' that also says how long to wait.
// lib/http/errors.ts answers it with 429 and a Retry-After header.
import { DomainError } from '@/lib/domain-error';

/**
 * Thrown by {@link hit} when a bucket is full.
 *
 * @example
 * throw new RateLimitedError('Too many sign-in attempts for this account; try again later', 600);
 */
export class RateLimitedError extends DomainError {
  /** Whole seconds until the oldest counted attempt leaves the window (at least 1). */
  readonly retryAfterSeconds: number;

  constructor(message: string, retryAfterSeconds: number) {
    super('rate-limited', message);
    this.name = 'RateLimitedError';
    this.retryAfterSeconds = Math.max(1, Math.ceil(retryAfterSeconds));
  }
}
