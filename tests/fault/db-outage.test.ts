import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema, healthResponseSchema } from '@wickstone/contracts';
import { startMariaDB, stopMariaDB, type MariaDBInstance } from '../../scripts/lib/mariadb.mjs';
import { startFaultServer, type FaultServer } from './fault-server.js';
import { ApiSession } from '../support/api-session.js';

describe('health when the database goes away and comes back', () => {
  let fault: FaultServer;
  let inst: MariaDBInstance;
  let url: string;

  beforeAll(async () => {
    fault = await startFaultServer('outage', { migrate: true });
    inst = fault.inst;
    url = `${fault.api}/health`;
  });

  afterAll(() => fault?.close());

  /** A browser that signs up while the database is up. */
  let browser: ApiSession;
  const call = (path: string) => browser.call('GET', path);

  it('answers 200 while the database is up', async () => {
    browser = new ApiSession(url.replace('/api/v1/health', ''));
    const signup = await browser.call('POST', '/auth/signup', {
      organizationName: 'Outage Testing Ltd',
      name: 'Wren Outage',
      email: 'wren@outage.example',
      password: 'a-long-enough-passphrase-2026',
    });
    expect(signup.status).toBe(201);
    expect((await call('/auth/me')).status).toBe(200);
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(healthResponseSchema.parse(await res.json()).database.status).toBe('up');
  });

  it('answers 503 with the error shape while it is down, instead of hanging', async () => {
    await stopMariaDB(inst, { quiet: true });
    // A functional bound, not a speed measurement: a load balancer's health probe gives up after
    // some seconds, so a check that hangs on a dead database counts as no answer (the fetch aborts
    // and the test fails); the service's own database timeout is 2.5 s.
    const res = await fetch(url, { signal: AbortSignal.timeout(10_000) });
    expect(res.status).toBe(503);
    const body = errorBodySchema.parse(await res.json());
    expect(body.error.code).toBe('service_unavailable');
    expect(body.error.details).toMatchObject({ database: { status: 'down' } });
    expect(res.headers.get('retry-after')).toMatch(/^\d+$/);
  });

  it('answers an API route 503 with Retry-After, not 500, while the database is down', async () => {
    const res = await fetch(url.replace('/health', '/embed/widgets/wk_does_not_matter'), {
      headers: { origin: 'http://site.example' },
    });
    expect(res.status).toBe(503);
    expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
    const body = errorBodySchema.parse(await res.json());
    expect(body.error.code).toBe('service_unavailable');
  });

  it('answers a signed-in API route 503 with Retry-After, not 500 or a sign-out, while the database is down', async () => {
    for (const path of ['/auth/me', '/orgs/1', '/orgs/1/widgets']) {
      const res = await call(path);
      expect(res.status).toBe(503);
      expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(errorBodySchema.parse(await res.json()).error.code).toBe('service_unavailable');
    }
  });

  it('recovers once the database is back', async () => {
    await startMariaDB(inst, { quiet: true });
    await expect.poll(async () => (await fetch(url)).status, { timeout: 20_000, interval: 250 }).toBe(200);
    // The session outlived the outage: the signed-in route answers again, no new sign-in needed.
    expect((await call('/auth/me')).status).toBe(200);
  });
});
