import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import type { Config } from '../config.js';
import { AppError } from '../errors.js';
import { cookieNames, cookieOptions } from './cookies.js';
import { deriveKey } from './session.js';

export const CSRF_HEADER = 'x-csrf-token';

/**
 * Signed double submit (OWASP's form, bound to the session): the token is
 * `nonce.HMAC(key, session id + nonce)`, kept in an httpOnly cookie and handed to the dashboard by
 * `GET /auth/csrf`; a state change must send it back in `x-csrf-token`. Another site can neither
 * read the token nor set a custom header cross-origin, and cannot mint a token the server accepts
 * without the key; because it is bound to the session, a token from before a sign-in, sign-out or
 * another person's session does not carry over (the `__Host-` prefix also stops a subdomain
 * planting a cookie). The dashboard fetches a fresh one when the session changes.
 */
export interface Csrf {
  /** The caller's current token, minting one (and its cookie) when there is none or it is not ours. */
  token(req: Request, res: Response): string;
  /** Middleware for state-changing routes: 403 `csrf_failed` unless header and cookie hold the same valid token. */
  require: RequestHandler;
}

export function createCsrf(config: Config): Csrf {
  const key = deriveKey(config.jwtSecret, 'csrf');
  const name = cookieNames(config).csrf;
  // Signed-out callers share one binding; the nonce still makes each browser's token its own.
  const binding = (req: Request) => req.session?.sid ?? 'signed-out';
  const mac = (req: Request, nonce: string) =>
    createHmac('sha256', key)
      .update(`${binding(req)}|${nonce}`)
      .digest('base64url');

  function valid(req: Request, token: unknown): token is string {
    if (typeof token !== 'string' || token.length > 200) return false;
    const [nonce, sig, ...rest] = token.split('.');
    if (!nonce || !sig || rest.length) return false;
    const expected = Buffer.from(mac(req, nonce));
    const given = Buffer.from(sig);
    return expected.length === given.length && timingSafeEqual(expected, given);
  }

  return {
    token(req, res) {
      const existing: unknown = req.cookies?.[name];
      if (valid(req, existing)) return existing;
      const nonce = randomBytes(18).toString('base64url');
      const token = `${nonce}.${mac(req, nonce)}`;
      // A browser-session cookie: it lives as long as the tab's browser, like the token in memory.
      res.cookie(name, token, cookieOptions(config));
      return token;
    },
    require(req, _res, next) {
      const header = req.get(CSRF_HEADER);
      const cookie: unknown = req.cookies?.[name];
      if (!header)
        return next(
          new AppError('csrf_failed', `Missing ${CSRF_HEADER} header: get one from GET /api/v1/auth/csrf`),
        );
      if (!valid(req, header) || !valid(req, cookie)) {
        return next(
          new AppError(
            'csrf_failed',
            'CSRF token is not valid for this session: get a new one from GET /api/v1/auth/csrf',
          ),
        );
      }
      const a = Buffer.from(header);
      const b = Buffer.from(cookie);
      if (a.length !== b.length || !timingSafeEqual(a, b))
        return next(new AppError('csrf_failed', 'CSRF token does not match'));
      next();
    },
  };
}
