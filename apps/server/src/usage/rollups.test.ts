import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { createRetentionService } from '../retention/service.js';
import { seededRandom } from '../runs/invent.js';
import {
  liveWidget,
  PORTAL,
  reportRun,
  requestAssessment,
  runAt,
  SITE,
  store,
  type FixtureWidget,
} from '../../testing/usage.js';
import { rollupsFromRaw, storedRollups } from './rollups.js';

const INPUTS: Record<string, Record<string, number | string>[]> = {
  'tube-rise': [
    { diameter: 0.0008 },
    { diameter: 0.004 },
    { diameter: 0.03 },
    { diameter: 0.001, temperatureC: 5 },
  ],
  'soil-capillary-rise': [
    { d10: 0.0001, waterTableDepth: 1 },
    { d10: 0.00002, waterTableDepth: 0.5 },
    { d10: 0.0006, waterTableDepth: 3 },
  ],
  'slot-rise': [{ gap: 0.001 }, { gap: 0.01 }],
};
const ORIGINS = [SITE, PORTAL, 'https://partners.brackenridge-ground.example'];

/*
 * The rollups after a random history of everything that changes them: runs stored in bulk and
 * reported one by one (some at the same moment), requests for assessments linking leads to runs,
 * erasures unlinking them, and purges deleting old runs and leads in small chunks. After each step
 * the rollup tables must equal a plain GROUP BY over the raw runs, row for row.
 */
describe('rollups against the raw runs', () => {
  let t: TestApp;
  let a: FixtureOrg;
  let b: FixtureOrg;
  let widgets: FixtureWidget[];
  let analysts: Map<number, TestClient>;
  const SEED = 20261202;
  // The same "random" history every run, and another one by changing the seed.
  const rnd = seededRandom(SEED);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;

  const count = async (sql: string, replacements: unknown[] = []) =>
    Number(
      (
        await t.db.sequelize.query<{ n: number | string | null }>(sql, {
          replacements,
          type: QueryTypes.SELECT,
        })
      )[0]?.n ?? 0,
    );

  async function expectEqualToRaw(step: string) {
    const [stored, raw] = await Promise.all([storedRollups(t.db.sequelize), rollupsFromRaw(t.db.sequelize)]);
    expect(stored.daily, `${step} (seed ${SEED})`).toEqual(raw.daily);
    expect(stored.warnings, `${step} (seed ${SEED})`).toEqual(raw.warnings);
  }

  beforeAll(async () => {
    t = await createTestApp({ LEAD_LIMIT_PER_IP: '100000', LEAD_LIMIT_PER_WIDGET: '100000' });
    a = await seedOrgWithTeam('Brackenridge Ground & Damp');
    b = await seedOrgWithTeam('Fenwick Clay Testing');
    analysts = new Map();
    widgets = [];
    for (const [org, calcs] of [
      [a, ['tube-rise', 'soil-capillary-rise', 'slot-rise']],
      [b, ['tube-rise']],
    ] as const) {
      const owner = new TestClient(t.app);
      await owner.login(org.users.owner.email, org.users.owner.password);
      for (const c of calcs) widgets.push(await liveWidget(owner, org.id, `${c} of ${org.name}`, c, ORIGINS));
      const analyst = new TestClient(t.app);
      await analyst.login(org.users.analyst.email, org.users.analyst.password);
      analysts.set(org.id, analyst);
    }
  });
  afterAll(() => t.close());

  it('stay equal to a GROUP BY over the raw runs through random inserts, leads, erasures and purges', async () => {
    const retention = createRetentionService({ sequelize: t.db.sequelize, chunkSize: 7 });
    const now = Date.now();
    for (let round = 1; round <= 8; round++) {
      // Bulk-stored runs over the last five months, as the demo seed and the benchmark store them.
      const batch = Array.from({ length: 10 + Math.floor(rnd() * 50) }, () => {
        const w = pick(widgets);
        const at = new Date(now - Math.floor(rnd() * 150 * 86_400_000)).toISOString();
        return runAt(w, at, pick(INPUTS[w.calculatorId]!), { origin: pick(ORIGINS), agreed: rnd() > 0.1 });
      });
      await store(t.db.sequelize, batch);
      await expectEqualToRaw(`round ${round}: bulk insert`);

      // Reports through the embed API, several at once for the same widget and day (same rollup row).
      const w = pick(widgets);
      const reported = await Promise.all(
        Array.from({ length: 6 }, () => reportRun(t.app, w, pick(INPUTS[w.calculatorId]!), pick(ORIGINS))),
      );
      await expectEqualToRaw(`round ${round}: concurrent reports`);

      // Requests for assessments on some runs that have none yet: always the oldest (so purges meet
      // leads newer than their runs) and one just reported, and a few at random.
      const free = await t.db.sequelize.query<{ id: string; widget_id: number; origin: string }>(
        'SELECT r.id, r.widget_id, r.origin FROM runs r WHERE NOT EXISTS (SELECT 1 FROM leads l WHERE l.run_id = r.id) ORDER BY r.created_at, r.id',
        { type: QueryTypes.SELECT },
      );
      const asked = new Set([
        ...free.slice(0, 1),
        ...free.filter((r) => reported.includes(r.id)).slice(0, 1),
        ...free.filter(() => rnd() < 0.02),
      ]);
      for (const run of asked) {
        const widget = widgets.find((x) => x.id === run.widget_id)!;
        await requestAssessment(
          t.app,
          widget,
          run.id,
          { name: 'Priya Venn', email: 'priya.venn@homes.example' },
          run.origin,
        );
      }
      await expectEqualToRaw(`round ${round}: leads`);

      // Erase some leads' personal data: their runs stay, unlinked.
      const leads = await t.db.sequelize.query<{ id: number; organization_id: number }>(
        'SELECT id, organization_id FROM leads WHERE run_id IS NOT NULL ORDER BY id',
        {
          type: QueryTypes.SELECT,
        },
      );
      for (const l of leads.filter(() => rnd() < 0.25)) {
        await analysts
          .get(l.organization_id)!
          .delete(`/orgs/${l.organization_id}/leads/${l.id}/personal-data`)
          .expect(200);
      }
      await expectEqualToRaw(`round ${round}: erasures`);

      // A purge of one organisation, keeping between one and five months.
      if (round % 2 === 0) {
        const org = pick([a, b]);
        const result = await retention.purgeOrganization(org.id, 1 + Math.floor(rnd() * 5), new Date(now));
        expect(result.runs + result.leads).toBeGreaterThanOrEqual(0);
        await expectEqualToRaw(`round ${round}: purge of ${org.name}`);
      }
    }
    // Last, both organisations keep one month only.
    for (const org of [a, b]) await retention.purgeOrganization(org.id, 1, new Date(now));
    await expectEqualToRaw('final purge');
    // The history did what it says: there were leads, erasures, purges and warnings to count.
    expect(await count('SELECT SUM(led) AS n FROM run_daily')).toBeGreaterThan(0);
    expect(await count('SELECT COUNT(*) AS n FROM leads WHERE erased_at IS NOT NULL')).toBeGreaterThan(0);
    expect(
      await count('SELECT COUNT(*) AS n FROM leads WHERE run_id IS NULL AND erased_at IS NULL'),
    ).toBeGreaterThan(0);
    expect(await count('SELECT COUNT(*) AS n FROM run_warning_daily')).toBeGreaterThan(0);
  }, 120_000);

  it('drops rollup rows that a purge leaves at zero', async () => {
    const retention = createRetentionService({ sequelize: t.db.sequelize, chunkSize: 5 });
    await retention.purgeOrganization(a.id, 1, new Date(Date.now() + 400 * 86_400_000));
    expect(await count('SELECT COUNT(*) AS n FROM run_daily WHERE organization_id = ?', [a.id])).toBe(0);
    expect(
      await t.db.sequelize.query('SELECT * FROM run_warning_daily WHERE organization_id = ?', {
        replacements: [a.id],
        type: QueryTypes.SELECT,
      }),
    ).toEqual([]);
    await expectEqualToRaw('after purging everything of one organisation');
  });
});
