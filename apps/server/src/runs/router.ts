import {
  can,
  orgParamsSchema,
  runExportQuerySchema,
  runListQuerySchema,
  runParamsSchema,
} from '@wickstone/contracts';
import { sendCsv } from '../export/send.js';
import type { ApiRoutes } from '../http/routes.js';
import { todayUtc } from '../usage/days.js';
import type { RunService } from './service.js';

export function runRoutes(routes: ApiRoutes, runs: RunService): void {
  routes.get(
    '/orgs/:orgId/runs',
    { access: 'usage:read', params: orgParamsSchema, query: runListQuerySchema },
    async ({ org, query }) => ({
      body: await runs.list(org.id, query),
    }),
  );

  // Declared before /runs/:runId, which would otherwise take "export" for a run id.
  routes.get(
    '/orgs/:orgId/runs/export',
    { access: 'usage:read', params: orgParamsSchema, query: runExportQuerySchema },
    async ({ org, query, res }) => {
      const name = `${org.slug}-runs-${query.from ?? 'start'}-to-${query.to ?? todayUtc()}.csv`;
      await sendCsv(res, name, runs.exportCsv(org.id, query));
      // Already sent in full; this only keeps the status the client got.
      return { status: 200 };
    },
  );

  routes.get(
    '/orgs/:orgId/runs/:runId',
    { access: 'usage:read', params: runParamsSchema },
    async ({ org, params }) => {
      const run = await runs.get(org.id, params.runId);
      // Developers read usage but not leads: they see that a run led to one, not who sent it.
      return { body: can(org.role, 'leads:read') ? run : { ...run, lead: null } };
    },
  );
}
