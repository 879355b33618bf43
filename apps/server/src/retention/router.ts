import { orgParamsSchema, retentionBodySchema } from '@wickstone/contracts';
import { auditTrail, type AuditService } from '../audit/service.js';
import type { ApiRoutes } from '../http/routes.js';
import type { RetentionService } from './service.js';

export function retentionRoutes(routes: ApiRoutes, retention: RetentionService, audit: AuditService): void {
  // Every member may see how long usage and leads are kept; owners and admins choose it.
  routes.get(
    '/orgs/:orgId/settings/retention',
    { access: 'org:read', params: orgParamsSchema },
    async ({ org }) => ({
      body: await retention.get(org.id),
    }),
  );

  routes.patch(
    '/orgs/:orgId/settings/retention',
    { access: 'settings:write', params: orgParamsSchema, body: retentionBodySchema },
    async ({ org, body, session, meta }) => ({
      body: await retention.set(
        org.id,
        body.months,
        new Date(),
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );
}
