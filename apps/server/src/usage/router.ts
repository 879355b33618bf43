import { orgParamsSchema, usageSummaryQuerySchema } from '@wickstone/contracts';
import type { ApiRoutes } from '../http/routes.js';
import type { UsageService } from './service.js';

export function usageRoutes(routes: ApiRoutes, usage: UsageService): void {
  routes.get(
    '/orgs/:orgId/usage/summary',
    { access: 'usage:read', params: orgParamsSchema, query: usageSummaryQuerySchema },
    async ({ org, query }) => ({ body: await usage.summary(org.id, query) }),
  );
}
