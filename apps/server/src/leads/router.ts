import {
  addLeadNoteBodySchema,
  leadExportQuerySchema,
  leadListQuerySchema,
  leadParamsSchema,
  orgParamsSchema,
  updateLeadBodySchema,
} from '@wickstone/contracts';
import { sendCsv } from '../export/send.js';
import { auditTrail, type AuditService } from '../audit/service.js';
import type { ApiRoutes } from '../http/routes.js';
import { todayUtc } from '../usage/days.js';
import type { LeadService } from './service.js';

export function leadRoutes(routes: ApiRoutes, leads: LeadService, audit: AuditService): void {
  routes.get(
    '/orgs/:orgId/leads',
    { access: 'leads:read', params: orgParamsSchema, query: leadListQuerySchema },
    async ({ org, query }) => ({
      body: await leads.list(org.id, query),
    }),
  );

  // Declared before /leads/:leadId, which would otherwise take "export" for a lead id.
  routes.get(
    '/orgs/:orgId/leads/export',
    { access: 'leads:read', params: orgParamsSchema, query: leadExportQuerySchema },
    async ({ org, query, res }) => {
      await sendCsv(res, `${org.slug}-leads-${todayUtc()}.csv`, leads.exportCsv(org.id, query));
      // Already sent in full; this only keeps the status the client got.
      return { status: 200 };
    },
  );

  routes.get(
    '/orgs/:orgId/leads/:leadId',
    { access: 'leads:read', params: leadParamsSchema },
    async ({ org, params }) => ({
      body: await leads.get(org.id, params.leadId),
    }),
  );

  routes.patch(
    '/orgs/:orgId/leads/:leadId',
    { access: 'leads:write', params: leadParamsSchema, body: updateLeadBodySchema },
    async ({ org, params, body, session, meta }) => ({
      body: await leads.update(org.id, params.leadId, body, auditTrail(audit, org.id, session.user.id, meta)),
    }),
  );

  routes.delete(
    '/orgs/:orgId/leads/:leadId/personal-data',
    { access: 'leads:erase', params: leadParamsSchema },
    async ({ org, params, session, meta }) => ({
      body: await leads.erase(org.id, params.leadId, auditTrail(audit, org.id, session.user.id, meta)),
    }),
  );

  routes.post(
    '/orgs/:orgId/leads/:leadId/notes',
    { access: 'leads:write', params: leadParamsSchema, body: addLeadNoteBodySchema },
    async ({ org, params, body, session, meta }) => ({
      status: 201,
      body: await leads.addNote(
        org.id,
        params.leadId,
        session.user.id,
        body,
        auditTrail(audit, org.id, session.user.id, meta),
      ),
    }),
  );
}
