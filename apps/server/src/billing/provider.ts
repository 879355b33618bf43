import Stripe from 'stripe';
import { paidPlanIds, planCurrency, plans, type PaidPlanId, type PlanId } from '@wickstone/contracts';
import type { Config } from '../config.js';

export type PaymentsClient = Stripe;

/**
 * The provider's official SDK, pointed at PAYMENTS_API_URL when it is set (the local fake) and at
 * the provider itself otherwise: switching is configuration only. Null without a secret key.
 */
export function createPaymentsClient(p: Config['payments']): PaymentsClient | null {
  if (!p.secretKey) return null;
  const url = p.apiUrl ? new URL(p.apiUrl) : null;
  const protocol = url?.protocol === 'http:' ? 'http' : 'https';
  return new Stripe(p.secretKey, {
    ...(url ? { host: url.hostname, port: url.port || (protocol === 'http' ? 80 : 443), protocol } : {}),
    maxNetworkRetries: 1,
    timeout: 20_000,
    appInfo: { name: 'Wickstone' },
  });
}

/** Our name for a plan's monthly price at the provider: how a subscription's price says which plan it is. */
export const priceLookupKey = (plan: PaidPlanId): string => `wickstone-${plan}-monthly`;

export function planOfLookupKey(key: string | null | undefined): PlanId | null {
  const m = /^wickstone-([a-z]+)-monthly$/.exec(key ?? '');
  return m && (paidPlanIds as readonly string[]).includes(m[1] ?? '') ? (m[1] as PlanId) : null;
}

/**
 * The provider's price for each paid plan, made from the plan table the first time it is missing
 * (products and prices are found by lookup key, so a second process or a restart finds them).
 */
export async function priceIds(client: PaymentsClient): Promise<Record<PaidPlanId, string>> {
  const keys = paidPlanIds.map(priceLookupKey);
  const found = await client.prices.list({ lookup_keys: keys, limit: 100 });
  const out = {} as Record<PaidPlanId, string>;
  for (const p of found.data) {
    const plan = planOfLookupKey(p.lookup_key);
    if (plan && plan !== 'bench') out[plan] = p.id;
  }
  for (const plan of paidPlanIds) {
    if (out[plan]) continue;
    const product = await client.products.create({ name: `Wickstone ${plans[plan].name}` });
    const price = await client.prices.create({
      product: product.id,
      currency: planCurrency,
      unit_amount: plans[plan].monthlyPence,
      recurring: { interval: 'month' },
      lookup_key: priceLookupKey(plan),
    });
    out[plan] = price.id;
  }
  return out;
}
