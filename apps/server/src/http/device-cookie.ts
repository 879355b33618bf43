import { randomBytes } from 'node:crypto';
import type { Request, Response } from 'express';
import { SignJWT, jwtVerify } from 'jose';
import type { Config } from '../config.js';
import { cookieOptions } from './cookies.js';
import { deriveKey } from './session.js';

/** A browser that signed in to an account before: its device id and that account. */
export interface KnownDevice {
  userId: number;
  deviceId: string;
}

export interface DeviceCookies {
  read(req: Request): Promise<KnownDevice | null>;
  /** After a successful sign-in: a new device id each time, so a stolen cookie goes stale. */
  issue(res: Response, userId: number): Promise<void>;
}

const ALG = 'HS256';
const AUDIENCE = 'wickstone-device';
/** How long a browser stays known without signing in again. */
const DEVICE_TTL_S = 180 * 24 * 3600;

/**
 * Device cookies (OWASP, "Slow Down Online Guessing Attacks with Device Cookies"): signed with a
 * key of their own purpose, httpOnly, SameSite, Secure outside loopback http, `__Host-` prefixed
 * there. They prove nothing by themselves; they only let the sign-in throttle tell a browser that
 * signed in to this account before from everyone else.
 */
export function createDeviceCookies(config: Config): DeviceCookies {
  const key = deriveKey(config.jwtSecret, 'device');
  const name = `${config.auth.secureCookies ? '__Host-' : ''}wst_device`;
  return {
    async read(req) {
      const token = (req.cookies as Record<string, unknown> | undefined)?.[name];
      if (typeof token !== 'string' || token.length > 1000) return null;
      try {
        const { payload } = await jwtVerify(token, key, { algorithms: [ALG], audience: AUDIENCE });
        const userId = Number(payload.sub);
        const deviceId = payload.did;
        if (!Number.isSafeInteger(userId) || userId < 1) return null;
        if (typeof deviceId !== 'string' || !/^[0-9a-f]{32}$/.test(deviceId)) return null;
        return { userId, deviceId };
      } catch {
        return null;
      }
    },
    async issue(res, userId) {
      const token = await new SignJWT({ did: randomBytes(16).toString('hex') })
        .setProtectedHeader({ alg: ALG, typ: 'JWT' })
        .setSubject(String(userId))
        .setAudience(AUDIENCE)
        .setIssuedAt()
        .setExpirationTime(`${DEVICE_TTL_S}s`)
        .sign(key);
      res.cookie(name, token, cookieOptions(config, DEVICE_TTL_S * 1000));
    },
  };
}
