import { upgradePreviewQuerySchema, widgetParamsSchema } from '@wickstone/contracts';
import type { Sequelize } from 'sequelize';
import type { ApiRoutes } from '../http/routes.js';
import { createUpgradePreview } from './preview.js';
import type { ReleaseService } from './service.js';

export function releaseRoutes(routes: ApiRoutes, releases: ReleaseService, sequelize: Sequelize): void {
  // Every release this server has, newest first, with its engine and changelog.
  routes.get('/releases', { access: 'signedIn' }, () => ({ body: { items: releases.summaries() } }));

  // What a candidate release would change for one widget, before its pin is moved.
  const preview = createUpgradePreview({ sequelize, releases });
  routes.get(
    '/orgs/:orgId/widgets/:widgetId/upgrade-preview',
    { access: 'releases:pin', params: widgetParamsSchema, query: upgradePreviewQuerySchema },
    async ({ org, params, query }) => ({ body: await preview(org.id, params.widgetId, query.to) }),
  );
}
