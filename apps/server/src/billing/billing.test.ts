import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { billingSummarySchema, errorBodySchema, plans, type BillingSummary } from '@wickstone/contracts';
import { TestClient, mailbox } from '../../testing/client.js';
import { seedOrgWithTeam, snapshotTables, type FixtureOrg } from '../../testing/fixtures.js';
import { CARD_DECLINED, CARD_OK, startBillingApp, type BillingTestApp } from '../../testing/payments.js';
import { liveWidget, reportRun, runAt, SITE, store } from '../../testing/usage.js';
import { BillingAccount } from '../db/models/index.js';
import { seedDemoBilling } from '../db/seed/demo-billing.js';

/*
 * Billing against the payments fake, through the SDK, with webhooks delivered to this app over
 * HTTP and checked with the SDK's signature check. Every firm starts on the free plan.
 */
let t: BillingTestApp;
beforeAll(async () => {
  t = await startBillingApp();
});
afterAll(async () => t?.stop());

async function firm(): Promise<{ org: FixtureOrg; owner: TestClient }> {
  const org = await seedOrgWithTeam(undefined, { plan: 'bench' });
  const owner = new TestClient(t.app);
  await owner.login(org.users.owner.email, org.users.owner.password);
  return { org, owner };
}

async function summaryOf(c: TestClient, orgId: number): Promise<BillingSummary> {
  return billingSummarySchema.parse((await c.get(`/orgs/${orgId}/plan`).expect(200)).body);
}

/** Checkout through the fake's page with `card`; answers the browser's next stop. */
async function payFor(c: TestClient, orgId: number, plan: 'field' | 'office', card = CARD_OK) {
  const { url } = (await c.post(`/orgs/${orgId}/billing/checkout`, { plan }).expect(201)).body as {
    url: string;
  };
  expect(url.startsWith(process.env.PAYMENTS_API_URL ?? '-')).toBe(true);
  return t.fake.pay(url, card);
}

const account = async (orgId: number) => (await BillingAccount.findByPk(orgId))!;
const auditTypes = async (orgId: number) =>
  (
    await t.db.sequelize.query<{ type: string; details: string }>(
      'SELECT type, details FROM audit_events WHERE organization_id = ? ORDER BY id',
      { replacements: [orgId], type: QueryTypes.SELECT },
    )
  ).map((r) => r.type);
const eventsStored = async () =>
  Number(
    (
      await t.db.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM billing_events', {
        type: QueryTypes.SELECT,
      })
    )[0]?.n,
  );

describe('checkout', () => {
  it('activates the plan only when the signed webhook arrives, and lists the invoice with a link', async () => {
    const { org, owner } = await firm();
    expect((await summaryOf(owner, org.id)).plan).toBe('bench');
    const paid = await payFor(owner, org.id, 'field');
    expect(paid.status).toBe(303);
    expect(paid.location).toBe(`${t.url}/orgs/${org.id}/billing?checkout=${paid.location?.split('=')[1]}`);

    const s = await summaryOf(owner, org.id);
    expect(s).toMatchObject({ plan: 'field', subscribedPlan: 'field', state: 'active' });
    expect(Date.parse(s.currentPeriodEnd ?? '')).toBeGreaterThan(Date.now() + 27 * 86_400_000);
    expect(await auditTypes(org.id)).toContain('billing.plan_changed');

    const invoices = (await owner.get(`/orgs/${org.id}/billing/invoices`).expect(200)).body.items;
    expect(invoices).toHaveLength(1);
    expect(invoices[0]).toMatchObject({
      status: 'paid',
      totalPence: plans.field.monthlyPence,
      currency: 'gbp',
    });
    const page = await fetch(invoices[0].url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(invoices[0].number);

    // Paying twice is refused: the change of plan is the way.
    const again = await owner.post(`/orgs/${org.id}/billing/checkout`, { plan: 'office' }).expect(409);
    expect(errorBodySchema.parse(again.body).error.message).toMatch(/change the plan/);
  });

  it('keeps the free plan when the card is declined', async () => {
    const { org, owner } = await firm();
    const declined = await payFor(owner, org.id, 'office', CARD_DECLINED);
    expect(declined.status).toBe(402);
    expect(declined.text).toMatch(/declined/);
    expect(await summaryOf(owner, org.id)).toMatchObject({ plan: 'bench', state: 'none' });
    expect((await account(org.id)).subscriptionId).toBeNull();
    expect(await auditTypes(org.id)).not.toContain('billing.plan_changed');
  });

  it('refuses a plan that does not exist, and anyone but the owner', async () => {
    const { org, owner } = await firm();
    const before = await snapshotTables(t.db.sequelize, ['audit_events']);
    const bad = await owner.post(`/orgs/${org.id}/billing/checkout`, { plan: 'platinum' }).expect(400);
    expect(errorBodySchema.parse(bad.body).error.details).toMatchObject({
      fields: [{ field: 'body.plan' }],
    });
    const admin = new TestClient(t.app);
    await admin.login(org.users.admin.email, org.users.admin.password);
    await admin.post(`/orgs/${org.id}/billing/checkout`, { plan: 'field' }).expect(403);
    await admin.get(`/orgs/${org.id}/billing/invoices`).expect(403);
    // Every member may see the plan and use against it.
    expect((await summaryOf(admin, org.id)).plan).toBe('bench');
    expect(await snapshotTables(t.db.sequelize, ['audit_events'])).toEqual(before);
  });
});

describe('webhooks', () => {
  it('applies a resent event once, and refuses unsigned, forged and stale ones', async () => {
    const { org, owner } = await firm();
    await payFor(owner, org.id, 'field');
    const events = await t.sdk.events.list({ limit: 10 });
    const paid = events.data.find((e) => e.type === 'invoice.paid');
    expect(paid).toBeDefined();
    const stored = await eventsStored();
    const audits = (await auditTypes(org.id)).length;

    // The provider resends (freshly signed): acknowledged, not applied again.
    const resent = await t.fake.resend(paid!.id);
    expect((resent.deliveries as { status: number }[]).at(-1)?.status).toBe(200);
    const payload = JSON.stringify(paid);
    const header = t.sdk.webhooks.generateTestHeaderString({ payload, secret: t.webhookSecret });
    const direct = await fetch(`${t.url}/api/v1/billing/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': header },
      body: payload,
    });
    expect(await direct.json()).toEqual({ received: true, duplicate: true });
    expect(await eventsStored()).toBe(stored);
    expect((await auditTypes(org.id)).length).toBe(audits);

    const forged = { ...paid!, id: 'evt_forged_1' };
    const attempts: [string, Record<string, string>][] = [
      ['unsigned', {}],
      [
        'signed with another secret',
        {
          'stripe-signature': t.sdk.webhooks.generateTestHeaderString({
            payload: JSON.stringify(forged),
            secret: 'whsec_not_ours_0123456789',
          }),
        },
      ],
      [
        'signed an hour ago (a captured delivery replayed)',
        {
          'stripe-signature': t.sdk.webhooks.generateTestHeaderString({
            payload: JSON.stringify(forged),
            secret: t.webhookSecret,
            timestamp: Math.floor(Date.now() / 1000) - 3600,
          }),
        },
      ],
    ];
    for (const [what, headers] of attempts) {
      const res = await fetch(`${t.url}/api/v1/billing/webhook`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', ...headers },
        body: JSON.stringify(forged),
      });
      expect(res.status, what).toBe(400);
      const body = errorBodySchema.parse(await res.json());
      expect(body.error.details, what).toMatchObject({ fields: [{ field: 'headers.stripe-signature' }] });
    }
    // A signed body that is not JSON at all.
    const junk = 'not json';
    const res = await fetch(`${t.url}/api/v1/billing/webhook`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'stripe-signature': t.sdk.webhooks.generateTestHeaderString({
          payload: junk,
          secret: t.webhookSecret,
        }),
      },
      body: junk,
    });
    expect(res.status).toBe(400);
    expect(await eventsStored()).toBe(stored);
  });

  it('ends in the provider state whatever order events arrive in', async () => {
    const { org, owner } = await firm();
    await payFor(owner, org.id, 'field');
    await owner.post(`/orgs/${org.id}/billing/plan`, { plan: 'office' }).expect(200);
    expect((await summaryOf(owner, org.id)).plan).toBe('office');
    // The first event (subscription created, on the Field price) arrives late, under an id new to us.
    const sub = (await account(org.id)).subscriptionId;
    const old = (await t.sdk.events.list({ limit: 100 })).data.find(
      (e) => e.type === 'customer.subscription.created' && (e.data.object as { id: string }).id === sub,
    );
    expect(old).toBeDefined();
    const late = { ...old!, id: `${old!.id}_late` };
    const payload = JSON.stringify(late);
    const res = await fetch(`${t.url}/api/v1/billing/webhook`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'stripe-signature': t.sdk.webhooks.generateTestHeaderString({ payload, secret: t.webhookSecret }),
      },
      body: payload,
    });
    expect(res.status).toBe(200);
    expect((await summaryOf(owner, org.id)).plan).toBe('office');
  });
});

describe('the subscription over time', () => {
  it('renews, then on a failed payment keeps paid features in grace, then falls back to the free limits', async () => {
    const { org, owner } = await firm();
    await payFor(owner, org.id, 'field');
    const a = await account(org.id);
    await liveWidget(owner, org.id, 'Kerb rise', 'tube-rise');
    const periodEnd = a.currentPeriodEnd!.getTime();

    await t.fake.advance(a.subscriptionId!);
    let s = await summaryOf(owner, org.id);
    expect(s).toMatchObject({ plan: 'field', state: 'active' });
    expect(Date.parse(s.currentPeriodEnd!)).toBeGreaterThan(periodEnd);
    expect((await owner.get(`/orgs/${org.id}/billing/invoices`).expect(200)).body.items).toHaveLength(2);

    await t.fake.setCard(a.customerId!, CARD_DECLINED);
    await t.fake.advance(a.subscriptionId!);
    s = await summaryOf(owner, org.id);
    expect(s).toMatchObject({ plan: 'field', subscribedPlan: 'field', state: 'grace' });
    expect(s.nextPaymentAttempt).not.toBeNull();
    // In grace the paid plan's limits still apply: a second live widget is allowed.
    const w2 = await liveWidget(owner, org.id, 'Slab break', 'tube-rise');

    await t.fake.advance(a.subscriptionId!);
    s = await summaryOf(owner, org.id);
    expect(s).toMatchObject({ plan: 'bench', subscribedPlan: 'field', state: 'lapsed' });
    // Lapsed: the free plan's one live widget. The ones live stay live (sites never break), but no more go live.
    await owner.patch(`/orgs/${org.id}/widgets/${w2.id}`, { status: 'paused' }).expect(200);
    const refused = await owner.patch(`/orgs/${org.id}/widgets/${w2.id}`, { status: 'live' }).expect(402);
    const err = errorBodySchema.parse(refused.body).error;
    expect(err.code).toBe('plan_limit');
    expect(err.message).toContain('"Kerb rise"');
    expect(err.message).toMatch(/Billing/);
    expect(err.details).toMatchObject({ plan: 'bench', limit: 1, upgrade: `/orgs/${org.id}/billing` });
  });

  it('cancels at the end of the period, not before', async () => {
    const { org, owner } = await firm();
    await payFor(owner, org.id, 'field');
    const s = (await owner.post(`/orgs/${org.id}/billing/cancel`).expect(200)).body as BillingSummary;
    expect(s).toMatchObject({ plan: 'field', state: 'ending' });
    expect(await auditTypes(org.id)).toContain('billing.cancel_requested');
    await t.fake.advance((await account(org.id)).subscriptionId!);
    expect(await summaryOf(owner, org.id)).toMatchObject({ plan: 'bench', state: 'none' });
    // After it ended the firm may pay again.
    expect((await payFor(owner, org.id, 'office')).status).toBe(303);
    expect(await summaryOf(owner, org.id)).toMatchObject({ plan: 'office', state: 'active' });
  });

  it('prorates an upgrade as the provider computes it, and refuses a downgrade below the live widgets', async () => {
    const { org, owner } = await firm();
    await payFor(owner, org.id, 'field');
    const s = (await owner.post(`/orgs/${org.id}/billing/plan`, { plan: 'office' }).expect(200)).body;
    expect(s).toMatchObject({ plan: 'office', state: 'active' });
    const [proration] = (await owner.get(`/orgs/${org.id}/billing/invoices`).expect(200)).body.items;
    // Moments into the period: nearly the whole difference between the two prices.
    const difference = plans.office.monthlyPence - plans.field.monthlyPence;
    expect(proration.totalPence).toBeGreaterThan(difference * 0.99);
    expect(proration.totalPence).toBeLessThanOrEqual(difference);

    const names = ['A', 'B', 'C', 'D', 'E', 'F'].map((x) => `Rise ${x}`);
    for (const n of names) await liveWidget(owner, org.id, n, 'tube-rise');
    const before = await snapshotTables(t.db.sequelize);
    const refused = await owner.post(`/orgs/${org.id}/billing/plan`, { plan: 'field' }).expect(409);
    const err = errorBodySchema.parse(refused.body).error;
    expect(err.message).toMatch(/put 1 of them on hold first/);
    expect(err.details).toMatchObject({ takeDown: 1, limit: 5 });
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
    expect(
      (await t.sdk.subscriptions.retrieve((await account(org.id)).subscriptionId!)).items.data[0]?.price
        .lookup_key,
    ).toBe('wickstone-office-monthly');
  });
});

describe('limits', () => {
  it('refuses a widget beyond the plan with the way to upgrade', async () => {
    const { org, owner } = await firm();
    for (const n of ['One', 'Two', 'Three'])
      await owner.post(`/orgs/${org.id}/widgets`, { name: n, calculatorId: 'tube-rise' }).expect(201);
    const refused = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'Four', calculatorId: 'tube-rise' })
      .expect(402);
    const err = errorBodySchema.parse(refused.body).error;
    expect(err.message).toBe(
      'The Bench plan allows 3 widgets and this firm has 3. An owner can move to a larger plan under Billing.',
    );
  });

  it('stores runs past the monthly allowance, marks them, and e-mails the owner at 80 % and 100 %', async () => {
    const { org, owner } = await firm();
    const w = await liveWidget(owner, org.id, 'Wall damp', 'tube-rise', [SITE]);
    const now = () => new Date().toISOString();
    const allowance = plans.bench.limits.runsPerMonth;
    await store(
      t.db.sequelize,
      Array.from({ length: allowance * 0.8 - 1 }, () => runAt(w, now(), { diameter: 0.001 })),
    );
    await reportRun(t.app, w, { diameter: 0.001 });
    let mail = await mailbox(t.db.config.mail.fakeApiUrl, org.users.owner.email, 1);
    expect(mail.map((m) => m.subject)).toEqual([
      `Wickstone: ${org.name} has used 80 % of this month's logged runs`,
    ]);

    await store(
      t.db.sequelize,
      Array.from({ length: allowance * 0.2 - 1 }, () => runAt(w, now(), { diameter: 0.001 })),
    );
    await reportRun(t.app, w, { diameter: 0.001 });
    const over = await reportRun(t.app, w, { diameter: 0.001 });
    mail = await mailbox(t.db.config.mail.fakeApiUrl, org.users.owner.email, 2);
    expect(mail).toHaveLength(2);
    expect(mail[0]?.subject).toBe(`Wickstone: ${org.name} has used this month's 300 logged runs`);
    expect(mail[0]?.links.some((l) => l.endsWith(`/orgs/${org.id}/billing`))).toBe(true);

    const marked = await t.db.sequelize.query<{ id: string }>(
      'SELECT id FROM runs WHERE organization_id = ? AND over_allowance = 1',
      { replacements: [org.id], type: QueryTypes.SELECT },
    );
    expect(marked.map((r) => r.id)).toEqual([over]);
    const s = await summaryOf(owner, org.id);
    expect(s.usage).toMatchObject({ runs: allowance + 1, runsOverAllowance: 1, liveWidgets: 1, widgets: 1 });
    // No second notice for the same level in the same month.
    await reportRun(t.app, w, { diameter: 0.001 });
    expect(await mailbox(t.db.config.mail.fakeApiUrl, org.users.owner.email, 3, 300)).toHaveLength(2);
  });
});

describe('the demo seed', () => {
  it('puts the demo firm on a paid plan with months of invoices made at the provider', async () => {
    const { org, owner } = await firm();
    const line = await seedDemoBilling(t.db.sequelize, t.sdk, org, org.users.owner.email, t.url);
    expect(line).toBe('demo plan: Field, paid, with 4 invoices at the payments fake');
    expect(await summaryOf(owner, org.id)).toMatchObject({ plan: 'field', state: 'active' });
    const invoices = (await owner.get(`/orgs/${org.id}/billing/invoices`).expect(200)).body.items as {
      status: string;
      createdAt: string;
    }[];
    expect(invoices.map((i) => i.status)).toEqual(['paid', 'paid', 'paid', 'paid']);
    // Monthly, newest first, the oldest about three months back.
    const ages = invoices.map((i) => (Date.now() - Date.parse(i.createdAt)) / 86_400_000);
    expect(ages[3]).toBeGreaterThan(85);
    expect(ages[3]).toBeLessThan(94);
    expect(await seedDemoBilling(t.db.sequelize, t.sdk, org, org.users.owner.email, t.url)).toBe(
      'demo plan: Field (already set)',
    );
  });
});
