import { orgParamsSchema, pageQuerySchema } from '@wickstone/contracts';
import type { ApiRoutes } from '../http/routes.js';
import type { AuditService } from './service.js';

export function auditRoutes(routes: ApiRoutes, audit: AuditService): void {
  routes.get(
    '/orgs/:orgId/audit',
    { access: 'audit:read', params: orgParamsSchema, query: pageQuerySchema },
    async ({ org, query }) => ({
      body: await audit.list(org.id, query.page, query.pageSize),
    }),
  );
}
