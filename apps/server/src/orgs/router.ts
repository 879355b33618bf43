import { can, memberParamsSchema, memberRoleBodySchema, orgParamsSchema } from '@wickstone/contracts';
import type { ApiRoutes } from '../http/routes.js';
import type { OrgService } from './service.js';

export function orgRoutes(routes: ApiRoutes, orgs: OrgService): void {
  routes.get('/orgs/:orgId', { access: 'org:read', params: orgParamsSchema }, ({ org }) => ({
    body: orgs.get(org),
  }));

  routes.get(
    '/orgs/:orgId/members',
    { access: 'members:read', params: orgParamsSchema },
    async ({ org }) => ({
      // Pending invitations (addresses of people not yet in) are shown to those who manage members.
      body: await orgs.listMembers(org, can(org.role, 'members:manage')),
    }),
  );

  routes.patch(
    '/orgs/:orgId/members/:userId',
    { access: 'members:manage', params: memberParamsSchema, body: memberRoleBodySchema },
    async ({ org, session, params, body, meta }) => ({
      body: await orgs.changeRole({ userId: session.user.id, org }, params.userId, body.role, meta),
    }),
  );

  routes.delete(
    '/orgs/:orgId/members/:userId',
    { access: 'members:manage', params: memberParamsSchema },
    async ({ org, session, params, meta }) => {
      await orgs.removeMember({ userId: session.user.id, org }, params.userId, meta);
    },
  );
}
