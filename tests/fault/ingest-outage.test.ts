import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rollupsFromRaw, runReportBody, storedRollups } from '@wickstone/server/testing';
import { defaultWidgetSettings, errorBodySchema } from '@wickstone/contracts';
import { startMariaDB } from '../../scripts/lib/mariadb.mjs';
import { startFaultServer, type FaultServer } from './fault-server.js';

const SITE = 'https://www.brackenridge-ground.example';
const PUBLIC_KEY = 'wk_faultingest000000001';
const CLIENTS = 20;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('ingest under load while MariaDB is killed and restarted', () => {
  let fault: FaultServer;
  let url: string;
  let sequelize: Sequelize;

  beforeAll(async () => {
    fault = await startFaultServer('ingest', { migrate: true });
    sequelize = fault.sequelize;
    await sequelize.query(
      "INSERT INTO organizations (name, slug, created_at, updated_at) VALUES ('Fenwick Damp Surveys (fault test)', 'fenwick-fault', NOW(3), NOW(3))",
      { type: QueryTypes.INSERT },
    );
    await sequelize.query(
      `INSERT INTO widgets (organization_id, public_key, name, calculator_id, status, allowed_origins, settings, \`release\`, created_at, updated_at)
       SELECT id, ?, 'Rising damp', 'tube-rise', 'live', ?, ?, '0.1.0', NOW(3), NOW(3) FROM organizations WHERE slug = 'fenwick-fault'`,
      {
        replacements: [PUBLIC_KEY, JSON.stringify([SITE]), JSON.stringify(defaultWidgetSettings())],
        type: QueryTypes.INSERT,
      },
    );
    url = `${fault.api}/embed/runs`;
  });

  afterAll(() => fault?.close());

  it('loses no acknowledged report, stores none twice, and keeps the rollups equal to the rows', async () => {
    const acknowledged = new Set<string>();
    const statuses = new Map<number, number>();
    let retryAfterSeen = 0;
    let stop = false;

    /** One visitor's report, sent until it is acknowledged, waiting as long as Retry-After says. */
    async function deliver(i: number): Promise<void> {
      const body = JSON.stringify(
        runReportBody(PUBLIC_KEY, { id: randomUUID(), inputs: { diameter: 0.0002 + (i % 50) * 0.0001 } }),
      );
      const until = Date.now() + 90_000;
      while (Date.now() < until) {
        let res: Response;
        try {
          res = await fetch(url, {
            method: 'POST',
            headers: { 'content-type': 'text/plain;charset=UTF-8', origin: SITE },
            body,
          });
        } catch {
          await sleep(200);
          continue;
        }
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        const answer = (await res.json()) as { id?: string };
        if (res.status === 201 || res.status === 200) {
          expect(acknowledged.has(answer.id!) && res.status === 201).toBe(false);
          acknowledged.add(answer.id!);
          return;
        }
        expect(res.status).toBe(503);
        // The widget on the firm's page can read the outage and how long to wait (CORS).
        expect(res.headers.get('access-control-allow-origin')).toBe(SITE);
        expect(res.headers.get('access-control-expose-headers')).toMatch(/retry-after/i);
        expect(errorBodySchema.parse(answer).error.code).toBe('service_unavailable');
        const wait = Number(res.headers.get('retry-after'));
        expect(wait).toBeGreaterThan(0);
        retryAfterSeen += 1;
        await sleep(wait * 1000);
      }
      throw new Error('a report was never acknowledged');
    }

    let sent = 0;
    const clients = Array.from({ length: CLIENTS }, async () => {
      while (!stop) await deliver(sent++);
    });

    await sleep(1500);
    const before = acknowledged.size;
    const pid = Number(readFileSync(fault.inst.pidFile, 'utf8').trim());
    process.kill(pid, 'SIGKILL');
    await sleep(2000);
    await startMariaDB(fault.inst, { quiet: true });
    // Long enough after the restart for the clients' Retry-After waits to end and load to resume.
    await expect
      .poll(() => acknowledged.size, { timeout: 60_000, interval: 250 })
      .toBeGreaterThan(before + CLIENTS * 3);
    stop = true;
    await Promise.all(clients);

    // The outage was seen as an outage, never as a failure of ours.
    expect(retryAfterSeen).toBeGreaterThan(0);
    expect([...statuses.keys()].every((s) => s === 200 || s === 201 || s === 503)).toBe(true);
    // Every report was acknowledged in the end: each is one row, and there is no other row.
    expect(acknowledged.size).toBe(sent);
    const ids = [...acknowledged];
    const [stored] = await sequelize.query<{ rows: number; distinctIds: number; acked: number }>(
      'SELECT COUNT(*) AS `rows`, COUNT(DISTINCT id) AS distinctIds, SUM(id IN (?)) AS acked FROM runs',
      { replacements: [ids], type: QueryTypes.SELECT },
    );
    expect(Number(stored!.acked)).toBe(ids.length);
    expect(Number(stored!.rows)).toBe(ids.length);
    expect(Number(stored!.distinctIds)).toBe(ids.length);
    expect(await storedRollups(sequelize)).toEqual(await rollupsFromRaw(sequelize));
  }, 180_000);
});
