import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema, healthResponseSchema } from '@wickstone/contracts';
import { startMariaDB, stopMariaDB, type MariaDBInstance } from '../../scripts/lib/mariadb.mjs';
import { startFaultServer, type FaultServer } from './fault-server.js';

describe('health when the database goes away and comes back', () => {
  let fault: FaultServer;
  let inst: MariaDBInstance;
  let url: string;

  beforeAll(async () => {
    fault = await startFaultServer('outage');
    inst = fault.inst;
    url = `${fault.api}/health`;
  });

  afterAll(() => fault?.close());

  it('answers 200 while the database is up', async () => {
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(healthResponseSchema.parse(await res.json()).database.status).toBe('up');
  });

  it('answers 503 with the error shape while it is down, within seconds', async () => {
    await stopMariaDB(inst, { quiet: true });
    const t0 = Date.now();
    const res = await fetch(url);
    expect(res.status).toBe(503);
    const body = errorBodySchema.parse(await res.json());
    expect(body.error.code).toBe('service_unavailable');
    expect(body.error.details).toMatchObject({ database: { status: 'down' } });
    expect(res.headers.get('retry-after')).toMatch(/^\d+$/);
    expect(Date.now() - t0).toBeLessThan(10_000);
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

  it('recovers once the database is back', async () => {
    await startMariaDB(inst, { quiet: true });
    await expect.poll(async () => (await fetch(url)).status, { timeout: 20_000, interval: 250 }).toBe(200);
  });
});
