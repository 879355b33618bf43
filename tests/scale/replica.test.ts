import { randomUUID } from 'node:crypto';
import { rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { runListResponseSchema, usageSummarySchema } from '@wickstone/contracts';
import { createApp } from '@wickstone/server/app';
import { loadConfig } from '@wickstone/server/config';
import { createReadSequelize } from '@wickstone/server/db';
import { createLogger } from '@wickstone/server/logger';
import {
  createTestDatabase,
  liveWidget,
  readCsv,
  runAt,
  seedOrgWithTeam,
  store,
  testDatabaseName,
  TestClient,
  type FixtureOrg,
  type FixtureWidget,
  type TestDatabase,
} from '@wickstone/server/testing';
import {
  instance,
  sql,
  startMariaDB,
  stopMariaDB,
  type MariaDBInstance,
} from '../../scripts/lib/mariadb.mjs';

/*
 * A second MariaDB on loopback (Debian's package, a private data folder under var/) replicating the
 * test database from the test MariaDB by its binary log (GTID). The app is given Sequelize's
 * read/write replication over the two: usage summaries and the runs list and export come from the
 * replica (rows present only on the replica show up there), every write goes to the primary, and
 * what a signed-in user changes is read back from the primary even while the replica is behind.
 */
const root = fileURLToPath(new URL('../..', import.meta.url));
const REPLICA_PORT = Number(process.env.TEST_REPLICA_DB_PORT ?? 3398);
const READER = { user: 'wst_reader', password: 'reader-test-only' };
const REPL = { user: 'wst_repl', password: 'repl-test-only' };

/** The one value a statement answers (the client prints a header line, then the value). */
const value = (inst: MariaDBInstance, query: string): string =>
  sql(inst, query).trim().split('\n').at(-1)?.trim() ?? '';

const ago = (days: number) => new Date(Date.now() - days * 86_400_000);
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

describe('reads from a read replica', () => {
  const primary = instance(path.join(root, 'var', 'mariadb-test'), Number(process.env.DB_PORT ?? 3308));
  const replica = instance(path.join(root, 'var', 'mariadb-replica-test'), REPLICA_PORT);
  const name = testDatabaseName();
  let db: TestDatabase;
  let reads: Sequelize;
  let org: FixtureOrg;
  let owner: TestClient;
  let analyst: TestClient;
  let widget: FixtureWidget;

  /** Wait until the replica has applied everything the primary has logged so far; the time it took. */
  async function caughtUp(): Promise<number> {
    const pos = value(primary, 'SELECT @@gtid_binlog_pos');
    const t0 = performance.now();
    expect(value(replica, `SELECT MASTER_GTID_WAIT('${pos}', 30)`)).toBe('0');
    return performance.now() - t0;
  }

  const onReplica = (query: string) => sql(replica, `USE \`${name}\`; ${query}`);

  beforeAll(async () => {
    expect(
      value(primary, 'SELECT @@log_bin'),
      'the test MariaDB writes no binary log: restart it (npm run test:env:stop, then npm run test:env)',
    ).toBe('1');
    // A replica from nothing: an empty data folder, only this file's database replicated.
    await stopMariaDB(replica, { quiet: true });
    rmSync(replica.dir, { recursive: true, force: true });
    await startMariaDB(replica, {
      quiet: true,
      args: ['--server-id=2', '--relay-log=relay', `--replicate-do-db=${name}`, '--read-only'],
    });
    sql(
      primary,
      `CREATE USER IF NOT EXISTS '${REPL.user}'@'127.0.0.1' IDENTIFIED BY '${REPL.password}';
       GRANT REPLICATION SLAVE ON *.* TO '${REPL.user}'@'127.0.0.1';`,
    );
    // The database is made on both by hand (made on the primary without a current database, its
    // CREATE is not replicated under replicate-do-db); its tables and rows then come by replication.
    sql(
      replica,
      `CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
       CREATE USER '${READER.user}'@'127.0.0.1' IDENTIFIED BY '${READER.password}';
       GRANT SELECT ON \`${name}\`.* TO '${READER.user}'@'127.0.0.1';
       SET GLOBAL gtid_slave_pos = '${value(primary, 'SELECT @@gtid_binlog_pos')}';
       CHANGE MASTER TO MASTER_HOST = '127.0.0.1', MASTER_PORT = ${primary.port},
         MASTER_USER = '${REPL.user}', MASTER_PASSWORD = '${REPL.password}', MASTER_USE_GTID = slave_pos;
       START SLAVE;`,
    );
    db = await createTestDatabase({ BCRYPT_COST: '4' }, name);
    const config = loadConfig({
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      DB_NAME: name,
      DB_READ_HOST: '127.0.0.1',
      DB_READ_PORT: String(REPLICA_PORT),
      DB_READ_USER: READER.user,
      DB_READ_PASSWORD: READER.password,
    });
    const made = createReadSequelize(config.db);
    if (!made) throw new Error('DB_READ_HOST was set, yet no read pool was made');
    reads = made;
    const app = createApp({ config, sequelize: db.sequelize, reads, logger: createLogger(config) });
    org = await seedOrgWithTeam('Harrowgate Soil & Damp');
    owner = new TestClient(app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    analyst = new TestClient(app);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    widget = await liveWidget(owner, org.id, 'Rising damp in a pore', 'tube-rise');
    await store(db.sequelize, [
      runAt(widget, ago(3).toISOString(), { diameter: 0.004 }),
      runAt(widget, ago(2).toISOString(), { diameter: 0.0008 }),
      runAt(widget, ago(1).toISOString(), { diameter: 0.03 }),
    ]);
    const lagMs = await caughtUp();
    // A figure for the README's scale-out section, not an assertion.
    console.log(`replica caught up with the primary's last write ${lagMs.toFixed(0)} ms after it was asked`);
  });

  afterAll(async () => {
    await reads?.close().catch(() => undefined);
    await db?.drop().catch(() => undefined);
    try {
      sql(replica, 'STOP SLAVE;');
    } catch {
      // already stopped, or never started
    }
    await stopMariaDB(replica, { quiet: true });
    rmSync(replica.dir, { recursive: true, force: true });
    sql(primary, `DROP USER IF EXISTS '${REPL.user}'@'127.0.0.1';`);
  });

  it('serves the usage summary from the replica: a count kept only there is in it, and not on the primary', async () => {
    const range = `from=${isoDay(ago(10))}&to=${isoDay(ago(0))}`;
    const before = usageSummarySchema.parse(
      (await analyst.get(`/orgs/${org.id}/usage/summary?${range}`).expect(200)).body,
    );
    expect(before.totals.runs).toBe(3);
    const selects = Number(
      value(
        replica,
        "SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'COM_SELECT'",
      ),
    );
    // Seven runs on a day eight days back, written on the replica alone (as its root, past read-only).
    onReplica(
      `INSERT INTO run_daily (organization_id, day, widget_id, calculator_id, origin, runs, warned, disagreed, warned_disagreed, led)
       VALUES (${org.id}, '${isoDay(ago(8))}', ${widget.id}, 'tube-rise', 'https://replica-only.example', 7, 0, 0, 0, 0)`,
    );
    const after = usageSummarySchema.parse(
      (await analyst.get(`/orgs/${org.id}/usage/summary?${range}`).expect(200)).body,
    );
    expect(after.totals.runs).toBe(10);
    expect(after.perDay.find((d) => d.day === isoDay(ago(8)))?.runs).toBe(7);
    expect(
      Number(
        value(
          replica,
          "SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'COM_SELECT'",
        ),
      ),
    ).toBeGreaterThan(selects);
    const onPrimary = await db.sequelize.query<{ n: string | number }>(
      'SELECT COALESCE(SUM(runs), 0) AS n FROM run_daily WHERE organization_id = ?',
      { replacements: [org.id], type: QueryTypes.SELECT },
    );
    expect(Number(onPrimary[0]?.n)).toBe(3);
  });

  it('lists and exports runs from the replica', async () => {
    const id = randomUUID();
    // A copy of a stored run under a new id, on the replica alone.
    onReplica(
      `INSERT INTO runs (id, organization_id, widget_id, calculator_id, origin, page_url, \`release\`, calc_version, unit_system,
         inputs, client_result, server_result, warning_codes, has_warning, agreed, mismatch, input_hash, body_hash, created_at, over_allowance)
       SELECT '${id}', organization_id, widget_id, calculator_id, origin, page_url, \`release\`, calc_version, unit_system,
         inputs, client_result, server_result, warning_codes, has_warning, agreed, mismatch, input_hash, body_hash,
         created_at + INTERVAL 1 SECOND, over_allowance
       FROM runs WHERE organization_id = ${org.id} ORDER BY created_at DESC LIMIT 1`,
    );
    const list = runListResponseSchema.parse((await analyst.get(`/orgs/${org.id}/runs`).expect(200)).body);
    expect(list.items.map((r) => r.id)).toContain(id);
    const csv = readCsv((await analyst.get(`/orgs/${org.id}/runs/export`).expect(200)).text);
    expect(csv.slice(1).map((row) => row[1])).toContain(id);
    expect(csv).toHaveLength(1 + 4);
    const primaryRows = await db.sequelize.query('SELECT id FROM runs WHERE id = ?', {
      replacements: [id],
      type: QueryTypes.SELECT,
    });
    expect(primaryRows).toEqual([]);
  });

  it('writes to the primary, and reads back on the primary what the user just changed while the replica lags', async () => {
    // The replica stops applying changes: it falls behind by everything from here on.
    sql(replica, 'STOP SLAVE SQL_THREAD;');
    try {
      await owner
        .patch(`/orgs/${org.id}/widgets/${widget.id}`, { name: 'Rising damp (renamed)' })
        .expect(200);
      const read = await owner.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200);
      expect((read.body as { name: string }).name).toBe('Rising damp (renamed)');
      // A write through the read pool goes to the primary too.
      await reads.query('UPDATE organizations SET name = ? WHERE id = ?', {
        replacements: ['Harrowgate Soil & Damp Ltd', org.id],
        type: QueryTypes.UPDATE,
      });
      const names = await db.sequelize.query<{ name: string }>(
        'SELECT (SELECT name FROM widgets WHERE id = ?) AS name UNION ALL SELECT name FROM organizations WHERE id = ?',
        { replacements: [widget.id, org.id], type: QueryTypes.SELECT },
      );
      expect(names.map((n) => n.name)).toEqual(['Rising damp (renamed)', 'Harrowgate Soil & Damp Ltd']);
      // The replica has neither yet.
      expect(value(replica, `SELECT name FROM \`${name}\`.widgets WHERE id = ${widget.id}`)).toBe(
        'Rising damp in a pore',
      );
    } finally {
      sql(replica, 'START SLAVE SQL_THREAD;');
    }
    await caughtUp();
    expect(value(replica, `SELECT name FROM \`${name}\`.widgets WHERE id = ${widget.id}`)).toBe(
      'Rising damp (renamed)',
    );
    expect(value(replica, `SELECT name FROM \`${name}\`.organizations WHERE id = ${org.id}`)).toBe(
      'Harrowgate Soil & Damp Ltd',
    );
  });
});
