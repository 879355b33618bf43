// The retention purge of a month at 1,000,000 runs, before and after, in one run: an organisation
// keeping 11 months of a seeded year (seed-runs.ts) loses its oldest month by the previous design
// (chunks of runs read into the server, uncounted from the rollups run by run, deleted by id: kept
// here as the baseline), then, keeping 10 months, the next month by the service's purge (a UTC day
// per transaction: one range DELETE of the runs and the day's rollup rows deleted whole). Prints
// both times and rates and their ratio, and checks the rollups still add up to the runs left.
// This deletes two months: the next seed-runs.ts run finds fewer runs than asked and seeds again.
// Run: npx tsx apps/server/bench/purge.ts [--db wst_bench_usage]
import { QueryTypes, type Sequelize } from 'sequelize';
import { Run } from '../src/db/models/index.js';
import { createRetentionService, retentionCutoff } from '../src/retention/service.js';
import { retryOnDeadlock } from '../src/runs/store.js';
import { removeRuns, ROLLUP_COLUMNS, rollupRunOf, type RollupColumnsRow } from '../src/usage/rollups.js';
import { benchOrganization, openBenchDatabase, seconds } from './common.js';

/** The previous design of the runs' purge, run by run through the server (the baseline). */
async function purgeRunByRun(sequelize: Sequelize, orgId: number, cutoff: Date, chunk: number) {
  let total = 0;
  for (;;) {
    const n = await retryOnDeadlock(() =>
      sequelize.transaction(async (transaction) => {
        const rows = await sequelize.query<RollupColumnsRow & { id: string }>(
          `SELECT r.id, ${ROLLUP_COLUMNS} FROM runs r WHERE r.organization_id = ? AND r.created_at < ?
           ORDER BY r.created_at, r.id LIMIT ${chunk} FOR UPDATE`,
          { replacements: [orgId, cutoff], type: QueryTypes.SELECT, transaction },
        );
        if (!rows.length) return 0;
        const ids = rows.map((r) => r.id);
        await removeRuns(sequelize, rows.map(rollupRunOf), transaction);
        for (const sql of [
          'UPDATE leads SET run_id = NULL WHERE organization_id = ? AND run_id IN (?)',
          'DELETE FROM runs WHERE organization_id = ? AND id IN (?)',
        ])
          await sequelize.query(sql, { replacements: [orgId, ids], type: QueryTypes.UPDATE, transaction });
        return rows.length;
      }),
    );
    total += n;
    if (n < chunk) return total;
  }
}

const { sequelize, config } = await openBenchDatabase();
try {
  const org = await benchOrganization();
  if (!org) throw new Error('no benchmark organisation: run bench/seed-runs.ts first');
  const count = () => Run.count({ where: { organizationId: org.id } });
  const before = await count();
  const now = new Date();
  const chunk = config.retention.chunkSize;

  const oldCutoff = retentionCutoff(11, now);
  let t0 = performance.now();
  const oldRuns = await purgeRunByRun(sequelize, org.id, oldCutoff, chunk);
  const oldMs = performance.now() - t0;

  const newCutoff = retentionCutoff(10, now);
  const retention = createRetentionService({ sequelize, chunkSize: chunk });
  t0 = performance.now();
  const purged = await retention.purgeOrganization(org.id, 10, now);
  const newMs = performance.now() - t0;

  const after = await count();
  const [sums] = await sequelize.query<{ n: string | number }>(
    'SELECT COALESCE(SUM(runs), 0) AS n FROM run_daily WHERE organization_id = ?',
    { replacements: [org.id], type: QueryTypes.SELECT },
  );
  const rate = (n: number, ms: number) => Math.round(n / (ms / 1000));
  const day = (d: Date) => d.toISOString().slice(0, 10);
  console.log(`retention purge of a month at ${before.toLocaleString('en')} runs:`);
  console.log(
    `  before (run by run, chunks of ${chunk}), runs before ${day(oldCutoff)}: ${oldRuns.toLocaleString('en')} runs in ${seconds(oldMs)} (${rate(oldRuns, oldMs).toLocaleString('en')} runs/s)`,
  );
  console.log(
    `  after (a UTC day per range DELETE), runs before ${day(newCutoff)}: ${purged.runs.toLocaleString('en')} runs and ${purged.leads.toLocaleString('en')} requests in ${seconds(newMs)} (${rate(purged.runs, newMs).toLocaleString('en')} runs/s); ${(rate(purged.runs, newMs) / rate(oldRuns, oldMs)).toFixed(1)}× the rate before`,
  );
  console.log(
    `  rollups after both: ${Number(sums?.n).toLocaleString('en')} runs counted, ${after.toLocaleString('en')} runs left (${Number(sums?.n) === after ? 'equal' : 'NOT EQUAL'})`,
  );
  if (Number(sums?.n) !== after) process.exitCode = 1;
} finally {
  await sequelize.close();
}
