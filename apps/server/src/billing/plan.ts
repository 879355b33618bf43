import type { Transaction } from 'sequelize';
import { plans, type BillingState, type Plan, type PlanId } from '@wickstone/contracts';
import { BillingAccount } from '../db/models/index.js';

export interface PlanStanding {
  /** The plan whose limits apply now. */
  plan: Plan;
  /** The plan paid for: differs from `plan` once payment lapsed. */
  subscribedPlan: PlanId;
  state: BillingState;
  account: BillingAccount | null;
}

/**
 * Where a firm stands, from the provider's subscription status as last reported: paid features
 * continue while a failed renewal is retried (`past_due`: grace), and stop once the retries run out
 * (`unpaid`) or the subscription ends (`canceled`).
 */
export function standingOf(account: BillingAccount | null): PlanStanding {
  const bench = plans.bench;
  if (!account || account.plan === 'bench')
    return { plan: bench, subscribedPlan: 'bench', state: 'none', account };
  const paid = plans[account.plan] ?? bench;
  switch (account.status) {
    case 'active':
    case 'trialing':
      return {
        plan: paid,
        subscribedPlan: paid.id,
        state: account.cancelAtPeriodEnd ? 'ending' : 'active',
        account,
      };
    case 'past_due':
      return { plan: paid, subscribedPlan: paid.id, state: 'grace', account };
    case 'unpaid':
      return { plan: bench, subscribedPlan: paid.id, state: 'lapsed', account };
    default:
      return { plan: bench, subscribedPlan: 'bench', state: 'none', account };
  }
}

export async function standingFor(orgId: number, transaction?: Transaction): Promise<PlanStanding> {
  return standingOf(await BillingAccount.findByPk(orgId, { transaction }));
}

/** A billing row with no subscription at the provider: the free plan, or a plan granted without one. */
export function accountRow(
  organizationId: number,
  opts: { plan?: PlanId; status?: string; customerId?: string | null } = {},
) {
  return {
    organizationId,
    plan: opts.plan ?? 'bench',
    status: opts.status ?? 'none',
    customerId: opts.customerId ?? null,
    subscriptionId: null,
    currentPeriodEnd: null,
    nextPaymentAttempt: null,
    syncedAt: null,
  } satisfies Partial<BillingAccount>;
}
