import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser } from '../support/browser.js';
import { startApp, type RunningApp } from '../support/server.js';

// Invented staff of the invented demo firm; a fresh suffix per run, since the fake mailbox is shared.
const run = `${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
const firm = 'Brackenridge Ground & Damp';
const owner = {
  name: 'Morwenna Tregaskis',
  email: `morwenna.tregaskis.${run}@brackenridge-ground.example`,
  password: 'damp-course-survey-2026',
};
const analyst = {
  name: 'Idris Penhale',
  email: `idris.penhale.${run}@brackenridge-ground.example`,
  password: 'wicking-logbook-0417',
};

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

const mainNav = (page: Page) => page.getByRole('navigation', { name: 'Main' });

describe('accounts in Chromium: sign up, invite, accept, and what an analyst is offered', () => {
  let app: RunningApp;
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const pageErrors: string[] = [];

  async function freshPage(): Promise<Page> {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    contexts.push(context);
    const page = await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    return page;
  }

  beforeAll(async () => {
    // The invitation travels through the fake SMTP server that npm test (or npm run test:env) provides.
    expect(
      process.env.FAKE_MAIL_API_URL,
      'FAKE_MAIL_API_URL must point at the fake SMTP server',
    ).toBeTruthy();
    app = await startApp({
      FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
      SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
      SMTP_PORT: process.env.SMTP_PORT,
    });
    browser = await launchBrowser();
  });

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await app?.stop();
  });

  let orgPath = '';

  it('signs up a new firm in the browser and lands on its overview as the owner', async () => {
    const page = await freshPage();
    await page.goto(`${app.url}/signup`);
    // The form checks with the contracts' schema before sending anything.
    await page.getByRole('button', { name: 'Create the organisation' }).click();
    await expect.poll(() => page.getByText('Required', { exact: true }).count()).toBe(4);
    expect(await page.getByLabel('Firm or organisation').getAttribute('aria-invalid')).toBe('true');
    await page.getByLabel('Firm or organisation').fill('B');
    await page.getByRole('button', { name: 'Create the organisation' }).click();
    await expect.poll(() => page.getByText('At least 2 characters').count()).toBe(1);

    await page.getByLabel('Firm or organisation').fill(firm);
    await page.getByLabel('Your name').fill(owner.name);
    await page.getByLabel('Work e-mail address').fill(owner.email);
    await page.getByLabel('Password', { exact: true }).fill(owner.password);
    await page.getByRole('button', { name: 'Create the organisation' }).click();

    await page.waitForURL(/\/orgs\/\d+$/);
    orgPath = new URL(page.url()).pathname;
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(firm);
    expect(await page.getByRole('banner').textContent()).toContain('Owner');
    for (const label of ['Overview', 'Team', 'Audit log']) {
      expect(await mainNav(page).getByRole('link', { name: label, exact: true }).count()).toBe(1);
    }
  });

  it('invites an analyst from the team page, and the invitation waits there', async () => {
    expect(orgPath).toMatch(/^\/orgs\/\d+$/);
    const page = contexts[0]!.pages()[0]!;
    await mainNav(page).getByRole('link', { name: 'Team', exact: true }).click();
    await page.waitForURL(`${app.url}${orgPath}/team`);
    const invite = page.getByRole('form', { name: 'Invite someone' });

    await invite.getByLabel('E-mail address').fill('not-an-address');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => invite.getByText('Enter a valid e-mail address').count()).toBe(1);

    await invite.getByLabel('E-mail address').fill(analyst.email);
    await invite.getByLabel('Role').selectOption({ label: 'Analyst' });
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Invitation sent to ${analyst.email} as Analyst.` })
      .waitFor();
    const pending = page.getByRole('table', { name: 'Open invitations' });
    await pending.getByRole('row').filter({ hasText: analyst.email }).waitFor();
    expect(await pending.getByRole('row').filter({ hasText: analyst.email }).textContent()).toContain(
      'Analyst',
    );
  });

  it('opens the invitation from the dev mailbox in a fresh browser and joins as the analyst', async () => {
    const page = await freshPage();
    await page.goto(`${app.url}/dev/mail?to=${encodeURIComponent(analyst.email)}`);
    const message = page.locator('article').filter({ hasText: analyst.email }).first();
    // The mailbox page polls, and the mail may still be on its way through SMTP.
    await message.waitFor({ timeout: 20_000 });
    const link = message.getByRole('link', { name: /\/invitations\// });
    const href = await link.getAttribute('href');
    expect(href?.startsWith(`${app.url}/invitations/`)).toBe(true);
    await link.click();

    await page.waitForURL(/\/invitations\/[^/]+$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(`Join ${firm}`);
    expect(await page.getByText(analyst.email, { exact: true }).count()).toBe(1);
    await page.getByLabel('Your name').fill(analyst.name);
    await page.getByLabel('Choose a password').fill(analyst.password);
    await page.getByRole('button', { name: 'Accept and join' }).click();

    await page.waitForURL(`${app.url}${orgPath}`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(firm);
    expect(await page.getByRole('banner').textContent()).toContain('Analyst');

    // The link is single use: opening it again says so.
    await page.goto(href!);
    await page.getByRole('heading', { name: 'This invitation cannot be used' }).waitFor();
  });

  it('signs the analyst out and in again, and offers them no member management', async () => {
    const page = contexts[1]!.pages()[0]!;
    await page.goto(`${app.url}${orgPath}`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${app.url}/login`);
    await page.getByText('You have signed out.').waitFor();
    // Signed out, a member page sends the visitor to sign in and back.
    await page.goto(`${app.url}${orgPath}/team`);
    await page.waitForURL(`${app.url}/login?next=${encodeURIComponent(`${orgPath}/team`)}`);

    await signIn(page, analyst.email, analyst.password);
    await page.waitForURL(`${app.url}${orgPath}/team`);
    const members = page.getByRole('table', { name: 'Members' });
    await members.getByRole('row').filter({ hasText: analyst.email }).waitFor();
    expect(await members.getByRole('row').filter({ hasText: owner.email }).textContent()).toContain('Owner');
    expect(await members.getByRole('row').filter({ hasText: analyst.email }).textContent()).toContain(
      'Analyst',
    );

    // No invite form, no role pickers, no remove or withdraw buttons, no audit log in the navigation.
    const main = page.getByRole('main');
    expect(await main.getByRole('form', { name: 'Invite someone' }).count()).toBe(0);
    expect(await main.getByRole('button', { name: /invitation|remove|withdraw|save/i }).count()).toBe(0);
    expect(await main.getByRole('combobox').count()).toBe(0);
    expect(await mainNav(page).getByRole('link', { name: 'Team', exact: true }).count()).toBe(1);
    expect(await mainNav(page).getByRole('link', { name: 'Audit log' }).count()).toBe(0);

    // The audit log asked for directly: a clear refusal, not a broken page.
    await page.goto(`${app.url}${orgPath}/audit`);
    await page.getByRole('heading', { name: 'Not available for your role' }).waitFor();

    // Hiding is a courtesy; the server refuses the analyst an invitation even with a valid CSRF token.
    const status = await page.evaluate(async (path) => {
      const { csrfToken } = (await (await fetch('/api/v1/auth/csrf')).json()) as { csrfToken: string };
      const res = await fetch(`/api/v1${path}/invitations`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken },
        body: JSON.stringify({ email: 'someone.else@brackenridge-ground.example', role: 'admin' }),
      });
      return res.status;
    }, orgPath);
    expect(status).toBe(403);
  });

  it('shows the owner the analyst as a member once they joined, with the invitation gone', async () => {
    const page = contexts[0]!.pages()[0]!;
    await page.reload();
    const members = page.getByRole('table', { name: 'Members' });
    await members.getByRole('row').filter({ hasText: analyst.email }).waitFor();
    expect(await page.getByRole('table', { name: 'Open invitations' }).count()).toBe(0);
    expect(await page.getByText('No open invitations').count()).toBe(1);
    // The owner may change the analyst's role: the control is offered here.
    expect(await members.getByLabel(`Role of ${analyst.name}`).count()).toBe(1);
    expect(pageErrors).toEqual([]);
  });
});
