import { isApiError } from './api';

/** Longest wait between tries during an outage, whatever the server asks. */
const MAX_WAIT_MS = 30_000;
/** Tries during an outage before a query shows its error state (about three minutes at 5 s). */
export const OUTAGE_TRIES = 36;

/** The server said it is briefly unavailable (503), or could not be reached at all. */
export function isOutage(error: unknown): boolean {
  return isApiError(error, 503) || isApiError(error, 0);
}

/**
 * Whether a query should try again: through an outage for a few minutes; other server errors
 * twice; never for a 4xx, which will not change by asking again.
 */
export function shouldRetry(count: number, error: unknown): boolean {
  if (isOutage(error)) return count < OUTAGE_TRIES;
  return count < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500);
}

/** Wait what the server's `Retry-After` asks (capped), else back off 1 s, 2 s, 4 s... */
export function retryDelay(count: number, error: unknown): number {
  if (isApiError(error) && error.retryAfterS !== null && error.retryAfterS > 0)
    return Math.min(MAX_WAIT_MS, error.retryAfterS * 1000);
  return Math.min(MAX_WAIT_MS, 1000 * 2 ** count);
}
