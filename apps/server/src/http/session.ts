import { createHmac, randomBytes } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { SignJWT, jwtVerify, errors as joseErrors } from 'jose';
import { Op } from 'sequelize';
import { z } from 'zod';
import type { Logger } from 'pino';
import type { Config } from '../config.js';
import { SessionRevocation, User } from '../db/models/index.js';
import { cookieNames, cookieOptions } from './cookies.js';

const ISSUER = 'wickstone';
const AUDIENCE = 'wickstone-api';
/** The one algorithm accepted; anything else in a token's header (`none`, HS512, RS256...) is refused. */
const ALG = 'HS256';

const claimsSchema = z.object({
  sub: z.string().regex(/^[1-9]\d{0,9}$/),
  sid: z.string().regex(/^[0-9a-f]{32}$/),
  sv: z.number().int().min(0),
  auth_time: z.number().int().positive(),
  exp: z.number().int(),
});
type Claims = z.infer<typeof claimsSchema>;

export interface Sessions {
  /** Start a new session for this user (sign-in, sign-up, accepted invitation, changed password). */
  start(res: Response, user: User): Promise<void>;
  /** Re-sign the caller's session for this user after its session version changed (a new password): same session id. */
  reissue(req: Request, res: Response, user: User): Promise<void>;
  /** Sign out: revoke the session (every renewal of it) and clear the cookie. */
  end(req: Request, res: Response): Promise<void>;
  /** Middleware: read the cookie, set `req.session` when valid, renew it when half used. */
  load: RequestHandler;
  /** For tests and tools: the token a sign-in would set. */
  sign(claims: {
    userId: number;
    sid: string;
    sessionVersion: number;
    authTime: number;
    expiresAt: number;
  }): Promise<string>;
}

/** Keys are derived per purpose so a session signature can never serve as a CSRF signature or the reverse. */
export function deriveKey(secret: string, purpose: string): Buffer {
  return createHmac('sha256', secret).update(`wickstone/${purpose}/v1`).digest();
}

const nowS = (): number => Math.floor(Date.now() / 1000);

export function createSessions(config: Config, logger: Logger): Sessions {
  const key = deriveKey(config.jwtSecret, 'session');
  const names = cookieNames(config);
  const { sessionTtlS, sessionMaxS } = config.auth;

  async function sign(c: {
    userId: number;
    sid: string;
    sessionVersion: number;
    authTime: number;
    expiresAt: number;
  }) {
    return new SignJWT({ sid: c.sid, sv: c.sessionVersion, auth_time: c.authTime })
      .setProtectedHeader({ alg: ALG, typ: 'JWT' })
      .setSubject(String(c.userId))
      .setIssuer(ISSUER)
      .setAudience(AUDIENCE)
      .setIssuedAt()
      .setExpirationTime(c.expiresAt)
      .sign(key);
  }

  async function issue(res: Response, userId: number, sessionVersion: number, sid: string, authTime: number) {
    const expiresAt = Math.min(nowS() + sessionTtlS, authTime + sessionMaxS);
    const token = await sign({ userId, sid, sessionVersion, authTime, expiresAt });
    res.cookie(names.session, token, cookieOptions(config, (expiresAt - nowS()) * 1000));
  }

  async function verify(token: string): Promise<{ claims: Claims } | { problem: string }> {
    try {
      const { payload } = await jwtVerify(token, key, {
        algorithms: [ALG],
        issuer: ISSUER,
        audience: AUDIENCE,
        requiredClaims: ['sub', 'sid', 'sv', 'auth_time', 'exp', 'iat'],
      });
      const parsed = claimsSchema.safeParse(payload);
      if (!parsed.success) return { problem: 'malformed claims' };
      if (parsed.data.auth_time + sessionMaxS < nowS()) return { problem: 'expired' };
      return { claims: parsed.data };
    } catch (err) {
      if (err instanceof joseErrors.JWTExpired) return { problem: 'expired' };
      if (err instanceof joseErrors.JOSEError) return { problem: err.code };
      return { problem: 'unreadable' };
    }
  }

  return {
    sign,
    async start(res, user) {
      await issue(res, user.id, user.sessionVersion, randomBytes(16).toString('hex'), nowS());
    },
    async reissue(req, res, user) {
      const s = req.session;
      if (!s || s.user.id !== user.id)
        return issue(res, user.id, user.sessionVersion, randomBytes(16).toString('hex'), nowS());
      await issue(res, user.id, user.sessionVersion, s.sid, s.authTime);
    },
    async end(req, res) {
      const s = req.session;
      if (s) {
        const expiresAt = new Date((s.authTime + sessionMaxS) * 1000);
        await SessionRevocation.upsert({ sid: s.sid, expiresAt });
        // Housekeeping: a revocation outlives its session only until the session could not be renewed.
        await SessionRevocation.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } }).catch(() => 0);
      }
      res.clearCookie(names.session, cookieOptions(config));
    },
    load: async (req, res, next) => {
      const token: unknown = req.cookies?.[names.session];
      if (typeof token !== 'string' || token === '') return next();
      const result = await verify(token);
      if ('problem' in result) {
        req.sessionProblem = result.problem;
        res.clearCookie(names.session, cookieOptions(config));
        return next();
      }
      const { claims } = result;
      const [user, revoked] = await Promise.all([
        User.findByPk(Number(claims.sub)),
        SessionRevocation.findByPk(claims.sid, { attributes: ['sid'] }),
      ]);
      if (!user || revoked || user.sessionVersion !== claims.sv) {
        req.sessionProblem = !user ? 'no such user' : revoked ? 'signed out' : 'password changed';
        res.clearCookie(names.session, cookieOptions(config));
        return next();
      }
      req.session = { user, sid: claims.sid, authTime: claims.auth_time };
      // Renew once half the lifetime is gone, so an active user is not signed out mid-task.
      if (claims.exp - nowS() < sessionTtlS / 2 && claims.auth_time + sessionMaxS > nowS()) {
        await issue(res, user.id, user.sessionVersion, claims.sid, claims.auth_time).catch((err: unknown) => {
          logger.warn({ err }, 'session renewal failed');
        });
      }
      next();
    },
  };
}
