import { devMailQuerySchema } from '@wickstone/contracts';
import type { ApiRoutes } from '../http/routes.js';
import type { DevMailService } from './service.js';

/**
 * `GET /dev/mail`: the fake mailbox, for a person running the product locally to open the links it
 * sent. Public like the mailbox itself (a new user accepting an invitation is not signed in yet);
 * the route exists only while the app is configured with the fake SMTP server.
 */
export function devMailRoutes(routes: ApiRoutes, devMail: DevMailService): void {
  routes.get('/dev/mail', { access: 'public', query: devMailQuerySchema }, async ({ query }) => ({
    body: { items: await devMail.list(query.to, query.limit) },
  }));
}
