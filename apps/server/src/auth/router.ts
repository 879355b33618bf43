import {
  forgotPasswordBodySchema,
  loginBodySchema,
  resetPasswordBodySchema,
  signupBodySchema,
  updateAccountBodySchema,
} from '@wickstone/contracts';
import type { Csrf } from '../http/csrf.js';
import type { DeviceCookies } from '../http/device-cookie.js';
import { byIp, type RateLimits } from '../http/rate-limit.js';
import type { ApiRoutes } from '../http/routes.js';
import type { Sessions } from '../http/session.js';
import type { AuthService } from './service.js';

export function authRoutes(
  routes: ApiRoutes,
  d: { auth: AuthService; sessions: Sessions; csrf: Csrf; limits: RateLimits; devices: DeviceCookies },
): void {
  const { auth, sessions, csrf, limits, devices } = d;

  routes.get('/auth/csrf', { access: 'public' }, ({ req, res }) => ({
    body: { csrfToken: csrf.token(req, res) },
  }));

  routes.post(
    '/auth/signup',
    { access: 'public', body: signupBodySchema, use: [limits.mailOrSignupPerIp] },
    async ({ body, res, meta }) => {
      const user = await auth.signup(body, meta);
      await sessions.start(res, user);
      return { status: 201, body: await auth.me(user) };
    },
  );

  routes.post(
    '/auth/login',
    // Throttled inside the service (auth/throttle.ts): growing delays per account and client, never a lockout.
    { access: 'public', body: loginBodySchema },
    async ({ req, body, res, meta }) => {
      const device = await devices.read(req);
      const user = await auth.login(body.email, body.password, meta, { client: byIp(req), device });
      await sessions.start(res, user);
      await devices.issue(res, user.id);
      return { body: await auth.me(user) };
    },
  );

  // Public so that signing out twice, or with a session that already ran out, is not an error.
  routes.post('/auth/logout', { access: 'public' }, async ({ req, res, session, meta }) => {
    if (session) await auth.logout(session.user, meta);
    await sessions.end(req, res);
  });

  routes.get('/auth/me', { access: 'signedIn' }, async ({ session }) => ({
    body: await auth.me(session.user),
  }));

  routes.patch(
    '/auth/me',
    { access: 'signedIn', body: updateAccountBodySchema, use: [limits.failuresPerIp] },
    async ({ req, session, body, res, meta }) => {
      const { user, passwordChanged } = await auth.updateAccount(session.user, body, meta);
      // The new password ended every session of the account; this one goes on, re-signed.
      if (passwordChanged) await sessions.reissue(req, res, user);
      return { body: await auth.me(user) };
    },
  );

  routes.post(
    '/auth/password/forgot',
    {
      access: 'public',
      body: forgotPasswordBodySchema,
      use: [limits.mailOrSignupPerIp, limits.resetMailsPerAccount],
    },
    async ({ body, meta }) => {
      await auth.forgotPassword(body.email, meta);
      return { status: 202, body: { ok: true } };
    },
  );

  routes.post(
    '/auth/password/reset',
    { access: 'public', body: resetPasswordBodySchema, use: [limits.failuresPerIp] },
    async ({ body, meta }) => {
      await auth.resetPassword(body.token, body.password, meta);
    },
  );
}
