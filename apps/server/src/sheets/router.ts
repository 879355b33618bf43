import { orgSheetQuerySchema, runParamsSchema, verifyParamsSchema } from '@wickstone/contracts';
import type { Counters } from '../http/counters.js';
import { byIp, sharedRateLimit } from '../http/rate-limit.js';
import type { ApiRoutes } from '../http/routes.js';
import { sendSheet } from './send.js';
import type { SheetService } from './service.js';

export function sheetRoutes(
  routes: ApiRoutes,
  sheets: SheetService,
  limits: { windowMs: number; sheetsPerIp: number },
  counters: Counters,
): void {
  routes.get(
    '/orgs/:orgId/runs/:runId/sheet',
    { access: 'usage:read', params: runParamsSchema, query: orgSheetQuerySchema },
    async ({ org, params, query, res }) => {
      sendSheet(res, await sheets.forOrg(org.id, params.runId, query));
      // Already sent; this only keeps the status the client got.
      return { status: 200 };
    },
  );

  // Counted in the shared store, so every server process counts the same address once.
  const verifyPerIp = sharedRateLimit(counters, 'verify-per-ip', {
    limit: limits.sheetsPerIp,
    windowMs: limits.windowMs,
    keyGenerator: byIp,
    message: 'Too many requests from here: wait a while and try again',
  });

  // Public: whoever holds a sheet can check it. The answer carries the calculation only.
  routes.get(
    '/verify/:runId',
    { access: 'public', params: verifyParamsSchema, use: [verifyPerIp] },
    async ({ params }) => ({ body: await sheets.verify(params.runId) }),
  );
}
