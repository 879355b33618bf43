import type { InferAttributes } from 'sequelize';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultWidgetSettings } from '@wickstone/contracts';
import { createTestDatabase, type TestDatabase } from '../../testing/db.js';
import { seedOrgWithTeam } from '../../testing/fixtures.js';
import { createMigrator } from '../db/migrator.js';
import { Lead, Run, Widget } from '../db/models/index.js';
import { inventRun } from '../runs/invent.js';
import { rollupsFromRaw, storedRollups } from './rollups.js';
import { SITE, PORTAL } from '../../testing/usage.js';

const MIGRATION = '20261202020600-usage-rollups-and-retention';

/** A database that already held runs and leads when the rollups arrived: the migration counts them once. */
describe('the rollup migration', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  it('fills the rollups from the runs already stored', async () => {
    const migrator = createMigrator(db.sequelize);
    await migrator.down({ to: MIGRATION });
    // On the free plan: the billing tables come in a later migration than the one rolled back to.
    const org = await seedOrgWithTeam('Brackenridge Ground & Damp', { plan: 'bench' });
    const w = await Widget.create(
      {
        organizationId: org.id,
        publicKey: 'wk_backfill000000000001',
        name: 'Rising damp in a pore',
        calculatorId: 'tube-rise',
        status: 'live',
        allowedOrigins: [SITE],
        settings: defaultWidgetSettings(),
        release: '0.1.0',
      },
      // Only the columns the table had at that migration (later ones add more, e.g. the release pin).
      {
        fields: [
          'organizationId',
          'publicKey',
          'name',
          'calculatorId',
          'status',
          'allowedOrigins',
          'settings',
          'release',
        ],
      },
    );
    const rows = [0.0008, 0.004, 0.004, 0.03, 0.001].flatMap((diameter, i) =>
      [SITE, PORTAL].map((origin, j) =>
        inventRun(
          w,
          { diameter },
          {
            id: randomUUID(),
            origin,
            agreed: (i + j) % 3 !== 0,
            createdAt: new Date(Date.UTC(2026, 9, 1 + (i % 2), 10 + j)),
          },
        ),
      ),
    );
    // Straight into the table, as the code before the rollups stored them.
    await Run.bulkCreate(rows, {
      fields: Object.keys(rows[0]!).filter((k) => k !== 'sheetProject') as (keyof InferAttributes<Run>)[],
    });
    await Lead.create({
      organizationId: org.id,
      widgetId: w.id,
      runId: rows[1]!.id,
      name: 'Hester Quayle',
      consentText: 'I agree that the firm may contact me about this request.',
      consentAt: new Date(),
      origin: SITE,
      sendCopy: false,
    });
    expect(await migrator.up({ to: MIGRATION })).toEqual([expect.objectContaining({ name: MIGRATION })]);
    const stored = await storedRollups(db.sequelize);
    expect(stored).toEqual(await rollupsFromRaw(db.sequelize));
    expect(stored.daily.reduce((n, d) => n + d.runs, 0)).toBe(rows.length);
    expect(stored.daily.reduce((n, d) => n + d.led, 0)).toBe(1);
    // 0.004 m bores on both days and a 0.03 m bore on the second, each from both sites.
    expect(stored.warnings.map((x) => [x.day, x.code, x.runs])).toEqual([
      ['2026-10-01', 'BORE_NOT_SMALL', 2],
      ['2026-10-02', 'BORE_NOT_SMALL', 2],
      ['2026-10-02', 'BORE_TOO_WIDE', 2],
    ]);
  });
});
