import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { retentionSchema } from '@wickstone/contracts';
import { createLogger } from '../logger.js';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { storeLeadsForRuns, type RunRow } from '../runs/store.js';
import { fieldsOf, liveWidget, runAt, store, type FixtureWidget } from '../../testing/usage.js';
import { rollupsFromRaw, storedRollups } from '../usage/rollups.js';
import { startRetentionSchedule } from './schedule.js';
import { createRetentionService, retentionCutoff, type RetentionService } from './service.js';

const DAY = 86_400_000;

describe('retention cutoff', () => {
  it.each([
    [3, '2026-12-01T20:00:00Z', '2026-09-01T00:00:00.000Z'],
    [12, '2026-12-01T00:00:00Z', '2025-12-01T00:00:00.000Z'],
    [1, '2026-03-31T10:00:00Z', '2026-02-28T00:00:00.000Z'],
    [1, '2024-03-31T10:00:00Z', '2024-02-29T00:00:00.000Z'],
    [120, '2026-01-15T23:59:59Z', '2016-01-15T00:00:00.000Z'],
  ])('keeping %i months on %s purges what is older than %s', (months, now, cutoff) => {
    expect(retentionCutoff(months, new Date(now)).toISOString()).toBe(cutoff);
  });
});

describe('retention', () => {
  let t: TestApp;
  let a: FixtureOrg;
  let b: FixtureOrg;
  let admin: TestClient;
  let analyst: TestClient;
  let wa: FixtureWidget;
  let wb: FixtureWidget;
  let retention: RetentionService;

  beforeAll(async () => {
    t = await createTestApp();
    a = await seedOrgWithTeam('Brackenridge Ground & Damp');
    b = await seedOrgWithTeam('Fenwick Clay Testing');
    retention = createRetentionService({ sequelize: t.db.sequelize, chunkSize: 3 });
    admin = new TestClient(t.app);
    await admin.login(a.users.admin.email, a.users.admin.password);
    analyst = new TestClient(t.app);
    await analyst.login(a.users.analyst.email, a.users.analyst.password);
    wa = await liveWidget(admin, a.id, 'Rising damp in a pore', 'tube-rise');
    const bOwner = new TestClient(t.app);
    await bOwner.login(b.users.owner.email, b.users.owner.password);
    wb = await liveWidget(bOwner, b.id, 'Fenwick tube', 'tube-rise');
  });
  afterAll(() => t.close());

  describe('the setting', () => {
    it('keeps everything until an owner or admin chooses a period, which every member can read', async () => {
      expect((await analyst.get(`/orgs/${a.id}/settings/retention`).expect(200)).body).toEqual({
        months: null,
        cutoff: null,
      });
      const set = retentionSchema.parse(
        (await admin.patch(`/orgs/${a.id}/settings/retention`, { months: 6 }).expect(200)).body,
      );
      expect(set.months).toBe(6);
      expect(set.cutoff).toBe(retentionCutoff(6, new Date()).toISOString());
      expect((await analyst.get(`/orgs/${a.id}/settings/retention`).expect(200)).body).toMatchObject({
        months: 6,
      });
      await analyst.patch(`/orgs/${a.id}/settings/retention`, { months: 1 }).expect(403);
      expect(
        (await admin.patch(`/orgs/${a.id}/settings/retention`, { months: null }).expect(200)).body,
      ).toEqual({ months: null, cutoff: null });
    });

    it('names a period outside 1 to 120 whole months', async () => {
      for (const body of [{ months: 0 }, { months: 121 }, { months: 1.5 }, { months: '6' }, {}]) {
        expect(
          fieldsOf((await admin.patch(`/orgs/${a.id}/settings/retention`, body).expect(400)).body),
          JSON.stringify(body),
        ).toEqual(['body.months']);
      }
      expect(
        fieldsOf(
          (await admin.patch(`/orgs/${a.id}/settings/retention`, { months: 3, days: 2 }).expect(400)).body,
        ),
      ).toEqual(['body.days']);
    });
  });

  describe('the purge', () => {
    it('deletes runs and leads older than the period, per organisation, keeping the rollups equal to what is left', async () => {
      const now = new Date();
      const ago = (days: number) => new Date(now.getTime() - days * DAY).toISOString();
      const old = [
        runAt(wa, ago(200), { diameter: 0.004 }),
        runAt(wa, ago(120), { diameter: 0.0008 }),
        ...Array.from({ length: 7 }, (_, i) => runAt(wa, ago(150 + i), { diameter: 0.03 })),
      ];
      const recent = [runAt(wa, ago(30), { diameter: 0.004 }), runAt(wa, ago(1), { diameter: 0.0008 })];
      const theirs = [runAt(wb, ago(300), { diameter: 0.004 }), runAt(wb, ago(2), { diameter: 0.0008 })];
      await store(t.db.sequelize, [...old, ...recent, ...theirs]);
      const leadFor = (run: RunRow, daysAgo: number, name: string) => ({
        lead: {
          organizationId: run.organizationId,
          widgetId: run.widgetId,
          runId: run.id,
          name,
          email: 'hester.quayle@mail.example',
          consentText: 'I agree that the firm may contact me about this request.',
          consentAt: new Date(ago(daysAgo)),
          origin: run.origin,
          sendCopy: false,
          createdAt: new Date(ago(daysAgo)),
        },
        run,
      });
      await t.db.sequelize.transaction((tx) =>
        storeLeadsForRuns(
          t.db.sequelize,
          [
            leadFor(old[0]!, 199, 'Old request'), // older than three months: goes with its run
            leadFor(old[1]!, 10, 'Late request'), // the run goes, this lead is recent: stays, unlinked
            leadFor(recent[0]!, 29, 'Recent request'),
            leadFor(theirs[0]!, 299, 'Their old request'),
          ],
          tx,
        ),
      );
      await admin.patch(`/orgs/${a.id}/settings/retention`, { months: 3 }).expect(200);
      const before = await storedRollups(t.db.sequelize);
      expect(before).toEqual(await rollupsFromRaw(t.db.sequelize));

      const result = await retention.purgeAll(now);
      expect(result).toEqual({ organizations: 1, runs: old.length, leads: 1 });

      const runsLeft = await t.db.sequelize.query<{ id: string }>('SELECT id FROM runs ORDER BY id', {
        type: QueryTypes.SELECT,
      });
      expect(runsLeft.map((r) => r.id)).toEqual([...recent, ...theirs].map((r) => r.id).sort());
      const leadsLeft = await t.db.sequelize.query<{ name: string; run_id: string | null }>(
        'SELECT name, run_id FROM leads ORDER BY name',
        { type: QueryTypes.SELECT },
      );
      expect(leadsLeft).toEqual([
        { name: 'Late request', run_id: null },
        { name: 'Recent request', run_id: recent[0]!.id },
        { name: 'Their old request', run_id: theirs[0]!.id },
      ]);
      expect(await storedRollups(t.db.sequelize)).toEqual(await rollupsFromRaw(t.db.sequelize));
      // The other organisation kept no period, so its year-old run and request are still there.
      const theirRollups = (await storedRollups(t.db.sequelize)).daily.filter(
        (d) => d.organization_id === b.id,
      );
      expect(theirRollups.map((d) => d.runs)).toEqual([1, 1]);

      // Nothing more to do the second time.
      expect(await retention.purgeAll(now)).toEqual({ organizations: 1, runs: 0, leads: 0 });
    });

    it('cuts at the UTC midnight to the millisecond, each day of runs going with its rollup rows', async () => {
      const c = await seedOrgWithTeam('Quayle Moisture Surveys');
      const owner = new TestClient(t.app);
      await owner.login(c.users.owner.email, c.users.owner.password);
      const w = await liveWidget(owner, c.id, 'Quayle tube', 'tube-rise');
      const now = new Date('2026-11-20T15:00:00Z');
      const cutoff = retentionCutoff(2, now).getTime();
      const at = (ms: number) => new Date(cutoff + ms).toISOString();
      const gone = [
        runAt(w, at(-1), { diameter: 0.004 }),
        runAt(w, at(-DAY + 1), { diameter: 0.03 }),
        runAt(w, at(-3 * DAY), { diameter: 0.0008 }),
      ];
      const kept = [runAt(w, at(0), { diameter: 0.004 }), runAt(w, at(DAY - 1), { diameter: 0.03 })];
      await store(t.db.sequelize, [...gone, ...kept]);
      const ours = async () =>
        (await storedRollups(t.db.sequelize)).daily.filter((d) => d.organization_id === c.id);
      expect((await ours()).map((d) => [d.day, d.runs])).toEqual([
        [at(-3 * DAY).slice(0, 10), 1],
        [at(-1).slice(0, 10), 2],
        [at(0).slice(0, 10), 2],
      ]);

      expect(await retention.purgeOrganization(c.id, 2, now)).toEqual({ runs: 3, leads: 0 });
      const left = await t.db.sequelize.query<{ id: string }>(
        'SELECT id FROM runs WHERE organization_id = ? ORDER BY created_at',
        { replacements: [c.id], type: QueryTypes.SELECT },
      );
      expect(left.map((r) => r.id)).toEqual(kept.map((r) => r.id));
      expect((await ours()).map((d) => [d.day, d.runs])).toEqual([[at(0).slice(0, 10), 2]]);
      expect(await storedRollups(t.db.sequelize)).toEqual(await rollupsFromRaw(t.db.sequelize));
    });

    it('runs on a timer that can be stopped', async () => {
      let calls = 0;
      const counting: RetentionService = {
        ...retention,
        purgeAll: async () => {
          calls += 1;
          return { organizations: 0, runs: 0, leads: 0 };
        },
      };
      const schedule = startRetentionSchedule(counting, createLogger(t.db.config), {
        firstDelayMs: 0,
        intervalMs: 10,
      });
      await new Promise((r) => setTimeout(r, 100));
      schedule.stop();
      const seen = calls;
      expect(seen).toBeGreaterThanOrEqual(2);
      await new Promise((r) => setTimeout(r, 50));
      expect(calls).toBe(seen);
    });
  });
});
