import type { ApiRoutes } from '../http/routes.js';
import type { ReleaseService } from './service.js';

/** `GET /releases`: every release this server has, newest first, with its engine and changelog. */
export function releaseRoutes(routes: ApiRoutes, releases: ReleaseService): void {
  routes.get('/releases', { access: 'signedIn' }, () => ({ body: { items: releases.summaries() } }));
}
