// The runs CSV export of a whole year at 1,000,000 runs (seed first with seed-runs.ts; npm run bench
// does), read the way the API streams it: chunks of EXPORT_CHUNK rows in keyset order. Prints the
// rate, the first and last chunks' times side by side (a linear export keeps them alike; the old
// quadratic one grew with every chunk) and the heap over the export (flat when nothing accumulates).
// Run: npx tsx apps/server/bench/export.ts [--db wst_bench_usage]
import { runExportQuerySchema } from '@wickstone/contracts';
import { createRunService, EXPORT_CHUNK } from '../src/runs/service.js';
import { addDays, todayUtc } from '../src/usage/days.js';
import { benchOrganization, openBenchDatabase, seconds } from './common.js';

const { sequelize } = await openBenchDatabase();
try {
  const org = await benchOrganization();
  if (!org) throw new Error('no benchmark organisation: run bench/seed-runs.ts first');
  const to = todayUtc();
  const from = addDays(to, -365);
  const runs = createRunService({ sequelize });
  const chunkMs: number[] = [];
  const heapMb: number[] = [];
  let rows = 0;
  let bytes = 0;
  const t0 = performance.now();
  let t = t0;
  for await (const part of runs.exportCsv(org.id, runExportQuerySchema.parse({ from, to }))) {
    const now = performance.now();
    chunkMs.push(now - t);
    t = now;
    bytes += Buffer.byteLength(part);
    // Rows are lines; the header is the first.
    for (let i = part.indexOf('\n'); i !== -1; i = part.indexOf('\n', i + 1)) rows += 1;
    if (chunkMs.length % 50 === 1) heapMb.push(process.memoryUsage().heapUsed / 2 ** 20);
  }
  const ms = performance.now() - t0;
  rows -= 1;
  const avg = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const first = avg(chunkMs.slice(1, 21));
  const last = avg(chunkMs.slice(-21, -1));
  console.log(
    `export ${from} … ${to}: ${rows.toLocaleString('en')} runs, ${(bytes / 2 ** 20).toFixed(0)} MiB of CSV in ${seconds(ms)}: ${Math.round(rows / (ms / 1000)).toLocaleString('en')} rows/s (goal 20,000)`,
  );
  console.log(
    `  chunks of ${EXPORT_CHUNK}: first 20 ${first.toFixed(1)} ms each, last 20 ${last.toFixed(1)} ms each (ratio ${(last / first).toFixed(2)}; 1 is linear)`,
  );
  console.log(
    `  heap while exporting: ${Math.min(...heapMb).toFixed(0)}–${Math.max(...heapMb).toFixed(0)} MiB over ${heapMb.length} samples`,
  );
} finally {
  await sequelize.close();
}
