import type { Sequelize } from 'sequelize';
import { plans } from '@wickstone/contracts';
import { createAuditService } from '../../audit/service.js';
import { priceIds, type PaymentsClient } from '../../billing/provider.js';
import { createBillingService } from '../../billing/service.js';
import { accountRow } from '../../billing/plan.js';
import { BillingAccount } from '../models/index.js';

const MONTHS_OF_HISTORY = 3;

/**
 * Put the demo firm on the Field plan with a few months of paid invoices. With a payments client
 * the history is made at the provider (a test clock started months ago, then moved to now, which
 * renews the subscription once a month) and read back through the SDK; without one, the plan is
 * granted with no invoices, and the line printed says so. Idempotent: a firm already on a
 * subscription is left alone.
 */
export async function seedDemoBilling(
  sequelize: Sequelize,
  client: PaymentsClient | null,
  org: { id: number; name: string },
  ownerEmail: string,
  publicUrl: string,
): Promise<string> {
  const existing = await BillingAccount.findByPk(org.id);
  if (existing && existing.plan !== 'bench') return `demo plan: ${plans[existing.plan].name} (already set)`;
  if (!client) {
    await BillingAccount.upsert(accountRow(org.id, { plan: 'field', status: 'active' }));
    return 'demo plan: Field, granted without invoices (no PAYMENTS_SECRET_KEY)';
  }
  const now = Math.floor(Date.now() / 1000);
  const start = new Date();
  start.setUTCMonth(start.getUTCMonth() - MONTHS_OF_HISTORY);
  start.setUTCDate(start.getUTCDate() - 1);
  const clock = await client.testHelpers.testClocks.create({
    frozen_time: Math.floor(start.getTime() / 1000),
    name: 'Wickstone demo firm',
  });
  const customer = await client.customers.create({
    email: ownerEmail,
    name: org.name,
    test_clock: clock.id,
    payment_method: 'pm_card_visa',
    metadata: { organizationId: String(org.id) },
  });
  await BillingAccount.upsert(accountRow(org.id, { customerId: customer.id }));
  const prices = await priceIds(client);
  const sub = await client.subscriptions.create({
    customer: customer.id,
    items: [{ price: prices.field }],
    default_payment_method: 'pm_card_visa',
    metadata: { organizationId: String(org.id) },
  });
  await client.testHelpers.testClocks.advance(clock.id, { frozen_time: now });
  const billing = createBillingService({
    sequelize,
    client,
    webhookSecret: undefined,
    audit: createAuditService(),
    publicUrl,
  });
  await billing.syncSubscription(sub.id);
  const invoices = await client.invoices.list({ customer: customer.id, limit: 24 });
  return `demo plan: Field, paid, with ${invoices.data.length} invoices at the payments fake`;
}
