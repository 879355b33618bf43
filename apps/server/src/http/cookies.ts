import type { CookieOptions } from 'express';
import type { Config } from '../config.js';

/**
 * Cookie names and flags. Outside loopback http the cookies are Secure and carry the `__Host-`
 * prefix, which a browser accepts only from this exact origin over https, path `/`, no Domain:
 * a sibling subdomain cannot plant or overwrite them.
 */
export function cookieNames(config: Config): { session: string; csrf: string } {
  const prefix = config.auth.secureCookies ? '__Host-' : '';
  return { session: `${prefix}wst_session`, csrf: `${prefix}wst_csrf` };
}

export function cookieOptions(config: Config, maxAgeMs?: number): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.auth.secureCookies,
    path: '/',
    ...(maxAgeMs === undefined ? {} : { maxAge: maxAgeMs }),
  };
}
