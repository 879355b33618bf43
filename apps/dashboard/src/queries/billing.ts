import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  billingInvoicesResponseSchema,
  billingSummarySchema,
  checkoutResponseSchema,
  type PaidPlanId,
} from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

export const planKey = (orgId: number) => ['orgs', orgId, 'plan'] as const;

/** The plan and use against it: every member may read it. */
export const planQuery = (orgId: number) =>
  queryOptions({
    queryKey: planKey(orgId),
    queryFn: async () => billingSummarySchema.parse(await apiFetch(`/orgs/${orgId}/plan`)),
  });

export const invoicesQuery = (orgId: number) =>
  queryOptions({
    queryKey: ['orgs', orgId, 'billing', 'invoices'] as const,
    queryFn: async () =>
      billingInvoicesResponseSchema.parse(await apiFetch(`/orgs/${orgId}/billing/invoices`)),
  });

/** Plan changes land in the plan, the invoices and the audit log. */
function useBillingMutation<V, R>(orgId: number, mutationFn: (vars: V) => Promise<R>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async () => {
      await Promise.all([
        client.invalidateQueries({ queryKey: planKey(orgId) }),
        client.invalidateQueries({ queryKey: ['orgs', orgId, 'billing'] }),
        client.invalidateQueries({ queryKey: ['orgs', orgId, 'audit'] }),
      ]);
    },
  });
}

/** Starts a checkout at the payments provider; the caller sends the browser to the answer's URL. */
export function useCheckout(orgId: number) {
  return useMutation({
    mutationFn: async (plan: PaidPlanId) =>
      checkoutResponseSchema.parse(
        await apiFetch(`/orgs/${orgId}/billing/checkout`, { method: 'POST', json: { plan } }),
      ),
  });
}

export function useChangePlan(orgId: number) {
  return useBillingMutation(orgId, async (plan: PaidPlanId) =>
    billingSummarySchema.parse(
      await apiFetch(`/orgs/${orgId}/billing/plan`, { method: 'POST', json: { plan } }),
    ),
  );
}

export function useCancelPlan(orgId: number) {
  return useBillingMutation(orgId, async () =>
    billingSummarySchema.parse(await apiFetch(`/orgs/${orgId}/billing/cancel`, { method: 'POST' })),
  );
}

export function useResumePlan(orgId: number) {
  return useBillingMutation(orgId, async () =>
    billingSummarySchema.parse(await apiFetch(`/orgs/${orgId}/billing/resume`, { method: 'POST' })),
  );
}
