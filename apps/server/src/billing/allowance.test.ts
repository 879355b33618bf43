import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { BillingAccount, Organization } from '../db/models/index.js';
import { createTestDatabase, type TestDatabase } from '../../testing/db.js';
import { seedOrgWithTeam } from '../../testing/fixtures.js';
import { accountsStatement, allowancesOf, type AccountRow } from './allowance.js';
import { standingFor } from './plan.js';

/*
 * The ingest reads each organisation's billing row inside a batch's transaction instead of the
 * allowance hook reading it afterwards: both must give the same monthly allowance.
 */
describe('allowances read with a batch', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(async () => db?.drop());

  it('gives every organisation the allowance its standing gives, with and without a billing row', async () => {
    const office = await seedOrgWithTeam(undefined, { plan: 'office' });
    const field = await seedOrgWithTeam(undefined, { plan: 'field' });
    const lapsed = await seedOrgWithTeam(undefined, { plan: 'field' });
    await BillingAccount.update({ status: 'unpaid' }, { where: { organizationId: lapsed.id } });
    const none = await Organization.create({ name: 'Tarn & Scree Surveys', slug: 'tarn-scree' });
    await BillingAccount.destroy({ where: { organizationId: none.id } });

    const ids = [office.id, field.id, lapsed.id, none.id];
    const { sql, values } = accountsStatement(ids);
    const rows = await db.sequelize.query<AccountRow>(sql, { replacements: values, type: QueryTypes.SELECT });
    const folded = allowancesOf(ids, rows);
    const expected = new Map(
      await Promise.all(
        ids.map(async (id) => [id, (await standingFor(id)).plan.limits.runsPerMonth] as const),
      ),
    );
    expect(folded).toEqual(expected);
    // Three different plans in play, so a mix-up between organisations would show.
    expect(new Set(expected.values()).size).toBe(3);
  });
});
