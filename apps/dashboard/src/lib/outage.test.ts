import { describe, expect, it } from 'vitest';
import { ApiError } from './api';
import { isOutage, OUTAGE_TRIES, retryDelay, shouldRetry } from './outage';

const err = (status: number, retryAfterS: number | null = null) =>
  new ApiError(
    status,
    { code: status === 503 ? 'service_unavailable' : 'internal', message: 'x', details: null },
    retryAfterS,
  );

describe('retrying through an outage', () => {
  it('keeps trying a 503 or an unreachable server, gives other 5xx two tries and a 4xx none', () => {
    expect(isOutage(err(503))).toBe(true);
    expect(isOutage(err(0))).toBe(true);
    expect(isOutage(err(500))).toBe(false);
    expect(shouldRetry(10, err(503, 5))).toBe(true);
    expect(shouldRetry(OUTAGE_TRIES, err(503, 5))).toBe(false);
    expect(shouldRetry(1, err(500))).toBe(true);
    expect(shouldRetry(2, err(500))).toBe(false);
    expect(shouldRetry(0, err(404))).toBe(false);
    expect(shouldRetry(0, err(429, 5))).toBe(false);
  });

  it('waits what Retry-After asks, capped at 30 s, else backs off', () => {
    expect(retryDelay(0, err(503, 5))).toBe(5_000);
    expect(retryDelay(3, err(503, 120))).toBe(30_000);
    expect(retryDelay(0, err(0))).toBe(1_000);
    expect(retryDelay(2, err(500))).toBe(4_000);
  });
});
