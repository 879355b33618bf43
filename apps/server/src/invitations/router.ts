import {
  acceptInvitationBodySchema,
  invitationParamsSchema,
  invitationTokenParamsSchema,
  inviteBodySchema,
  orgParamsSchema,
} from '@wickstone/contracts';
import type { AuthService } from '../auth/service.js';
import type { RateLimits } from '../http/rate-limit.js';
import type { ApiRoutes } from '../http/routes.js';
import type { Sessions } from '../http/session.js';
import type { InvitationService } from './service.js';

export function invitationRoutes(
  routes: ApiRoutes,
  d: { invitations: InvitationService; auth: AuthService; sessions: Sessions; limits: RateLimits },
): void {
  const { invitations, auth, sessions, limits } = d;

  routes.post(
    '/orgs/:orgId/invitations',
    {
      access: 'members:manage',
      params: orgParamsSchema,
      body: inviteBodySchema,
      use: [limits.mailOrSignupPerIp],
    },
    async ({ org, session, body, meta }) => ({
      status: 201,
      body: await invitations.invite({ user: session.user, org }, body.email, body.role, meta),
    }),
  );

  routes.post(
    '/orgs/:orgId/invitations/:invitationId/resend',
    { access: 'members:manage', params: invitationParamsSchema, use: [limits.mailOrSignupPerIp] },
    async ({ org, session, params, meta }) => ({
      body: await invitations.resend({ user: session.user, org }, params.invitationId, meta),
    }),
  );

  routes.delete(
    '/orgs/:orgId/invitations/:invitationId',
    { access: 'members:manage', params: invitationParamsSchema },
    async ({ org, session, params, meta }) => {
      await invitations.revoke({ user: session.user, org }, params.invitationId, meta);
    },
  );

  routes.get(
    '/invitations/:token',
    { access: 'public', params: invitationTokenParamsSchema },
    async ({ params }) => ({
      body: await invitations.preview(params.token),
    }),
  );

  routes.post(
    '/invitations/:token/accept',
    {
      access: 'public',
      params: invitationTokenParamsSchema,
      body: acceptInvitationBodySchema,
      use: [limits.failuresPerIp, limits.acceptFailuresPerInvitation],
    },
    async ({ params, body, session, res, meta }) => {
      const user = await invitations.accept(params.token, body, session?.user ?? null, meta);
      await sessions.start(res, user);
      return { body: await auth.me(user) };
    },
  );
}
