import {
  createWidgetBodySchema,
  keyRotationBodySchema,
  orgParamsSchema,
  pageQuerySchema,
  setOriginsBodySchema,
  setReleasePinBodySchema,
  updateWidgetBodySchema,
  widgetParamsSchema,
  widgetRevisionParamsSchema,
} from '@wickstone/contracts';
import { auditTrail, type AuditService } from '../audit/service.js';
import type { ApiRoutes } from '../http/routes.js';
import type { WidgetService } from './service.js';
import type { RefusalCounter } from '../embed/refusals.js';
import { fieldError } from '../errors.js';

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

  routes.put(
    '/orgs/:orgId/widgets/:widgetId/release',
    { access: 'releases:pin', params: widgetParamsSchema, body: setReleasePinBodySchema },
    async ({ org, session, params, body, meta }) => ({
      body: await widgets.setPin(
        org.id,
        params.widgetId,
        session.user.id,
        body.pin,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
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

/** The developer's side of embedding: which sites may embed a widget, and which were refused. */
export function embedAccessRoutes(
  routes: ApiRoutes,
  widgets: WidgetService,
  refusals: RefusalCounter,
  audit: AuditService,
): void {
  routes.put(
    '/orgs/:orgId/widgets/:widgetId/origins',
    { access: 'embed:manage', params: widgetParamsSchema, body: setOriginsBodySchema },
    async ({ org, session, params, body, meta }) => {
      // Named by this route's own field (the service, shared with PATCH, names allowedOrigins).
      if (body.origins.length === 0 && (await widgets.get(org.id, params.widgetId)).status === 'live')
        throw fieldError('body.origins', 'A live widget needs at least one site allowed to embed it');
      return {
        body: await widgets.update(
          org.id,
          params.widgetId,
          session.user.id,
          { allowedOrigins: body.origins },
          auditTrail(audit, org.id, session.user.id, meta),
        ),
      };
    },
  );

  routes.post(
    '/orgs/:orgId/widgets/:widgetId/key-rotations',
    { access: 'embed:manage', params: widgetParamsSchema, body: keyRotationBodySchema },
    async ({ org, session, params, body, meta }) => ({
      status: 201,
      body: await widgets.rotateKey(
        org.id,
        params.widgetId,
        session.user.id,
        body.oldKeyValidUntil,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );

  // A leaked key, or every page already updated: the replaced key is refused from now on.
  routes.post(
    '/orgs/:orgId/widgets/:widgetId/key-rotations/end-overlap',
    { access: 'embed:manage', params: widgetParamsSchema },
    async ({ org, session, params, meta }) => ({
      body: await widgets.endKeyOverlap(
        org.id,
        params.widgetId,
        session.user.id,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );

  // The overview's card: every widget's refusals in one answer, however many widgets there are.
  routes.get(
    '/orgs/:orgId/refused-origins',
    { access: 'embed:manage', params: orgParamsSchema },
    async ({ org }) => ({
      body: await refusals.listForOrg(org.id),
    }),
  );

  routes.get(
    '/orgs/:orgId/widgets/:widgetId/refused-origins',
    { access: 'embed:manage', params: widgetParamsSchema },
    async ({ org, params }) => {
      await widgets.get(org.id, params.widgetId);
      return { body: await refusals.list(org.id, params.widgetId) };
    },
  );
}
