// The runs CSV export of a whole year at 1,000,000 runs (seed first with seed-runs.ts; npm run bench
// does), read the way the API streams it: chunks of EXPORT_CHUNK rows in keyset order. Against a
// baseline in the same run: one plain SELECT of the same columns of the same rows, streamed row by
// row to /dev/null with nothing formatted. Prints both rates and their ratio, the first and last
// chunks' times side by side (a linear export keeps them alike; the old quadratic one grew with
// every chunk) and the heap over the export (flat when nothing accumulates).
// Run: npx tsx apps/server/bench/export.ts [--db wst_bench_usage]
import { createWriteStream } from 'node:fs';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Connection } from 'mariadb';
import { runExportQuerySchema } from '@wickstone/contracts';
import { QueryTypes } from 'sequelize';
import { createRunService, EXPORT_CHUNK, exportChunkQuery } from '../src/runs/service.js';
import { addDays, todayUtc } from '../src/usage/days.js';
import { benchOrganization, openBenchDatabase, seconds } from './common.js';

const { sequelize } = await openBenchDatabase();
const rate = (rows: number, ms: number) => rows / (ms / 1000);
const perS = (x: number) => `${Math.round(x).toLocaleString('en')} rows/s`;
const mib = (bytes: number) => `${(bytes / 2 ** 20).toFixed(0)} MiB`;

try {
  const org = await benchOrganization();
  if (!org) throw new Error('no benchmark organisation: run bench/seed-runs.ts first');
  const to = todayUtc();
  const from = addDays(to, -365);
  const filters = runExportQuerySchema.parse({ from, to });

  /** The baseline: the same rows and columns, one streamed SELECT, each row's values to /dev/null. */
  async function plainSelect(): Promise<{ rows: number; ms: number }> {
    // The export's own chunk query without its LIMIT: every row in one statement.
    const q = exportChunkQuery(org!.id, filters, null);
    const conn = (await sequelize.connectionManager.getConnection({
      type: 'SELECT',
    } as never)) as unknown as Connection;
    let rows = 0;
    const t0 = performance.now();
    try {
      await pipeline(
        conn.queryStream(q.sql.replace(/LIMIT \d+\s*$/, ''), q.params),
        new Transform({
          writableObjectMode: true,
          transform(row: Record<string, unknown>, _enc, done) {
            rows += 1;
            done(null, `${Object.values(row).join(',')}\n`);
          },
        }),
        createWriteStream('/dev/null'),
      );
    } finally {
      sequelize.connectionManager.releaseConnection(conn as never);
    }
    return { rows, ms: performance.now() - t0 };
  }

  async function exportCsv() {
    const runs = createRunService({ sequelize });
    const chunkMs: number[] = [];
    const heap: number[] = [];
    let rows = 0;
    let bytes = 0;
    const t0 = performance.now();
    let t = t0;
    for await (const part of runs.exportCsv(org!.id, filters)) {
      const now = performance.now();
      chunkMs.push(now - t);
      t = now;
      bytes += Buffer.byteLength(part);
      // Rows are lines; the header is the first.
      for (let i = part.indexOf('\n'); i !== -1; i = part.indexOf('\n', i + 1)) rows += 1;
      heap.push(process.memoryUsage().heapUsed);
    }
    return { rows: rows - 1, bytes, ms: performance.now() - t0, chunkMs, heap };
  }

  /** What the optimizer does with a chunk from the middle of the year (ANALYZE runs it). */
  async function plan(): Promise<string> {
    const mid = new Date((Date.parse(`${from}T00:00:00Z`) + Date.parse(`${to}T00:00:00Z`)) / 2);
    const q = exportChunkQuery(org!.id, filters, [mid.toISOString().replace('T', ' ').replace('Z', ''), 'f']);
    const [row] = await sequelize.query<{ ANALYZE: string }>(`ANALYZE FORMAT=JSON ${q.sql}`, {
      replacements: q.params,
      type: QueryTypes.SELECT,
    });
    const block = JSON.parse(row!.ANALYZE).query_block;
    const t = block.nested_loop?.[0]?.table ?? block.table;
    return `${t.access_type} on ${t.key} (${t.used_key_parts.join(', ')}), ${t.r_rows} rows read for ${EXPORT_CHUNK} returned, ${t.r_engine_stats?.pages_read_count ?? 0} pages read from disk, ${Number(block.r_total_time_ms).toFixed(0)} ms`;
  }

  const base = await plainSelect();
  const ex = await exportCsv();
  const avg = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const first = avg(ex.chunkMs.slice(1, 21));
  const last = avg(ex.chunkMs.slice(-21, -1));
  const tenth = Math.max(1, Math.floor(ex.heap.length / 10));
  console.log(`export ${from} … ${to} of ${ex.rows.toLocaleString('en')} runs (${mib(ex.bytes)} of CSV):`);
  console.log(
    `  plain SELECT to /dev/null: ${base.rows.toLocaleString('en')} rows in ${seconds(base.ms)}, ${perS(rate(base.rows, base.ms))}`,
  );
  console.log(
    `  CSV export:                ${ex.rows.toLocaleString('en')} rows in ${seconds(ex.ms)}, ${perS(rate(ex.rows, ex.ms))} (goal 20,000); ratio to the plain SELECT ${(rate(ex.rows, ex.ms) / rate(base.rows, base.ms)).toFixed(2)}`,
  );
  console.log(`  a chunk from the middle, ANALYZE FORMAT=JSON: ${await plan()}`);
  console.log(
    `  chunks of ${EXPORT_CHUNK}: first 20 ${first.toFixed(1)} ms each, last 20 ${last.toFixed(1)} ms each (ratio ${(last / first).toFixed(2)}; 1 is linear)`,
  );
  console.log(
    `  heap after each chunk: peak ${mib(Math.max(...ex.heap))}, first tenth of the export peak ${mib(Math.max(...ex.heap.slice(0, tenth)))}, last tenth peak ${mib(Math.max(...ex.heap.slice(-tenth)))} (flat when alike)`,
  );
} finally {
  await sequelize.close();
}
