import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import {
  CARD_DECLINED,
  CARD_OK,
  seedOrgWithTeam,
  startBillingApp,
  type BillingTestApp,
  type FixtureOrg,
} from '@wickstone/server/testing';
import { launchBrowser } from '../support/browser.js';

/*
 * The owner pays for a larger plan through the payments fake's own checkout page (a declined card
 * first, then one that is accepted) and comes back to the new plan; an analyst is offered no
 * billing and is refused it. SCREENSHOTS_DIR set: the billing screen is saved at 1280 and 390 wide.
 */

async function signIn(page: Page, base: string, email: string, password: string) {
  await page.goto(`${base}/login`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/login'));
}

describe('billing in Chromium: the owner upgrades through the checkout page, an analyst cannot reach billing', () => {
  let app: BillingTestApp;
  let browser: Browser;
  let org: FixtureOrg;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    app = await startBillingApp();
    org = await seedOrgWithTeam('Brackenridge Ground & Damp', { plan: 'bench' });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it("refuses a widget past the Bench plan's count, with the way to a larger plan", async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, app.url, org.users.owner.email, org.users.owner.password);
    await page.goto(`${app.url}/orgs/${org.id}`);
    // Three drafts through the API, as the dashboard sends them (the Bench plan allows three widgets).
    const statuses = await page.evaluate(async (orgId) => {
      const { csrfToken } = (await (await fetch('/api/v1/auth/csrf')).json()) as { csrfToken: string };
      const out: number[] = [];
      for (const name of ['Kerb rise', 'Slab break', 'Wall damp']) {
        const res = await fetch(`/api/v1/orgs/${orgId}/widgets`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'x-csrf-token': csrfToken },
          body: JSON.stringify({ name, calculatorId: 'tube-rise' }),
        });
        out.push(res.status);
      }
      return out;
    }, org.id);
    expect(statuses).toEqual([201, 201, 201]);
    await page.goto(`${app.url}/orgs/${org.id}/widgets/new`);
    await page.getByRole('radio').first().check();
    await page.getByLabel('Name', { exact: true }).fill('Fourth widget');
    await page.getByRole('button', { name: 'Create the widget' }).click();
    await page.getByText('The Bench plan allows 3 widgets and this firm has 3.', { exact: false }).waitFor();
    if (process.env.SCREENSHOTS_DIR)
      await page.screenshot({ path: path.join(process.env.SCREENSHOTS_DIR, 'widget-refused-1280.png') });
    await page.getByRole('link', { name: 'See the plans and move to a larger one' }).click();
    await page.waitForURL(`${app.url}/orgs/${org.id}/billing`);
    await context.close();
  });

  it('upgrades the owner from Bench to Field and shows the new plan and its invoice', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    page.on('pageerror', (e) => pageErrors.push(e.message));
    await signIn(page, app.url, org.users.owner.email, org.users.owner.password);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Billing' }).click();
    await expect.poll(() => page.getByTestId('current-plan').textContent()).toMatch(/^Bench/);
    await page.getByRole('button', { name: 'Pay for Field' }).click();

    // The provider's page (the fake's), on its own origin.
    await page.waitForURL((u) => u.href.startsWith(`${process.env.PAYMENTS_API_URL}/checkout/`));
    expect(await page.getByTestId('checkout-amount').textContent()).toBe('GBP 29.00');
    await page.getByLabel('Card number').fill(CARD_DECLINED);
    await page.getByRole('button', { name: /^Pay / }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/declined/);
    await page.getByLabel('Card number').fill(CARD_OK);
    await page.getByRole('button', { name: /^Pay / }).click();

    await page.waitForURL((u) => u.href.startsWith(`${app.url}/orgs/${org.id}/billing?checkout=`));
    await expect.poll(() => page.getByTestId('current-plan').textContent()).toMatch(/^Field/);
    await expect.poll(() => page.getByText('Paid. The next renewal is on').count()).toBe(1);
    const invoiceLink = page.getByRole('link', { name: /^WKF-/ });
    await expect.poll(() => invoiceLink.count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Move to Office' }).count()).toBe(1);

    const dir = process.env.SCREENSHOTS_DIR;
    if (dir) {
      mkdirSync(dir, { recursive: true });
      await page.screenshot({ path: path.join(dir, 'billing-1280.png'), fullPage: true });
      await page.setViewportSize({ width: 390, height: 844 });
      await page.screenshot({ path: path.join(dir, 'billing-390.png'), fullPage: true });
      await page.goto(`${app.url}/orgs/${org.id}`);
      await page.getByTestId('plan-usage').waitFor();
      await page.screenshot({ path: path.join(dir, 'overview-390.png'), fullPage: true });
    }
    await context.close();
    expect(pageErrors).toEqual([]);
  });

  it('offers an analyst no billing, and refuses the screen and the API', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, app.url, org.users.analyst.email, org.users.analyst.password);
    await page.goto(`${app.url}/orgs/${org.id}`);
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Overview' }).waitFor();
    expect(await nav.getByRole('link', { name: 'Billing' }).count()).toBe(0);
    // The analyst still sees use against the plan on the overview.
    await page.getByTestId('plan-usage').waitFor();

    await page.goto(`${app.url}/orgs/${org.id}/billing`);
    await page.getByRole('heading', { name: 'Not available for your role' }).waitFor();
    expect(await page.getByTestId('current-plan').count()).toBe(0);
    const status = await page.evaluate(
      async (url) => (await fetch(url, { credentials: 'same-origin' })).status,
      `${app.url}/api/v1/orgs/${org.id}/billing/invoices`,
    );
    expect(status).toBe(403);
    await context.close();
  });
});
