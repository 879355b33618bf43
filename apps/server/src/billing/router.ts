import express, { type Router } from 'express';
import { changePlanBodySchema, checkoutBodySchema, orgParamsSchema } from '@wickstone/contracts';
import type { ApiRoutes } from '../http/routes.js';
import type { BillingService } from './service.js';

export function billingRoutes(routes: ApiRoutes, billing: BillingService): void {
  // Every member sees the plan and use against it; only the owner sees invoices and changes it.
  routes.get('/orgs/:orgId/plan', { access: 'org:read', params: orgParamsSchema }, async ({ org }) => ({
    body: await billing.summary(org.id),
  }));

  routes.get(
    '/orgs/:orgId/billing/invoices',
    { access: 'billing:manage', params: orgParamsSchema },
    async ({ org }) => ({ body: await billing.invoices(org.id) }),
  );

  routes.post(
    '/orgs/:orgId/billing/checkout',
    { access: 'billing:manage', params: orgParamsSchema, body: checkoutBodySchema },
    async ({ org, session, body }) => ({
      status: 201,
      body: await billing.checkout(org.id, session.user.email, body.plan),
    }),
  );

  routes.post(
    '/orgs/:orgId/billing/plan',
    { access: 'billing:manage', params: orgParamsSchema, body: changePlanBodySchema },
    async ({ org, body }) => ({ body: await billing.changePlan(org.id, body.plan) }),
  );

  routes.post(
    '/orgs/:orgId/billing/cancel',
    { access: 'billing:manage', params: orgParamsSchema },
    async ({ org, session, meta }) => ({ body: await billing.cancel(org.id, session.user.id, meta) }),
  );

  routes.post(
    '/orgs/:orgId/billing/resume',
    { access: 'billing:manage', params: orgParamsSchema },
    async ({ org, session, meta }) => ({ body: await billing.resume(org.id, session.user.id, meta) }),
  );
}

/**
 * `/api/v1/billing/webhook`: the provider's signed events. No cookies, no CSRF token: the signature
 * over the exact bytes received is the check, so the body is kept raw.
 */
export function billingWebhookRouter(billing: BillingService): Router {
  const router = express.Router();
  router.post('/', express.raw({ type: () => true, limit: '256kb' }), async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const result = await billing.receive(raw, req.get('stripe-signature'));
    res.set('Cache-Control', 'no-store').json({ received: true, duplicate: result.duplicate });
  });
  return router;
}
