import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import {
  createTestDatabase,
  runReportBody,
  seedOrgWithTeam,
  type FixtureOrg,
  type TestDatabase,
} from '@wickstone/server/testing';
import { ApiSession } from '../support/api-session.js';

/*
 * Two real server processes (node apps/server/dist/index.js) on loopback ports over one database,
 * as behind a load balancer: the rate limits hold across both (their counters are in MariaDB), and
 * run reports sent through both, each one twice, are all stored exactly once.
 */
const root = fileURLToPath(new URL('../..', import.meta.url));
const SITE = 'https://www.penrose-geotechnical.example';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

async function waitHealthy(url: string, child: ChildProcess): Promise<void> {
  const until = Date.now() + 30_000;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`);
    try {
      if ((await fetch(`${url}/api/v1/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not become healthy`);
}

describe('two server processes over one database behave as one', () => {
  let db: TestDatabase;
  let org: FixtureOrg;
  const children: ChildProcess[] = [];
  const urls: string[] = [];
  let publicKey: string;
  let widgetId: number;

  beforeAll(async () => {
    db = await createTestDatabase();
    org = await seedOrgWithTeam();
    const secret = randomBytes(32).toString('base64url');
    for (let i = 0; i < 2; i++) {
      const port = await freePort();
      const url = `http://127.0.0.1:${port}`;
      const child = spawn('node', ['apps/server/dist/index.js'], {
        cwd: root,
        stdio: ['ignore', 'ignore', 'inherit'],
        env: {
          ...process.env,
          NODE_ENV: 'test',
          LOG_LEVEL: 'silent',
          HOST: '127.0.0.1',
          PORT: String(port),
          PUBLIC_URL: url,
          DB_NAME: db.config.db.name,
          JWT_SECRET: secret,
          BCRYPT_COST: '4',
          TRUST_PROXY: 'true',
          LOGIN_FREE_FAILURES: '3',
          LEAD_LIMIT_PER_IP: '2',
          RETENTION_FIRST_PURGE_MINUTES: '600',
        },
      });
      children.push(child);
      urls.push(url);
    }
    await Promise.all(urls.map((u, i) => waitHealthy(u, children[i]!)));

    const owner = new ApiSession(urls[0]!);
    const { email, password } = org.users.owner;
    expect((await owner.call('POST', '/auth/login', { email, password })).status).toBe(200);
    const created = await owner.json<{ id: number; publicKey: string; settings: unknown }>(
      'POST',
      `/orgs/${org.id}/widgets`,
      { name: 'Fringe height', calculatorId: 'tube-rise', allowedOrigins: [SITE] },
      201,
    );
    // The second process serves the same session: one secret, one database.
    owner.base = urls[1]!;
    await owner.json('PATCH', `/orgs/${org.id}/widgets/${created.id}`, { status: 'live' }, 200);
    publicKey = created.publicKey;
    widgetId = created.id;
  }, 120_000);

  afterAll(async () => {
    await Promise.all(
      children.map(
        (c) =>
          new Promise<void>((resolve) => {
            if (c.exitCode !== null) return resolve();
            c.once('exit', () => resolve());
            c.kill('SIGTERM');
          }),
      ),
    );
    await db?.drop();
  });

  it('slows an account-and-client pair after 3 failures in all, spread over both processes', async () => {
    const browser = new ApiSession(urls[0]!, { 'X-Forwarded-For': '203.0.113.66' });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      browser.base = urls[i % 2]!; // A, B, A, B, A
      const res = await browser.call('POST', '/auth/login', {
        email: org.users.analyst.email,
        password: `wrong-${i}`,
      });
      statuses.push(res.status);
    }
    // Counted per process, the fifth attempt would be only the third failure at A: 401.
    expect(statuses).toEqual([401, 401, 401, 401, 429]);
  });

  const report = (base: string, id: string) =>
    fetch(`${base}/api/v1/embed/runs`, {
      method: 'POST',
      headers: { Origin: SITE, 'Content-Type': 'text/plain' },
      body: JSON.stringify(runReportBody(publicKey, { id, inputs: { diameter: 0.0006 } })),
    });

  it('stores each run report sent through both processes exactly once', async () => {
    const ids = Array.from({ length: 40 }, () => randomUUID());
    // Every report goes to both processes at once: one stores it, the other finds it stored.
    const answers = await Promise.all(
      ids.flatMap((id, i) => [report(urls[i % 2]!, id), report(urls[(i + 1) % 2]!, id)]),
    );
    const statuses = answers.map((a) => a.status);
    expect(statuses.every((s) => s === 200 || s === 201)).toBe(true);
    expect(statuses.filter((s) => s === 201)).toHaveLength(ids.length);
    const rows = await db.sequelize.query<{ n: number | bigint; distinctIds: number | bigint }>(
      'SELECT COUNT(*) AS n, COUNT(DISTINCT id) AS distinctIds FROM runs WHERE widget_id = ?',
      { replacements: [widgetId], type: QueryTypes.SELECT },
    );
    expect(Number(rows[0]?.n)).toBe(ids.length);
    expect(Number(rows[0]?.distinctIds)).toBe(ids.length);
  });

  it('holds the lead limit per client and widget across both processes', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      const runId = randomUUID();
      expect((await report(urls[i % 2]!, runId)).status).toBe(201);
      const res = await fetch(`${urls[i % 2]}/api/v1/embed/leads`, {
        method: 'POST',
        headers: { Origin: SITE, 'Content-Type': 'text/plain', 'X-Forwarded-For': '198.51.100.33' },
        body: JSON.stringify({
          runId,
          publicKey,
          fields: { name: 'Jago Trewin', email: `jago.${i}@cliff-house.example` },
          consent: true,
        }),
      });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([201, 201, 429]);
  });
});
