import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator, type Options } from 'express-rate-limit';
import type { Config } from '../config.js';
import { AppError } from '../errors.js';

/**
 * Rate limits with the standard headers (IETF draft 8: `RateLimit-Policy` and `RateLimit`, plus
 * `Retry-After` on a 429) and the one error shape. Counters live in this process's memory: enough
 * for one server process; several would need a shared store.
 */
export interface RateLimits {
  /** Failed sign-ins (and invitation/reset attempts) from one client address. */
  failuresPerIp: RequestHandler;
  /** Failed sign-ins for one e-mail address, from anywhere. */
  loginFailuresPerAccount: RequestHandler;
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

const byIp = (req: Request): string => ipKeyGenerator(req.ip ?? 'unknown');

export function createRateLimits(config: Config): RateLimits {
  const { windowMs, loginPerAccount, loginPerIp } = config.rateLimits;
  const base = (name: string, limit: number, extra: Partial<Options>): RequestHandler =>
    rateLimit({
      windowMs,
      limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      identifier: name,
      handler: (_req, _res, next, options) => {
        next(
          new AppError('rate_limited', 'Too many attempts: wait a while and try again', {
            limit: options.limit,
            windowS: Math.round(windowMs / 1000),
          }),
        );
      },
      ...extra,
    });

  return {
    failuresPerIp: base('failures-per-ip', loginPerIp, { keyGenerator: byIp, skipSuccessfulRequests: true }),
    loginFailuresPerAccount: base('login-per-account', loginPerAccount, {
      keyGenerator: (req) => `login:${String(validatedBody(req).email ?? '')}`,
      skipSuccessfulRequests: true,
    }),
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
