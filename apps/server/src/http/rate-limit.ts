import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator, type Options } from 'express-rate-limit';
import type { Config } from '../config.js';
import { AppError } from '../errors.js';
import { SharedCounterStore, type Counters } from './counters.js';

/**
 * Rate limits with the standard headers (IETF draft 8: `RateLimit-Policy` and `RateLimit`, plus
 * `Retry-After` on a 429) and the one error shape. Counters live in MariaDB (`Counters`), so N
 * server processes over one database count as one. Sign-in itself is throttled by
 * `auth/throttle.ts` (growing delays per account and client), not by these.
 */
export interface RateLimits {
  /** Failed password checks (account settings, reset, invitation) from one client address. */
  failuresPerIp: RequestHandler;
  /** Wrong passwords tried against one invitation. */
  acceptFailuresPerInvitation: RequestHandler;
  /** Every sign-up, password-reset mail or invitation mail from one client address. */
  mailOrSignupPerIp: RequestHandler;
  /** Password-reset mails asked for one address: a mailbox cannot be flooded. */
  resetMailsPerAccount: RequestHandler;
}

/** The validated body the route stored for its handler (rate limits run after validation). */
function validatedBody(req: Request): Record<string, unknown> {
  const ctx = (req.res?.locals.routeContext ?? {}) as { body?: unknown };
  return typeof ctx.body === 'object' && ctx.body !== null ? (ctx.body as Record<string, unknown>) : {};
}

export const byIp = (req: Request): string => ipKeyGenerator(req.ip ?? 'unknown');

/** One limiter over the shared counters; `name` keeps its keys apart from every other limiter's. */
export function sharedRateLimit(
  counters: Counters,
  name: string,
  p: { limit: number; windowMs: number; message?: string } & Partial<
    Omit<Options, 'limit' | 'windowMs' | 'message'>
  >,
): RequestHandler {
  const { limit, windowMs, message, ...extra } = p;
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: name,
    store: new SharedCounterStore(counters, `${name}:`),
    // The counter is in the database: if it cannot be reached, answer the outage (503), do not let all through.
    passOnStoreError: false,
    handler: (_req, res, next, options) => {
      const retryAfterS = Number(res.getHeader('Retry-After')) || Math.round(windowMs / 1000);
      next(
        new AppError('rate_limited', message ?? 'Too many attempts: wait a while and try again', {
          limit: options.limit,
          windowS: Math.round(windowMs / 1000),
          retryAfterS,
        }),
      );
    },
    ...extra,
  });
}

export function createRateLimits(config: Config, counters: Counters): RateLimits {
  const { windowMs, loginPerAccount, loginPerIp } = config.rateLimits;
  const base = (
    name: string,
    limit: number,
    extra: Partial<Omit<Options, 'limit' | 'windowMs' | 'message'>>,
  ) => sharedRateLimit(counters, name, { limit, windowMs, ...extra });

  return {
    failuresPerIp: base('failures-per-ip', loginPerIp, { keyGenerator: byIp, skipSuccessfulRequests: true }),
    acceptFailuresPerInvitation: base('accept-per-invitation', loginPerAccount, {
      keyGenerator: (req) => `invitation:${String(req.params.token ?? '')}`,
      skipSuccessfulRequests: true,
    }),
    mailOrSignupPerIp: base('mail-per-ip', loginPerIp, { keyGenerator: byIp }),
    resetMailsPerAccount: base('reset-per-account', Math.max(1, Math.ceil(loginPerAccount / 2)), {
      keyGenerator: (req) => `reset:${String(validatedBody(req).email ?? '')}`,
    }),
  };
}
