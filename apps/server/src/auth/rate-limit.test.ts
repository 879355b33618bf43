import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '@wickstone/contracts';
import { createTestApp, mailbox, type TestApp, TestClient } from '../../testing/client.js';
import { seedOrgWithTeam, type FixtureOrg } from '../../testing/fixtures.js';
import { delayAfter } from './throttle.js';

/*
 * Sign-in throttling without lockouts (auth/throttle.ts). Here: 3 free failures per account and
 * client, 6 per account over untrusted clients, a per-client ceiling of 8, a warning mail at 5
 * failures of one account. The app trusts X-Forwarded-For in this file, so each browser can speak
 * from its own documentation-range address.
 */
describe('sign-in throttling', () => {
  let t: TestApp;
  let org: FixtureOrg;
  beforeAll(async () => {
    t = await createTestApp({
      TRUST_PROXY: 'true',
      LOGIN_FREE_FAILURES: '3',
      LOGIN_ACCOUNT_FREE_FAILURES: '6',
      LOGIN_LIMIT_PER_IP: '8',
      LOGIN_BURST_NOTIFY: '5',
      LOGIN_MAX_DELAY_SECONDS: '60',
      LOGIN_LIMIT_PER_ACCOUNT: '3',
    });
    org = await seedOrgWithTeam();
  });
  afterAll(async () => {
    await t.close();
  });

  /** One sign-in attempt from `browser` (its cookie jar: session, device cookie) speaking from `from`. */
  async function signIn(browser: TestClient, from: string, email: string, password: string) {
    const csrf = (await browser.agent.get('/api/v1/auth/csrf').set('X-Forwarded-For', from)).body
      .csrfToken as string;
    return browser.agent
      .post('/api/v1/auth/login')
      .set('X-Forwarded-For', from)
      .set('x-csrf-token', csrf)
      .send({ email, password });
  }
  const details = (body: unknown) =>
    errorBodySchema.parse(body).error.details as { retryAfterS: number; slowedBy: string };

  it('doubles the delay for each failure past the free ones, up to the longest', () => {
    expect([3, 4, 5, 6, 7, 30].map((n) => delayAfter(n, 3, 60))).toEqual([0, 1, 2, 4, 8, 60]);
  });

  it('slows one account-and-client pair with growing delays, and says for how long', async () => {
    const { email } = org.users.analyst;
    const browser = new TestClient(t.app);
    const from = '203.0.113.20';
    for (let i = 0; i < 4; i++) expect((await signIn(browser, from, email, `wrong-${i}`)).status).toBe(401);
    const slowed = await signIn(browser, from, email, 'wrong-again');
    expect(slowed.status).toBe(429);
    expect(slowed.body.error.code).toBe('rate_limited');
    expect(slowed.body.error.message).toMatch(/try again in 1 second/);
    expect(details(slowed.body)).toMatchObject({ retryAfterS: 1, slowedBy: 'account_and_client' });
    expect(slowed.headers['retry-after']).toBe('1');
    await new Promise((r) => setTimeout(r, 1_100));
    // The wait is over: the attempt is looked at (and fails), and the next wait is longer.
    expect((await signIn(browser, from, email, 'wrong-5')).status).toBe(401);
    const longer = await signIn(browser, from, email, 'wrong-6');
    expect(longer.status).toBe(429);
    expect(details(longer.body).retryAfterS).toBe(2);
    // The same account from another client is not slowed: no lock on the account.
    expect(
      (await signIn(new TestClient(t.app), '203.0.113.21', email, org.users.analyst.password)).status,
    ).toBe(200);
  });

  it('lets the owner sign in after a stranger’s burst of failures, and warns the owner once', async () => {
    const { email, password } = org.users.owner;
    const ownersBrowser = new TestClient(t.app);
    // An earlier sign-in leaves the signed device cookie.
    expect((await signIn(ownersBrowser, '198.51.100.5', email, password)).status).toBe(200);
    await ownersBrowser.post('/auth/logout', {}).expect(204);

    // A stranger's burst from many addresses: 1 failure each, 9 in all.
    for (let i = 0; i < 9; i++) {
      const res = await signIn(new TestClient(t.app), `203.0.113.${100 + i}`, email, `guess-${i}`);
      expect([401, 429]).toContain(res.status);
    }
    // Untrusted clients are now slowed on this account, even with the right password...
    const newBrowser = await signIn(new TestClient(t.app), '198.51.100.6', email, password);
    expect(newBrowser.status).toBe(429);
    expect(details(newBrowser.body).slowedBy).toBe('account');
    expect(Number(newBrowser.headers['retry-after'])).toBeGreaterThan(0);
    // ...but the owner's own browser passes, even from an address the stranger used (a shared proxy).
    expect((await signIn(ownersBrowser, '203.0.113.100', email, password)).status).toBe(200);

    const warnings = (await mailbox(t.db.config.mail.fakeApiUrl, email, 2, 1_500)).filter((m) =>
      /Failed sign-ins/.test(m.subject),
    );
    expect(warnings).toHaveLength(1);
    expect(warnings[0]?.text).toMatch(/seen 5 failed sign-ins/);
    expect(warnings[0]?.text).not.toMatch(/guess-/);
  });

  it('keeps a per-client ceiling that stops a spray across accounts, which a known browser passes', async () => {
    const from = '192.0.2.77';
    const { email, password } = org.users.developer;
    const devBrowser = new TestClient(t.app);
    expect((await signIn(devBrowser, '192.0.2.78', email, password)).status).toBe(200);
    for (let i = 0; i < 8; i++) {
      expect(
        (await signIn(new TestClient(t.app), from, `sprayed-${i}@tests.example`, 'Winter2026!')).status,
      ).toBe(401);
    }
    const stopped = await signIn(new TestClient(t.app), from, `sprayed-9@tests.example`, 'Winter2026!');
    expect(stopped.status).toBe(429);
    expect(details(stopped.body).slowedBy).toBe('client');
    // Even a real account with its right password, from a browser that never signed in to it...
    const stranger = await signIn(
      new TestClient(t.app),
      from,
      org.users.admin.email,
      org.users.admin.password,
    );
    expect(stranger.status).toBe(429);
    // ...while the developer's own browser behind the same address passes, and other addresses are untouched.
    expect((await signIn(devBrowser, from, email, password)).status).toBe(200);
    expect(
      (await signIn(new TestClient(t.app), '192.0.2.79', org.users.admin.email, org.users.admin.password))
        .status,
    ).toBe(200);
  });

  it('does not let a device cookie of one account vouch for another', async () => {
    const browser = new TestClient(t.app);
    const from = '198.51.100.90';
    expect((await signIn(browser, from, org.users.admin.email, org.users.admin.password)).status).toBe(200);
    const other = org.users.analyst.email;
    for (let i = 0; i < 4; i++) await signIn(browser, from, other, `nope-${i}`);
    expect((await signIn(browser, from, other, 'nope-again')).status).toBe(429);
  });

  it('limits password-reset mails per address asked for', async () => {
    const client = new TestClient(t.app);
    const csrf = await client.csrf();
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      const res = await client.agent
        .post('/api/v1/auth/password/forgot')
        .set('X-Forwarded-For', `192.0.2.${i + 1}`)
        .set('x-csrf-token', csrf)
        .send({ email: org.users.developer.email });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([202, 202, 429]);
  });
});
