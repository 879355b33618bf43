// The runs CSV export of a whole year at 1,000,000 runs (seed first with seed-runs.ts; npm run bench
// does), read the way the API streams it: chunks of EXPORT_CHUNK rows in keyset order. In one run,
// one after the other:
//  1. the baseline of the previous figures: one plain SELECT of the previous export's columns
//     (without its LIMIT) through Sequelize's connection, each row an object, streamed to /dev/null;
//  2. the same for the export's columns today, read as the export reads them (rows as arrays, no
//     casting), so what is left between it and the export is the export's own work;
//  3. the previous design of the export (kept below: Sequelize's query path, JSON_EXTRACT of the
//     outputs in the database, cells then csvRow);
//  4. the export as built (`createRunService(...).exportCsv`).
// Prints each rate and the ratios, the SHA-256 of both exports' bytes (they must be identical), the
// first and last chunks' times (a linear export keeps them alike), heap and RSS peaks over the first
// 100,000 rows and over all of them (flat when alike), and the plan of a chunk from the middle.
// BENCH_EXPORT_PREVIOUS=0 leaves out 1 and 3 (for a profile of the export alone).
// BENCH_EXPORT_ALTERNATE=<n> instead reads 3 and 4 in turns of n chunks each (a fairer ratio on a
// busy machine: a busy spell falls on both), timing each only while it is read, and compares hashes.
// Run: npx tsx apps/server/bench/export.ts [--db wst_bench_usage]
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { Transform, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Connection } from 'mariadb';
import { runExportQuerySchema, type RunFilters } from '@wickstone/contracts';
import { QueryTypes, type Sequelize } from 'sequelize';
import { Widget } from '../src/db/models/index.js';
import { keysetCsv } from '../src/export/csv.js';
import { EXPORT_COLUMNS, RUNS_CSV_HEADER } from '../src/export/runs.js';
import { runPrinter, valuesCell, type RunPrinter } from '../src/runs/present.js';
import { createRunService, EXPORT_CHUNK, exportChunkQuery } from '../src/runs/service.js';
import { addDays, todayUtc } from '../src/usage/days.js';
import { jsonValue } from '../src/usage/rollups.js';
import { benchOrganization, openBenchDatabase, seconds } from './common.js';

const { sequelize } = await openBenchDatabase();
const rate = (rows: number, ms: number) => rows / (ms / 1000);
const perS = (x: number) => `${Math.round(x).toLocaleString('en')} rows/s`;
const mib = (bytes: number) => `${(bytes / 2 ** 20).toFixed(0)} MiB`;
const withPrevious = process.env.BENCH_EXPORT_PREVIOUS !== '0';

/** The previous export's columns: the visitor's outputs taken out of their JSON by the database. */
const PREVIOUS_COLUMNS = `r.id, r.created_at, r.widget_id, r.calculator_id, r.origin, r.page_url, r.\`release\`, r.unit_system, r.inputs,
  JSON_EXTRACT(r.client_result, '$.outputs') AS outputs, r.warning_codes, r.agreed,
  (SELECT MIN(l.id) FROM leads l WHERE l.run_id = r.id AND l.organization_id = r.organization_id) AS lead_id`;
const previousChunkQuery = (orgId: number, f: RunFilters, cursor: [string, string] | null) => {
  const q = exportChunkQuery(orgId, f, cursor);
  return { sql: q.sql.replace(EXPORT_COLUMNS, PREVIOUS_COLUMNS), params: q.params };
};

interface PreviousRow {
  id: string;
  created_at: Date;
  widget_id: number;
  calculator_id: string;
  origin: string;
  page_url: string | null;
  release: string;
  unit_system: 'si' | 'us';
  inputs: unknown;
  outputs: unknown;
  warning_codes: unknown;
  agreed: number;
  lead_id: number | null;
}

/** The previous design of the export, as it was in runs/service.ts (the baseline of the change). */
async function* previousExport(orgId: number, f: RunFilters): AsyncGenerator<string> {
  const widgets = new Map(
    (
      await Widget.findAll({
        where: { organizationId: orgId },
        attributes: ['id', 'name', 'calculatorId', 'settings'],
      })
    ).map((w) => [w.id, w]),
  );
  const printers = new Map<string, RunPrinter>();
  const printerOf = (w: Widget | undefined, calculatorId: string, system: 'si' | 'us') => {
    const key = `${w?.id ?? ''}|${calculatorId}|${system}`;
    let p = printers.get(key);
    if (!p) printers.set(key, (p = runPrinter(calculatorId, w?.settings ?? { inputs: {} }, system)));
    return p;
  };
  yield* keysetCsv<PreviousRow, [string, string]>({
    header: RUNS_CSV_HEADER,
    chunk: EXPORT_CHUNK,
    page: (cursor) => {
      const q = previousChunkQuery(orgId, f, cursor);
      return sequelize.query<PreviousRow>(q.sql, { replacements: q.params, type: QueryTypes.SELECT });
    },
    cursor: (last) => [last.created_at.toISOString().replace('T', ' ').replace('Z', ''), last.id],
    cells: (rows) =>
      rows.map((row) => {
        const widgetId = Number(row.widget_id);
        const w = widgets.get(widgetId);
        const system = w?.settings.units.system ?? row.unit_system;
        const p = printerOf(w, row.calculator_id, system);
        return [
          row.created_at.toISOString(),
          row.id,
          widgetId,
          w?.name ?? `Widget ${row.widget_id}`,
          p.title,
          valuesCell(p.inputs(jsonValue<Record<string, number | string>>(row.inputs))),
          valuesCell(p.outputs(jsonValue<Record<string, number | null> | null>(row.outputs) ?? {})),
          system,
          jsonValue<string[]>(row.warning_codes).join(' '),
          row.origin,
          row.page_url,
          row.release,
          Boolean(Number(row.agreed)),
          row.lead_id === null ? null : Number(row.lead_id),
        ];
      }),
  });
}

async function withConnection<T>(db: Sequelize, use: (conn: Connection) => Promise<T>): Promise<T> {
  const pool = db.connectionManager as unknown as {
    getConnection(o: { type: 'SELECT' }): Promise<Connection>;
    releaseConnection(c: Connection): void;
  };
  const conn = await pool.getConnection({ type: 'SELECT' });
  try {
    return await use(conn);
  } finally {
    pool.releaseConnection(conn);
  }
}

/** A plain SELECT of a chunk query's rows without its LIMIT, every row's values joined and written to /dev/null. */
async function plainSelect(
  q: { sql: string; params: unknown[] },
  options: Record<string, unknown>,
): Promise<{ rows: number; ms: number }> {
  let rows = 0;
  const t0 = performance.now();
  await withConnection(sequelize, (conn) =>
    pipeline(
      conn.queryStream({ sql: q.sql.replace(/LIMIT \d+\s*$/, ''), ...options }, q.params),
      new Transform({
        writableObjectMode: true,
        transform(row: Record<string, unknown>, _enc, done) {
          rows += 1;
          done(null, `${Object.values(row).join(',')}\n`);
        },
      }),
      createWriteStream('/dev/null'),
    ),
  );
  return { rows, ms: performance.now() - t0 };
}

interface Measured {
  rows: number;
  bytes: number;
  ms: number;
  chunkMs: number[];
  sha256: string;
  /** Peaks over the first 100,000 rows and over the whole export, sampled after each chunk. */
  heap: { first: number; all: number };
  rss: { start: number; first: number; all: number };
}

/** Reads an export to the end as a download would, hashing its bytes, timing each chunk. */
async function measure(parts: AsyncIterable<string>): Promise<Measured> {
  const hash = createHash('sha256');
  const chunkMs: number[] = [];
  const heap = { first: 0, all: 0 };
  const rss = { start: process.memoryUsage.rss(), first: 0, all: 0 };
  let rows = -1; // the header is the first line
  let bytes = 0;
  const t0 = performance.now();
  let t = t0;
  await pipeline(
    parts,
    new Writable({
      decodeStrings: false,
      write(part: string, _enc, done) {
        const now = performance.now();
        chunkMs.push(now - t);
        t = now;
        const encoded = Buffer.from(part);
        hash.update(encoded);
        bytes += encoded.length;
        for (let i = part.indexOf('\n'); i !== -1; i = part.indexOf('\n', i + 1)) rows += 1;
        const m = process.memoryUsage();
        heap.all = Math.max(heap.all, m.heapUsed);
        rss.all = Math.max(rss.all, m.rss);
        if (rows <= 100_000) {
          heap.first = heap.all;
          rss.first = rss.all;
        }
        done();
      },
    }),
  );
  return { rows, bytes, ms: performance.now() - t0, chunkMs, sha256: hash.digest('hex'), heap, rss };
}

try {
  const org = await benchOrganization();
  if (!org) throw new Error('no benchmark organisation: run bench/seed-runs.ts first');
  const to = todayUtc();
  const from = addDays(to, -365);
  const filters = runExportQuerySchema.parse({ from, to });

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

  if (process.env.BENCH_EXPORT_ALTERNATE) {
    // Both designs over the same year at once, in turns of this many chunks each, so that a busy
    // spell on the shared machine falls on both: each is timed only while it is being read.
    const slice = Number(process.env.BENCH_EXPORT_ALTERNATE);
    const sides = [
      { label: 'CSV export, previous design:', parts: previousExport(org.id, filters) },
      { label: 'CSV export:', parts: createRunService({ sequelize }).exportCsv(org.id, filters) },
    ].map((x) => ({
      ...x,
      it: x.parts[Symbol.asyncIterator](),
      ms: 0,
      rows: -1,
      hash: createHash('sha256'),
      done: false,
    }));
    while (sides.some((x) => !x.done))
      for (const side of sides) {
        const t0 = performance.now();
        for (let k = 0; k < slice && !side.done; k++) {
          const next = await side.it.next();
          if (next.done) side.done = true;
          else {
            side.hash.update(Buffer.from(next.value));
            for (let i = next.value.indexOf('\n'); i !== -1; i = next.value.indexOf('\n', i + 1))
              side.rows += 1;
          }
        }
        side.ms += performance.now() - t0;
      }
    const [old, now] = sides as [(typeof sides)[0], (typeof sides)[0]];
    console.log(`export ${from} … ${to}, the two designs in turns of ${slice} chunks:`);
    for (const x of sides)
      console.log(
        `  ${x.label.padEnd(30)} ${x.rows.toLocaleString('en')} rows in ${seconds(x.ms)}, ${perS(rate(x.rows, x.ms))}`,
      );
    const [a, b] = [old.hash.digest('hex'), now.hash.digest('hex')];
    console.log(
      `  ratio ${(rate(now.rows, now.ms) / rate(old.rows, old.ms)).toFixed(2)}; SHA-256 ${b}${a === b ? ' (identical)' : ` DIFFERS from ${a}`}`,
    );
    if (a !== b) process.exitCode = 1;
    process.exit();
  }

  const basePrevious = withPrevious ? await plainSelect(previousChunkQuery(org.id, filters, null), {}) : null;
  const base = await plainSelect(exportChunkQuery(org.id, filters, null), {
    rowsAsArray: true,
    typeCast: undefined,
    dateStrings: true,
    autoJsonMap: false,
  });
  const previous = withPrevious ? await measure(previousExport(org.id, filters)) : null;
  const ex = await measure(createRunService({ sequelize }).exportCsv(org.id, filters));

  const avg = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  console.log(`export ${from} … ${to} of ${ex.rows.toLocaleString('en')} runs (${mib(ex.bytes)} of CSV):`);
  const line = (label: string, r: { rows: number; ms: number }) =>
    console.log(
      `  ${label.padEnd(58)} ${r.rows.toLocaleString('en')} rows in ${seconds(r.ms)}, ${perS(rate(r.rows, r.ms))}`,
    );
  if (basePrevious) line('plain SELECT, previous columns, Sequelize connection:', basePrevious);
  line("plain SELECT, the export's columns, rows as arrays:", base);
  if (previous) line('CSV export, previous design:', previous);
  line('CSV export:', ex);
  const r = rate(ex.rows, ex.ms);
  console.log(
    `  export ${perS(r)} (goal 20,000): ${(r / rate(base.rows, base.ms)).toFixed(2)} of the plain SELECT of its columns` +
      (basePrevious && previous
        ? `, ${(r / rate(basePrevious.rows, basePrevious.ms)).toFixed(2)} of the previous baseline, ${(r / rate(previous.rows, previous.ms)).toFixed(2)}× the previous export (which was ${(rate(previous.rows, previous.ms) / rate(basePrevious.rows, basePrevious.ms)).toFixed(2)} of its baseline)`
        : ''),
  );
  console.log(
    `  SHA-256 of the CSV: ${ex.sha256}${previous ? (previous.sha256 === ex.sha256 && previous.bytes === ex.bytes ? ' (identical to the previous design)' : ` DIFFERS from the previous design's ${previous.sha256}`) : ''}`,
  );
  if (previous && previous.sha256 !== ex.sha256) process.exitCode = 1;
  console.log(`  a chunk from the middle, ANALYZE FORMAT=JSON: ${await plan()}`);
  for (const [label, m] of [
    ['export', ex],
    ...(previous ? [['previous', previous] as const] : []),
  ] as const) {
    const first = avg(m.chunkMs.slice(1, 21));
    const last = avg(m.chunkMs.slice(-21, -1));
    console.log(
      `  ${label}: chunks of ${EXPORT_CHUNK}, first 20 ${first.toFixed(1)} ms each, last 20 ${last.toFixed(1)} ms each (ratio ${(last / first).toFixed(2)}; 1 is linear); heap peak ${mib(m.heap.first)} over the first 100,000 rows, ${mib(m.heap.all)} over all; RSS ${mib(m.rss.start)} at the start, peak ${mib(m.rss.first)} over the first 100,000 rows, ${mib(m.rss.all)} over all`,
    );
  }
} finally {
  await sequelize.close();
}
