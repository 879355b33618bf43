import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { createTestDatabase, type TestDatabase } from '../../testing/db.js';
import { createMigrator, migrateUp } from './migrator.js';
import { migrations } from './migrations/index.js';

describe('migrations against the real MariaDB', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(async () => {
    await db.drop();
  });

  const tables = async () =>
    (
      await db.sequelize.query<{ t: string }>(
        'SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE()',
        { type: QueryTypes.SELECT },
      )
    ).map((r) => r.t);

  it('records every migration as applied and creates its tables', async () => {
    const executed = await createMigrator(db.sequelize).executed();
    expect(executed.map((m) => m.name)).toEqual(migrations.map((m) => m.name));
    expect(await tables()).toEqual(expect.arrayContaining(['organizations', 'schema_migrations']));
  });

  it('is idempotent: a second run applies nothing', async () => {
    expect(await migrateUp(db.sequelize)).toEqual([]);
  });

  it('can be rolled back to nothing and applied again', async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.down({ to: 0 });
    expect(await tables()).not.toContain('organizations');
    expect(await migrateUp(db.sequelize)).toEqual(migrations.map((m) => m.name));
    expect(await tables()).toContain('organizations');
  });

  it('names migrations by timestamp so they sort in the order they run', () => {
    const names = migrations.map((m) => m.name);
    expect(names.every((n) => /^\d{14}-[a-z0-9-]+$/.test(n))).toBe(true);
    expect([...names].sort()).toEqual(names);
  });
});
