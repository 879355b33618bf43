// The retention purge of the oldest month at 1,000,000 runs: an organisation keeping 11 months of a
// seeded year (seed-runs.ts) loses its first month, chunk by chunk with the rollups kept equal.
// This deletes that month: the next seed-runs.ts run finds fewer runs than asked and seeds again.
// Run: npx tsx apps/server/bench/purge.ts [--db wst_bench_usage]
import { Run } from '../src/db/models/index.js';
import { createRetentionService, retentionCutoff } from '../src/retention/service.js';
import { benchOrganization, openBenchDatabase, seconds } from './common.js';

const { sequelize, config } = await openBenchDatabase();
try {
  const org = await benchOrganization();
  if (!org) throw new Error('no benchmark organisation: run bench/seed-runs.ts first');
  const before = await Run.count({ where: { organizationId: org.id } });
  const now = new Date();
  const retention = createRetentionService({ sequelize, chunkSize: config.retention.chunkSize });
  const t0 = performance.now();
  const purged = await retention.purgeOrganization(org.id, 11, now);
  const ms = performance.now() - t0;
  console.log(
    `purge before ${retentionCutoff(11, now).toISOString().slice(0, 10)} of ${before.toLocaleString('en')} runs: ${purged.runs.toLocaleString('en')} runs and ${purged.leads.toLocaleString('en')} leads in ${seconds(ms)} (${Math.round(purged.runs / (ms / 1000)).toLocaleString('en')} runs/s, chunks of ${config.retention.chunkSize})`,
  );
} finally {
  await sequelize.close();
}
