import { QueryTypes, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { plans, type BillingInvoice, type BillingSummary, type PaidPlanId } from '@wickstone/contracts';
import { BillingAccount, Organization, Widget } from '../db/models/index.js';
import { AppError } from '../errors.js';
import type { AuditService } from '../audit/service.js';
import type { RequestMeta } from '../http/request-state.js';
import { monthOf, runsInMonth, runsOverAllowance } from './allowance.js';
import { assertFitsPlan } from './limits.js';
import { accountRow, standingOf, standingFor } from './plan.js';
import { planOfLookupKey, priceIds, type PaymentsClient } from './provider.js';
import { dashboardLink } from '../mail/templates.js';

/** Signed events older than this are refused: a captured delivery cannot be replayed later. */
export const WEBHOOK_TOLERANCE_S = 300;
/** A stored subscription in one of these may be replaced by a new one (a fresh checkout). */
const REPLACEABLE = new Set(['none', 'canceled', 'incomplete', 'incomplete_expired', 'unpaid']);

export interface BillingService {
  summary(orgId: number): Promise<BillingSummary>;
  invoices(orgId: number): Promise<{ items: BillingInvoice[] }>;
  checkout(orgId: number, ownerEmail: string, plan: PaidPlanId): Promise<{ url: string }>;
  changePlan(orgId: number, plan: PaidPlanId): Promise<BillingSummary>;
  cancel(orgId: number, actorId: number, meta: RequestMeta): Promise<BillingSummary>;
  resume(orgId: number, actorId: number, meta: RequestMeta): Promise<BillingSummary>;
  /** A webhook delivery: verified, applied once per event id. */
  receive(raw: Buffer, signature: string | undefined): Promise<{ duplicate: boolean }>;
  /** Read a subscription back from the provider and store it (the demo seed; recovery). */
  syncSubscription(subscriptionId: string): Promise<void>;
}

const unavailable = () =>
  new AppError('service_unavailable', 'Payments are not set up on this server (PAYMENTS_SECRET_KEY).');

const iso = (t: number | null | undefined) => (t ? new Date(t * 1000).toISOString() : null);

/** The provider's unreachable, or answered with an error of its own: the firm sees a 503, not a 500. */
async function provider<T>(what: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    const e = err as { type?: string; message?: string; code?: string };
    if (e.type === 'StripeCardError')
      throw new AppError('payment_failed', `The card was declined: ${e.message ?? 'no reason given'}`, {
        code: e.code ?? null,
      });
    if (typeof e.type === 'string' && e.type.startsWith('Stripe'))
      throw new AppError(
        'service_unavailable',
        `The payments provider could not ${what}. Try again shortly.`,
        {
          provider: e.message ?? null,
        },
      );
    throw err;
  }
}

function subscriptionIdOf(event: Stripe.Event): string | null {
  const o = event.data.object as unknown as Record<string, unknown>;
  if (event.type.startsWith('customer.subscription.')) return typeof o.id === 'string' ? o.id : null;
  if (event.type === 'checkout.session.completed')
    return typeof o.subscription === 'string' ? o.subscription : null;
  if (event.type.startsWith('invoice.')) {
    const parent = o.parent as { subscription_details?: { subscription?: unknown } } | null | undefined;
    const sub = parent?.subscription_details?.subscription;
    return typeof sub === 'string' ? sub : null;
  }
  return null;
}

export function createBillingService(deps: {
  sequelize: Sequelize;
  client: PaymentsClient | null;
  webhookSecret: string | undefined;
  audit: AuditService;
  publicUrl: string;
}): BillingService {
  const { sequelize, client, webhookSecret, audit, publicUrl } = deps;
  const payments = (): PaymentsClient => {
    if (!client) throw unavailable();
    return client;
  };

  async function summary(orgId: number): Promise<BillingSummary> {
    const standing = await standingFor(orgId);
    const month = monthOf(new Date());
    const [runs, over, widgets, live] = await Promise.all([
      runsInMonth(sequelize, orgId, month),
      runsOverAllowance(sequelize, orgId, month),
      Widget.count({ where: { organizationId: orgId } }),
      Widget.count({ where: { organizationId: orgId, status: 'live' } }),
    ]);
    const a = standing.account;
    return {
      plan: standing.plan.id,
      subscribedPlan: standing.subscribedPlan,
      state: standing.state,
      currentPeriodEnd: a?.currentPeriodEnd?.toISOString() ?? null,
      nextPaymentAttempt: standing.state === 'grace' ? (a?.nextPaymentAttempt?.toISOString() ?? null) : null,
      usage: { month, runs, runsOverAllowance: over, widgets, liveWidgets: live },
    };
  }

  /** The subscription as the provider has it now, with the next retry of a failed payment. */
  async function current(subscriptionId: string) {
    const c = payments();
    const sub = await provider('read the subscription', () => c.subscriptions.retrieve(subscriptionId));
    let nextAttempt: number | null = null;
    if (sub.status === 'past_due' && typeof sub.latest_invoice === 'string') {
      const inv = await provider('read the invoice', () => c.invoices.retrieve(sub.latest_invoice as string));
      nextAttempt = inv.next_payment_attempt;
    }
    return { sub, nextAttempt };
  }

  /** Store what the provider says of a subscription, and audit a change of plan or standing. */
  async function apply(
    fetched: { sub: Stripe.Subscription; nextAttempt: number | null },
    eventType: string,
    eventId: string | null,
    transaction: Transaction,
  ): Promise<number | null> {
    const { sub, nextAttempt } = fetched;
    const customerId = typeof sub.customer === 'string' ? sub.customer : sub.customer.id;
    const account = await BillingAccount.findOne({
      where: { customerId },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!account) return null;
    // A late event about an old subscription must not overwrite the one that replaced it.
    if (account.subscriptionId && account.subscriptionId !== sub.id && !REPLACEABLE.has(account.status))
      return account.organizationId;
    const before = standingOf(account);
    const item = sub.items.data[0];
    await account.update(
      {
        plan: planOfLookupKey(item?.price.lookup_key) ?? 'bench',
        status: sub.status,
        subscriptionId: sub.id,
        currentPeriodEnd: item ? new Date(item.current_period_end * 1000) : null,
        cancelAtPeriodEnd: sub.cancel_at_period_end,
        nextPaymentAttempt: nextAttempt ? new Date(nextAttempt * 1000) : null,
        syncedAt: new Date(),
      },
      { transaction },
    );
    const after = standingOf(account);
    if (
      before.plan.id !== after.plan.id ||
      before.subscribedPlan !== after.subscribedPlan ||
      before.state !== after.state
    ) {
      await audit.record(
        account.organizationId,
        {
          type: 'billing.plan_changed',
          actorUserId: null,
          subject: `${before.plan.name} → ${after.plan.name}`,
          details: {
            from: { plan: before.plan.id, state: before.state },
            to: { plan: after.plan.id, state: after.state },
            event: eventType,
            eventId,
            subscription: sub.id,
          },
        },
        { ip: null },
        transaction,
      );
    }
    return account.organizationId;
  }

  async function paidAccount(orgId: number): Promise<BillingAccount & { subscriptionId: string }> {
    const standing = await standingFor(orgId);
    const a = standing.account;
    if (!a?.subscriptionId || !['active', 'grace', 'ending'].includes(standing.state))
      throw new AppError(
        'conflict',
        'This firm has no paid subscription to change: choose a plan to pay for first.',
      );
    return a as BillingAccount & { subscriptionId: string };
  }

  return {
    summary,

    async invoices(orgId) {
      const a = await BillingAccount.findByPk(orgId);
      if (!a?.customerId) return { items: [] };
      const c = payments();
      const list = await provider('list the invoices', () =>
        c.invoices.list({ customer: a.customerId as string, limit: 24 }),
      );
      return {
        items: list.data.map((i) => ({
          id: i.id ?? '',
          number: i.number,
          status: i.status ?? 'draft',
          totalPence: i.total,
          currency: i.currency,
          createdAt: iso(i.created) ?? '',
          periodStart: iso(i.period_start),
          periodEnd: iso(i.period_end),
          url: i.hosted_invoice_url ?? null,
          pdfUrl: i.invoice_pdf ?? null,
        })),
      };
    },

    async checkout(orgId, ownerEmail, plan) {
      const c = payments();
      const standing = await standingFor(orgId);
      if (['active', 'grace', 'ending'].includes(standing.state))
        throw new AppError(
          'conflict',
          'This firm already pays for a plan: change the plan instead of paying again.',
          {
            fields: [{ field: 'body.plan', message: 'Use the change of plan' }],
          },
        );
      const prices = await provider('set up the plans', () => priceIds(c));
      let account = standing.account;
      if (!account?.customerId) {
        const org = await Organization.findByPk(orgId, { attributes: ['id', 'name'] });
        const customer = await provider('register the firm', () =>
          c.customers.create({
            email: ownerEmail,
            name: org?.name ?? undefined,
            metadata: { organizationId: String(orgId) },
          }),
        );
        if (account) await account.update({ customerId: customer.id });
        else account = await BillingAccount.create(accountRow(orgId, { customerId: customer.id }));
      }
      const back = dashboardLink(publicUrl, `/orgs/${orgId}/billing`);
      const session = await provider('start the checkout', () =>
        c.checkout.sessions.create({
          mode: 'subscription',
          customer: account.customerId as string,
          line_items: [{ price: prices[plan], quantity: 1 }],
          success_url: `${back}?checkout={CHECKOUT_SESSION_ID}`,
          cancel_url: `${back}?checkout=cancelled`,
          client_reference_id: String(orgId),
          metadata: { organizationId: String(orgId), plan },
          subscription_data: { metadata: { organizationId: String(orgId) } },
        }),
      );
      if (!session.url)
        throw new AppError('service_unavailable', 'The payments provider gave no checkout page.');
      return { url: session.url };
    },

    async changePlan(orgId, plan) {
      const account = await paidAccount(orgId);
      const c = payments();
      const standing = standingOf(account);
      if (standing.state === 'grace')
        throw new AppError('conflict', 'The last payment failed: settle it before changing the plan.');
      if (account.plan === plan)
        throw new AppError('conflict', `This firm is already on the ${plans[plan].name} plan.`, {
          fields: [{ field: 'body.plan', message: 'Already the current plan' }],
        });
      await assertFitsPlan(orgId, plans[plan]);
      const prices = await provider('set up the plans', () => priceIds(c));
      const sub = await provider('read the subscription', () =>
        c.subscriptions.retrieve(account.subscriptionId),
      );
      const item = sub.items.data[0];
      if (!item)
        throw new AppError('service_unavailable', 'The subscription has no plan item at the provider.');
      // The provider prorates by the second and charges or credits the difference at once; the new
      // plan applies when its webhook says the subscription changed.
      await provider('change the plan', () =>
        c.subscriptions.update(account.subscriptionId, {
          items: [{ id: item.id, price: prices[plan] }],
          proration_behavior: 'always_invoice',
          payment_behavior: 'error_if_incomplete',
          cancel_at_period_end: false,
        }),
      );
      return summary(orgId);
    },

    async cancel(orgId, actorId, meta) {
      const account = await paidAccount(orgId);
      const c = payments();
      await assertFitsPlan(orgId, plans.bench);
      await provider('cancel the subscription', () =>
        c.subscriptions.update(account.subscriptionId, { cancel_at_period_end: true }),
      );
      await audit.record(
        orgId,
        {
          type: 'billing.cancel_requested',
          actorUserId: actorId,
          subject: plans[account.plan].name,
          details: { plan: account.plan, endsAt: account.currentPeriodEnd?.toISOString() ?? null },
        },
        meta,
      );
      return summary(orgId);
    },

    async resume(orgId, actorId, meta) {
      const account = await paidAccount(orgId);
      const c = payments();
      if (!account.cancelAtPeriodEnd) throw new AppError('conflict', 'The subscription is not set to end.');
      await provider('keep the subscription', () =>
        c.subscriptions.update(account.subscriptionId, { cancel_at_period_end: false }),
      );
      await audit.record(
        orgId,
        {
          type: 'billing.plan_changed',
          actorUserId: actorId,
          subject: `${plans[account.plan].name} kept`,
          details: { plan: account.plan, resumed: true },
        },
        meta,
      );
      return summary(orgId);
    },

    async receive(raw, signature) {
      const c = payments();
      if (!webhookSecret)
        throw new AppError(
          'service_unavailable',
          'No webhook secret is configured (PAYMENTS_WEBHOOK_SECRET).',
        );
      if (!signature)
        throw new AppError('bad_request', 'The event is not signed', {
          fields: [{ field: 'headers.stripe-signature', message: 'Missing' }],
        });
      let event: Stripe.Event;
      try {
        event = c.webhooks.constructEvent(raw, signature, webhookSecret, WEBHOOK_TOLERANCE_S);
      } catch (err) {
        throw new AppError('bad_request', 'The event signature does not check out', {
          fields: [
            {
              field: 'headers.stripe-signature',
              message: err instanceof Error ? err.message.split('\n')[0]! : 'Invalid signature',
            },
          ],
        });
      }
      if (typeof event.id !== 'string' || typeof event.type !== 'string' || !event.data?.object)
        throw new AppError('bad_request', 'The event is malformed', {
          fields: [{ field: 'body', message: 'Not an event' }],
        });
      const seen = await sequelize.query('SELECT id FROM billing_events WHERE id = ?', {
        replacements: [event.id],
        type: QueryTypes.SELECT,
      });
      if (seen.length) return { duplicate: true };

      // The event says something changed; what changed is read back from the provider, so events
      // arriving out of order all end in the provider's latest state.
      const subscriptionId = subscriptionIdOf(event);
      const fetched = subscriptionId ? await current(subscriptionId) : null;
      try {
        await sequelize.transaction(async (transaction) => {
          const orgId = fetched ? await apply(fetched, event.type, event.id, transaction) : null;
          await sequelize.query(
            'INSERT INTO billing_events (id, type, organization_id, created_at) VALUES (?, ?, ?, NOW(3))',
            {
              replacements: [event.id, event.type.slice(0, 80), orgId],
              type: QueryTypes.INSERT,
              transaction,
            },
          );
        });
      } catch (err) {
        if (err instanceof UniqueConstraintError) return { duplicate: true };
        throw err;
      }
      return { duplicate: false };
    },

    async syncSubscription(subscriptionId) {
      const fetched = await current(subscriptionId);
      await sequelize.transaction((transaction) => apply(fetched, 'sync', null, transaction));
    },
  };
}
