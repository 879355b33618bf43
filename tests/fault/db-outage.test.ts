import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@wickstone/server/app';
import { loadConfig } from '@wickstone/server/config';
import { createLogger } from '@wickstone/server/logger';
import { createSequelize, initModels, migrateUp } from '@wickstone/server/db';
import { errorBodySchema, healthResponseSchema } from '@wickstone/contracts';
import {
  ensureDatabase,
  instance,
  startMariaDB,
  stopMariaDB,
  type MariaDBInstance,
} from '../../scripts/lib/mariadb.mjs';
import { ApiSession } from '../support/api-session.js';

// A MariaDB of this test's own, so stopping it harms no other test.
// Its own MariaDB instance; the port can be moved so that several checkouts can test at once.
const faultDbPort = process.env.TEST_FAULT_DB_PORT ?? '3399';

describe('health when the database goes away and comes back', () => {
  let dir: string;
  let inst: MariaDBInstance;
  let server: Server;
  let url: string;
  let closePool: () => Promise<void>;

  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'wst-outage-'));
    inst = instance(dir, Number(faultDbPort));
    await startMariaDB(inst, { quiet: true });
    ensureDatabase(inst, { database: 'outage', user: 'outage', password: 'outage-pass' });
    const config = loadConfig({
      DB_PORT: faultDbPort,
      DB_NAME: 'outage',
      DB_USER: 'outage',
      DB_PASSWORD: 'outage-pass',
      LOG_LEVEL: 'silent',
      NODE_ENV: 'test',
      BCRYPT_COST: '4',
    });
    const sequelize = createSequelize(config.db);
    initModels(sequelize);
    await migrateUp(sequelize);
    closePool = () => sequelize.close();
    const app = createApp({ config, sequelize, logger: createLogger(config) });
    server = await new Promise((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1/health`;
  });

  afterAll(async () => {
    server?.closeAllConnections();
    await new Promise((r) => server?.close(r));
    await closePool?.();
    if (inst) await stopMariaDB(inst, { quiet: true });
    rmSync(dir, { recursive: true, force: true });
  });

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
