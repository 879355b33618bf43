import {
  createWidgetBodySchema,
  orgParamsSchema,
  pageQuerySchema,
  updateWidgetBodySchema,
  widgetParamsSchema,
  widgetRevisionParamsSchema,
} from '@wickstone/contracts';
import { auditTrail, type AuditService } from '../audit/service.js';
import type { ApiRoutes } from '../http/routes.js';
import type { WidgetService } from './service.js';

export function widgetRoutes(routes: ApiRoutes, widgets: WidgetService, audit: AuditService): void {
  routes.get(
    '/orgs/:orgId/widgets',
    { access: 'widgets:read', params: orgParamsSchema, query: pageQuerySchema },
    async ({ org, query }) => ({
      body: await widgets.list(org.id, query.page, query.pageSize),
    }),
  );

  routes.post(
    '/orgs/:orgId/widgets',
    { access: 'widgets:write', params: orgParamsSchema, body: createWidgetBodySchema },
    async ({ org, session, body, meta }) => ({
      status: 201,
      body: await widgets.create(
        org.id,
        session.user.id,
        body,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );

  routes.get(
    '/orgs/:orgId/widgets/:widgetId',
    { access: 'widgets:read', params: widgetParamsSchema },
    async ({ org, params }) => ({
      body: await widgets.get(org.id, params.widgetId),
    }),
  );

  routes.patch(
    '/orgs/:orgId/widgets/:widgetId',
    { access: 'widgets:write', params: widgetParamsSchema, body: updateWidgetBodySchema },
    async ({ org, session, params, body, meta }) => ({
      body: await widgets.update(
        org.id,
        params.widgetId,
        session.user.id,
        body,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );

  routes.get(
    '/orgs/:orgId/widgets/:widgetId/revisions',
    { access: 'widgets:read', params: widgetParamsSchema, query: pageQuerySchema },
    async ({ org, params, query }) => ({
      body: await widgets.revisions(org.id, params.widgetId, query.page, query.pageSize),
    }),
  );

  routes.post(
    '/orgs/:orgId/widgets/:widgetId/revisions/:revisionId/restore',
    { access: 'widgets:write', params: widgetRevisionParamsSchema },
    async ({ org, session, params, meta }) => ({
      body: await widgets.restore(
        org.id,
        params.widgetId,
        params.revisionId,
        session.user.id,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );
}
