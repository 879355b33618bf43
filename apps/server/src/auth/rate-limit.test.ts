import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp, TestClient } from '../../testing/client.js';
import { seedOrgWithTeam, type FixtureOrg } from '../../testing/fixtures.js';

/*
 * Sign-in limits: per account (3 failures here) and per client address (5 here). The app trusts
 * X-Forwarded-For in this file, so each test can speak from its own documentation-range address.
 */
describe('sign-in rate limits', () => {
  let t: TestApp;
  let org: FixtureOrg;
  beforeAll(async () => {
    t = await createTestApp({ LOGIN_LIMIT_PER_ACCOUNT: '3', LOGIN_LIMIT_PER_IP: '5', TRUST_PROXY: 'true' });
    org = await seedOrgWithTeam();
  });
  afterAll(async () => {
    await t.close();
  });

  async function login(from: string, email: string, password: string) {
    const client = new TestClient(t.app);
    const csrf = (await client.agent.get('/api/v1/auth/csrf').set('X-Forwarded-For', from)).body
      .csrfToken as string;
    return client.agent
      .post('/api/v1/auth/login')
      .set('X-Forwarded-For', from)
      .set('x-csrf-token', csrf)
      .send({ email, password });
  }

  it('locks an account after 3 failures, whatever the address, with the standard headers', async () => {
    const { email, password } = org.users.analyst;
    for (const [i, from] of ['203.0.113.1', '203.0.113.2', '203.0.113.3'].entries()) {
      const res = await login(from, email, 'wrong-password-' + i);
      expect(res.status).toBe(401);
      expect(res.headers['ratelimit-policy']).toMatch(/q=3; w=\d+/);
    }
    const blocked = await login('203.0.113.4', email, password);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(blocked.headers.ratelimit).toMatch(/r=0; t=\d+/);
    expect(blocked.headers['ratelimit-policy']).toBeDefined();
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    // Another account from the same address is not affected.
    expect((await login('203.0.113.4', org.users.developer.email, org.users.developer.password)).status).toBe(
      200,
    );
  });

  it('limits failures from one address across accounts, and does not count successes', async () => {
    const from = '198.51.100.7';
    for (let i = 0; i < 6; i++)
      expect((await login(from, org.users.owner.email, org.users.owner.password)).status).toBe(200);
    for (let i = 0; i < 5; i++) {
      const res = await login(from, `nobody-${i}@tests.example`, 'wrong-password');
      expect(res.status).toBe(401);
    }
    const blocked = await login(from, org.users.admin.email, org.users.admin.password);
    expect(blocked.status).toBe(429);
    expect(blocked.headers.ratelimit).toBeDefined();
    expect((await login('198.51.100.8', org.users.admin.email, org.users.admin.password)).status).toBe(200);
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
