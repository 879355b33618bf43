import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { orgSheetQuerySchema, runParamsSchema, verifyParamsSchema } from '@wickstone/contracts';
import { AppError } from '../errors.js';
import type { ApiRoutes } from '../http/routes.js';
import { sendSheet } from './send.js';
import type { SheetService } from './service.js';

export function sheetRoutes(
  routes: ApiRoutes,
  sheets: SheetService,
  limits: { windowMs: number; sheetsPerIp: number },
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

  const verifyPerIp = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.sheetsPerIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: 'verify-per-ip',
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    handler: (_req, _res, next) =>
      next(new AppError('rate_limited', 'Too many requests from here: wait a while and try again')),
  });

  // Public: whoever holds a sheet can check it. The answer carries the calculation only.
  routes.get(
    '/verify/:runId',
    { access: 'public', params: verifyParamsSchema, use: [verifyPerIp] },
    async ({ params }) => ({ body: await sheets.verify(params.runId) }),
  );
}
