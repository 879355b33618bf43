import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { plans } from '@wickstone/contracts';
import { createTestApp, seedOrgWithTeam, TestClient, type TestApp } from '../../testing/index.js';
import { liveWidget, reportRun, runAt, store, type FixtureWidget } from '../../testing/usage.js';
import { BillingAccount } from '../db/models/index.js';
import { accountRow } from '../billing/plan.js';

/*
 * Runs past the plan's monthly allowance are stored marked. The ingest inserts them marked as the
 * last batch's counts predict, and puts right in the same transaction what the counts read after the
 * insert say otherwise: runs stored by someone else meanwhile (more marks), a larger plan (fewer).
 */
describe('runs past the monthly allowance', () => {
  let t: TestApp;
  let orgId: number;
  let w: FixtureWidget;
  const allowance = plans.bench.limits.runsPerMonth;

  beforeAll(async () => {
    t = await createTestApp();
    const org = await seedOrgWithTeam(undefined, { plan: 'bench' });
    orgId = org.id;
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    w = await liveWidget(owner, org.id, 'Wall damp', 'tube-rise');
  });
  afterAll(() => t.close());

  const marked = async (): Promise<string[]> =>
    (
      await t.db.sequelize.query<{ id: string }>(
        'SELECT id FROM runs WHERE organization_id = ? AND over_allowance = 1 ORDER BY created_at, id',
        { replacements: [orgId], type: QueryTypes.SELECT },
      )
    ).map((r) => r.id);
  const report = () => reportRun(t.app, w, { diameter: 0.001 });
  const seed = (n: number) =>
    store(
      t.db.sequelize,
      Array.from({ length: n }, () => runAt(w, new Date().toISOString(), { diameter: 0.001 })),
    );

  it('marks exactly the runs past it, predicted or not, and unmarks them when the plan grows', async () => {
    // Stored behind the ingest's back: its first batch has nothing to predict from.
    await seed(allowance - 5);
    await report();
    expect(await marked()).toEqual([]);
    // More stored behind its back: this report is predicted under the allowance but is past it.
    await seed(4);
    const corrected = await report();
    expect(await marked()).toEqual([corrected]);
    // Predicted past it, and past it: inserted marked.
    const predicted = [await report(), await report()];
    expect(await marked()).toEqual([corrected, ...predicted]);
    // A larger plan: the next run is predicted past the old allowance but is well within the new one.
    await BillingAccount.create(accountRow(orgId, { plan: 'office', status: 'active' }));
    const within = await report();
    expect(await marked()).toEqual([corrected, ...predicted]);
    expect(await marked()).not.toContain(within);
  });
});
