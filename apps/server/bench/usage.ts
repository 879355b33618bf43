// The usage screens at 1,000,000 runs: p50/p95 of (a) the summary for the year and (b) a filtered
// runs page (one widget, with a warning, one month, page 3), each answered the way the API answers
// it (daily rollups; index-ordered page with the total from the rollups) beside the same question
// answered by plain GROUP BY / COUNT over the raw runs table, in one run. Seed first with
// seed-runs.ts (npm run bench does both).
// Run: npx tsx apps/server/bench/usage.ts [--db wst_bench_usage] [--iterations 20]
import { QueryTypes, type Sequelize } from 'sequelize';
import type { RunListQuery, UsageSummary } from '@wickstone/contracts';
import { Run, Widget } from '../src/db/models/index.js';
import { createRunService } from '../src/runs/service.js';
import { addDays, todayUtc } from '../src/usage/days.js';
import { createUsageService } from '../src/usage/service.js';
import { args, benchOrganization, openBenchDatabase } from './common.js';

const ITERATIONS = Number(args.iterations);
const RAW_ITERATIONS = Number(args['raw-iterations']);

async function time(
  label: string,
  fn: () => Promise<unknown>,
  iterations = ITERATIONS,
): Promise<{ label: string; n: number; p50: number; p95: number }> {
  await fn(); // warm-up: plans, pool connections, pages in the buffer pool
  const ms: number[] = [];
  for (let i = 0; i < iterations; i++) {
    const t0 = performance.now();
    await fn();
    ms.push(performance.now() - t0);
  }
  ms.sort((a, b) => a - b);
  const at = (q: number) => ms[Math.min(ms.length - 1, Math.ceil(q * ms.length) - 1)] ?? 0;
  return { label, n: iterations, p50: at(0.5), p95: at(0.95) };
}

/**
 * The summary's question over the raw runs, as plainly as it can be asked: one GROUP BY over the
 * period's runs (day × widget × calculator × site, with warnings, disagreements and leads counted),
 * folded into the four breakdowns here; one over their warning codes; one for the period before.
 */
async function rawSummary(sequelize: Sequelize, orgId: number, from: string, to: string) {
  const prevFrom = addDays(from, -(Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1));
  const range = [orgId, `${from} 00:00:00`, `${addDays(to, 1)} 00:00:00`];
  const where = 'r.organization_id = ? AND r.created_at >= ? AND r.created_at < ?';
  const sums = `COUNT(*) AS runs, SUM(r.has_warning) AS warned, SUM(NOT r.agreed) AS disagreed,
    SUM(EXISTS (SELECT 1 FROM leads l WHERE l.run_id = r.id)) AS led`;
  const q = (sql: string, replacements: unknown[]) =>
    sequelize.query<Record<string, unknown>>(sql, { replacements, type: QueryTypes.SELECT });
  const [groups, previous, warnings] = await Promise.all([
    q(
      `SELECT DATE_FORMAT(DATE(r.created_at), '%Y-%m-%d') AS day, r.widget_id, r.calculator_id, r.origin, ${sums} FROM runs r WHERE ${where} GROUP BY 1, 2, 3, 4`,
      range,
    ),
    q(`SELECT ${sums} FROM runs r WHERE ${where}`, [orgId, `${prevFrom} 00:00:00`, `${from} 00:00:00`]),
    q(
      `SELECT r.widget_id, w.code, COUNT(*) AS runs FROM runs r, JSON_TABLE(r.warning_codes, '$[*]' COLUMNS (code VARCHAR(60) PATH '$')) w
       WHERE ${where} GROUP BY r.widget_id, w.code ORDER BY runs DESC`,
      range,
    ),
  ]);
  const fold = (key: string) => {
    const out = new Map<string, { runs: number; led: number }>();
    for (const g of groups) {
      const k = String(g[key]);
      const o = out.get(k) ?? { runs: 0, led: 0 };
      o.runs += Number(g.runs);
      o.led += Number(g.led);
      out.set(k, o);
    }
    return out;
  };
  return {
    perDay: fold('day'),
    byWidget: fold('widget_id'),
    byCalculator: fold('calculator_id'),
    bySite: fold('origin'),
    previous,
    warnings,
  };
}

/** The page's question over the raw runs: a plain COUNT(*) for the total, a plain LIMIT/OFFSET for the rows. */
async function rawPage(sequelize: Sequelize, orgId: number, q: RunListQuery) {
  const conds = ['r.organization_id = ?', 'r.created_at >= ?', 'r.created_at < ?'];
  const params: unknown[] = [orgId, `${q.from} 00:00:00`, `${addDays(q.to!, 1)} 00:00:00`];
  if (q.widgetId !== undefined) {
    conds.push('r.widget_id = ?');
    params.push(q.widgetId);
  }
  if (q.hasWarning !== undefined) {
    conds.push('r.has_warning = ?');
    params.push(q.hasWarning ? 1 : 0);
  }
  const where = conds.join(' AND ');
  const [count, rows] = await Promise.all([
    sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM runs r WHERE ${where}`, {
      replacements: params,
      type: QueryTypes.SELECT,
    }),
    sequelize.query<{ id: string }>(
      `SELECT r.id, r.created_at, r.widget_id, r.calculator_id, r.origin, r.page_url, r.\`release\`, r.unit_system, r.inputs,
              JSON_EXTRACT(r.client_result, '$.outputs') AS outputs, r.warning_codes, r.agreed,
              (SELECT MIN(l.id) FROM leads l WHERE l.run_id = r.id) AS lead_id
       FROM runs r WHERE ${where} ORDER BY r.created_at DESC, r.id DESC LIMIT ? OFFSET ?`,
      { replacements: [...params, q.pageSize, (q.page - 1) * q.pageSize], type: QueryTypes.SELECT },
    ),
  ]);
  return { total: Number(count[0]?.n ?? 0), ids: rows.map((r) => r.id) };
}

const { sequelize, config } = await openBenchDatabase();
try {
  const org = await benchOrganization();
  if (!org) throw new Error(`no benchmark organisation in ${args.db}: run bench/seed-runs.ts first`);
  const runsStored = await Run.count({ where: { organizationId: org.id } });
  const widget = await Widget.findOne({ where: { organizationId: org.id, calculatorId: 'tube-rise' } });
  if (!widget) throw new Error('the benchmark organisation has no tube-rise widget');
  const usage = createUsageService({ sequelize });
  const runs = createRunService({ sequelize });

  const to = todayUtc();
  const from = addDays(to, -364);
  // A whole month in the middle of the year.
  const month = new Date(Date.parse(`${addDays(to, -180)}T00:00:00Z`));
  const monthFrom = new Date(Date.UTC(month.getUTCFullYear(), month.getUTCMonth(), 1))
    .toISOString()
    .slice(0, 10);
  const monthTo = new Date(Date.UTC(month.getUTCFullYear(), month.getUTCMonth() + 1, 0))
    .toISOString()
    .slice(0, 10);
  const page: RunListQuery = {
    widgetId: widget.id,
    hasWarning: true,
    from: monthFrom,
    to: monthTo,
    page: 3,
    pageSize: 50,
    sort: '-createdAt',
  };

  // Both ways must give the same answer, or the timing means nothing.
  const s: UsageSummary = await usage.summary(org.id, { from, to });
  const raw = await rawSummary(sequelize, org.id, from, to);
  const rawRuns = [...raw.byWidget.values()].reduce((n, r) => n + r.runs, 0);
  const rawLed = [...raw.byWidget.values()].reduce((n, r) => n + r.led, 0);
  if (
    s.totals.runs !== rawRuns ||
    s.totals.withLead !== rawLed ||
    s.previous.totals.runs !== Number(raw.previous[0]?.runs ?? 0)
  )
    throw new Error(
      `summary disagrees with the raw GROUP BY: ${JSON.stringify(s.totals)} vs ${rawRuns} runs, ${rawLed} led`,
    );
  const differs = [
    ...s.perDay.filter((d) => d.runs !== (raw.perDay.get(d.day)?.runs ?? 0)).map((d) => d.day),
    ...s.bySite
      .filter(
        (d) => d.runs !== raw.bySite.get(d.origin)?.runs || d.withLead !== raw.bySite.get(d.origin)?.led,
      )
      .map((d) => d.origin),
  ];
  if (differs.length)
    throw new Error(`summary disagrees with the raw GROUP BY on ${differs.slice(0, 5).join(', ')}`);
  const yearPage: RunListQuery = { hasWarning: true, from, to, page: 3, pageSize: 50, sort: '-createdAt' };
  for (const q of [page, yearPage]) {
    const listed = await runs.list(org.id, q);
    const plain = await rawPage(sequelize, org.id, q);
    if (listed.total !== plain.total || listed.items.map((r) => r.id).join() !== plain.ids.join())
      throw new Error(`runs page disagrees with the plain query: total ${listed.total} vs ${plain.total}`);
  }

  console.log(
    `${runsStored.toLocaleString('en')} runs in ${args.db} (MariaDB ${config.db.host}:${config.db.port}), node ${process.version}; each question timed n times after one warm-up`,
  );
  console.log(
    `(a) summary ${from}..${to}: ${s.totals.runs.toLocaleString('en')} runs, ${s.perDay.length} days, ${s.byWidget.length} widgets, ${s.bySite.length} sites, ${s.topWarnings.length} warnings, previous year ${s.previous.totals.runs.toLocaleString('en')}`,
  );
  console.log(
    `(b) runs page: widget "${widget.name}", has a warning, ${monthFrom}..${monthTo}, page 3 of 50: total ${(await runs.list(org.id, page)).total.toLocaleString('en')}`,
  );
  console.log(
    `(c) runs page: any widget, has a warning, the whole year, page 3 of 50: total ${(await runs.list(org.id, yearPage)).total.toLocaleString('en')}`,
  );
  const results = [
    await time('(a) summary, from the daily rollups', () => usage.summary(org.id, { from, to })),
    await time(
      '(a) summary, GROUP BY over raw runs',
      () => rawSummary(sequelize, org.id, from, to),
      RAW_ITERATIONS,
    ),
    await time('(b) month page, API (rollup total, index, units)', () => runs.list(org.id, page)),
    await time(
      '(b) month page, COUNT(*) + OFFSET on raw',
      () => rawPage(sequelize, org.id, page),
      RAW_ITERATIONS * 4,
    ),
    await time('(c) year page, API (rollup total, index, units)', () => runs.list(org.id, yearPage)),
    await time(
      '(c) year page, COUNT(*) + OFFSET on raw',
      () => rawPage(sequelize, org.id, yearPage),
      RAW_ITERATIONS * 4,
    ),
  ];
  const width = Math.max(...results.map((r) => r.label.length));
  console.log(`${'question'.padEnd(width)}   n     p50 ms     p95 ms`);
  for (const r of results)
    console.log(
      `${r.label.padEnd(width)}  ${String(r.n).padStart(2)}  ${r.p50.toFixed(1).padStart(9)}  ${r.p95.toFixed(1).padStart(9)}`,
    );

  // The CSV export of the whole year, once: streamed in keyset chunks, so memory stays flat.
  const rss0 = process.memoryUsage().rss;
  let peak = rss0;
  let bytes = 0;
  let lines = 0;
  const t0 = performance.now();
  for await (const chunk of runs.exportCsv(org.id, { from, to, sort: '-createdAt' })) {
    bytes += Buffer.byteLength(chunk);
    lines += chunk.split('\r\n').length - 1;
    peak = Math.max(peak, process.memoryUsage().rss);
  }
  const ms = performance.now() - t0;
  console.log(
    `CSV export of the year: ${(lines - 1).toLocaleString('en')} runs, ${(bytes / 1e6).toFixed(0)} MB in ${(ms / 1000).toFixed(1)} s (${Math.round((lines - 1) / (ms / 1000)).toLocaleString('en')} rows/s); resident memory ${(rss0 / 1e6).toFixed(0)} MB before, ${(peak / 1e6).toFixed(0)} MB at most`,
  );
} finally {
  await sequelize.close();
}
