// Ingest benchmark: the same load (autocannon, 50 connections, 10 s, loopback) on a bare Express 5
// handler that parses the report and stores nothing, then on the real server's
// `POST /api/v1/embed/runs` (a child process running src/index.ts against a fresh benchmark
// database); prints both rates, p50/p99 and the ratio, then checks that every acknowledged report
// is stored exactly once and that the rollups equal the raw runs.
// Run: npx tsx apps/server/bench/ingest.ts   (DB_HOST/DB_PORT/DB_USER/DB_PASSWORD: a MariaDB the
// benchmark may create its own database `wst_bench_ingest` in)
// BENCH_BASELINE_SERVER_DIR=<another copy's apps/server> also runs that copy's server (on the same
// database) in the same alternating slices, so a change is measured against the code before it
// under the same load at the same moments. A copy of a commit: `git archive <commit> apps/server |
// tar -x -C /tmp/base`, then link node_modules, releases and packages/widget of this checkout
// into /tmp/base and copy tsconfig.base.json there.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { QueryTypes } from 'sequelize';
import { calculate } from '@wickstone/calc-core';
import { defaultWidgetSettings } from '@wickstone/contracts';
import { Organization, Widget } from '../src/db/models/index.js';
import { rollupsFromRaw, storedRollups } from '../src/usage/rollups.js';
import { reportOf } from '../src/runs/invent.js';
import { openBenchDatabase, seconds } from './common.js';

const DB = 'wst_bench_ingest';
const CONNECTIONS = 50;
const DURATION_S = 10;
/**
 * Warm-up per target, so both are measured with their code optimised by the JIT (a server runs for
 * days): load in slices of WARMUP_SLICE_S until WARMUP_REQUESTS were answered or WARMUP_MAX_S passed.
 */
const WARMUP_SLICE_S = 2;
const WARMUP_REQUESTS = 3_000;
const WARMUP_MAX_S = 16;
const SLICES = 5;
const SITE = 'https://www.brackenridge-ground.example';
const PUBLIC_KEY = 'wk_benchingest000000001';
const serverDir = fileURLToPath(new URL('..', import.meta.url));

/**
 * CPU seconds a process has used (user + system, from /proc): on a machine shared with other work,
 * CPU per request is the steadier figure beside the rates. NaN where /proc cannot say.
 */
function cpuSeconds(pid: number | undefined): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return NaN;
  }
}

/** The benchmark database server's pid, when it runs on this machine and its pid file is readable. */
async function databasePid(): Promise<number | undefined> {
  const [row] = await sequelize.query<{ f: string }>('SELECT @@pid_file AS f', { type: QueryTypes.SELECT });
  try {
    return Number(readFileSync(row!.f, 'utf8').trim());
  } catch {
    return undefined;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

async function waitForHttp(url: string, child: ChildProcess): Promise<void> {
  const until = Date.now() + 60_000;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`${url}: the process exited (${child.exitCode})`);
    try {
      await fetch(url);
      return;
    } catch {
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  throw new Error(`${url} did not answer within a minute`);
}

/** Extra node flags for the server under test, e.g. BENCH_SERVER_NODE_ARGS=--cpu-prof to profile it. */
const serverNodeArgs = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);

function start(
  script: string,
  env: Record<string, string>,
  nodeArgs: string[] = [],
  cwd = serverDir,
): ChildProcess {
  return spawn(process.execPath, [...nodeArgs, '--import', 'tsx', script], {
    cwd,
    env: { ...process.env, ...env },
    // The server logs every request as it would in production; the lines go to /dev/null.
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
  await exited;
  clearTimeout(timer);
}

// Real reports: a pool of calculations; every request sends one with a new run id.
const pool = Array.from({ length: 200 }, (_, i) => {
  const r = calculate('tube-rise', { diameter: 0.0001 + i * 0.00003, temperatureC: 5 + (i % 25) });
  return reportOf(r, {
    id: '',
    publicKey: PUBLIC_KEY,
    unitSystem: 'si',
    pageUrl: `${SITE}/services/rising-damp`,
  });
});

/** One target's figures, summed over its slices. */
interface Load {
  ok: number;
  other: number;
  errors: number;
  latenciesMs: number[];
  acknowledged: string[];
  /** CPU seconds used meanwhile: the target's process, and the database server. */
  cpuServerS: number;
  cpuDbS: number;
}

const emptyLoad = (): Load => ({
  ok: 0,
  other: 0,
  errors: 0,
  latenciesMs: [],
  acknowledged: [],
  cpuServerS: 0,
  cpuDbS: 0,
});

/** Load one target for `durationS` and add what happened to `into`. */
async function load(
  url: string,
  durationS: number,
  into: Load,
  pids: { server?: number; db?: number } = {},
): Promise<void> {
  let n = 0;
  const [cpu0, db0] = [cpuSeconds(pids.server), cpuSeconds(pids.db)];
  const options: autocannon.Options = {
    url,
    connections: CONNECTIONS,
    duration: durationS,
    timeout: 10,
    requests: [
      {
        method: 'POST',
        path: '/api/v1/embed/runs',
        headers: { 'content-type': 'text/plain;charset=UTF-8', origin: SITE },
        setupRequest: (req) => ({
          ...req,
          body: JSON.stringify({ ...pool[n++ % pool.length], id: randomUUID() }),
        }),
        onResponse: (status, body) => {
          if (status === 200 || status === 201)
            into.acknowledged.push((JSON.parse(body) as { id: string }).id);
        },
      },
    ],
  };
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(options, (err, r) => (err ? reject(err as Error) : resolve(r)));
    instance.on('response', (_client, _status, _bytes, responseTime) => into.latenciesMs.push(responseTime));
  });
  into.ok += result['2xx'];
  into.other += result.non2xx;
  into.errors += result.errors + result.timeouts;
  into.cpuServerS += cpuSeconds(pids.server) - cpu0;
  into.cpuDbS += pids.db ? cpuSeconds(pids.db) - db0 : 0;
}

function percentile(sorted: number[], p: number): number {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]! : NaN;
}

const { sequelize, config } = await openBenchDatabase({ fresh: true, db: DB });
const org = await Organization.create({
  name: 'Brackenridge Ground & Damp (benchmark)',
  slug: 'bench-ingest',
});
await Widget.create({
  organizationId: org.id,
  publicKey: PUBLIC_KEY,
  name: 'Rising damp: capillary rise in a pore',
  calculatorId: 'tube-rise',
  status: 'live',
  allowedOrigins: [SITE],
  settings: defaultWidgetSettings(),
  release: '0.1.0',
});

const status = async () => {
  const rows = await sequelize.query<{ Variable_name: string; Value: string }>(
    "SHOW GLOBAL STATUS WHERE Variable_name IN ('Com_commit', 'Questions')",
    { type: QueryTypes.SELECT },
  );
  return Object.fromEntries(rows.map((r) => [r.Variable_name, Number(r.Value)]));
};

// BENCH_BARE_PORT / BENCH_SERVER_PORT pin the two ports (on a shared machine); free ones otherwise.
const barePort = Number(process.env.BENCH_BARE_PORT ?? 0) || (await freePort());
const serverPort = Number(process.env.BENCH_SERVER_PORT ?? 0) || (await freePort());
const bareUrl = `http://127.0.0.1:${barePort}`;
const serverUrl = `http://127.0.0.1:${serverPort}`;
const bare = start('bench/ingest-bare.ts', { PORT: String(barePort) });
const serverEnv = (port: number) => ({
  PORT: String(port),
  DB_NAME: DB,
  DB_HOST: config.db.host,
  DB_PORT: String(config.db.port),
  LOG_LEVEL: process.env.BENCH_LOG_LEVEL ?? 'info',
  RETENTION_FIRST_PURGE_MINUTES: '600',
});
const server = start('src/index.ts', serverEnv(serverPort), serverNodeArgs);
const baselineDir = process.env.BENCH_BASELINE_SERVER_DIR;
const baselinePort = baselineDir ? Number(process.env.BENCH_BASELINE_PORT ?? 0) || (await freePort()) : 0;
const baselineUrl = `http://127.0.0.1:${baselinePort}`;
const baseline = baselineDir ? start('src/index.ts', serverEnv(baselinePort), [], baselineDir) : undefined;
const results = { bare: emptyLoad(), ingest: emptyLoad(), baseline: emptyLoad() };
const warmupAcks = emptyLoad();
const baselineWarmupAcks = emptyLoad();
let statements = NaN;
let commits = NaN;
try {
  await waitForHttp(`${bareUrl}/`, bare);
  await waitForHttp(`${serverUrl}/api/v1/health`, server);
  if (baseline) await waitForHttp(`${baselineUrl}/api/v1/health`, baseline);
  const dbPid = await databasePid();
  for (const [url, into] of [
    [bareUrl, emptyLoad()],
    [serverUrl, warmupAcks],
    ...(baseline ? ([[baselineUrl, baselineWarmupAcks]] as const) : []),
  ] as const) {
    for (let s = 0; s < WARMUP_MAX_S && into.ok < WARMUP_REQUESTS; s += WARMUP_SLICE_S)
      await load(url, WARMUP_SLICE_S, into);
  }
  // Slices taken in turn, so that a busy spell on a shared machine falls on both alike.
  for (let i = 0; i < SLICES; i++) {
    await load(bareUrl, DURATION_S / SLICES, results.bare, { server: bare.pid });
    const s0 = await status();
    await load(serverUrl, DURATION_S / SLICES, results.ingest, { server: server.pid, db: dbPid });
    const s1 = await status();
    statements = (Number.isNaN(statements) ? 0 : statements) + s1.Questions! - s0.Questions! - 1;
    commits = (Number.isNaN(commits) ? 0 : commits) + s1.Com_commit! - s0.Com_commit!;
    if (baseline)
      await load(baselineUrl, DURATION_S / SLICES, results.baseline, { server: baseline.pid, db: dbPid });
  }
} finally {
  await Promise.all([stop(bare), stop(server), ...(baseline ? [stop(baseline)] : [])]);
}

const rate = (r: Load) => r.ok / DURATION_S;
const cpuMs = (r: Load) => ((r.cpuServerS + r.cpuDbS) * 1000) / r.ok;
const row = (name: string, r: Load) => {
  const sorted = [...r.latenciesMs].sort((a, b) => a - b);
  return `  ${name.padEnd(26)} ${rate(r).toFixed(0).padStart(6)} req/s   p50 ${percentile(sorted, 50).toFixed(0).padStart(4)} ms   p99 ${percentile(sorted, 99).toFixed(0).padStart(4)} ms   2xx ${r.ok}, other ${r.other}, errors ${r.errors}   CPU ${((r.cpuServerS * 1000) / r.ok).toFixed(2)} ms server + ${((r.cpuDbS * 1000) / r.ok).toFixed(2)} ms database per request`;
};
console.log(
  `ingest: ${CONNECTIONS} connections, ${DURATION_S} s per target in ${SLICES} alternating slices, loopback (after a warm-up of ${WARMUP_REQUESTS} requests or ${WARMUP_MAX_S} s each)`,
);
console.log(row('bare Express handler', results.bare));
console.log(row('POST /api/v1/embed/runs', results.ingest));
console.log(
  `  ratio ${(rate(results.ingest) / rate(results.bare)).toFixed(2)} (goal 0.8, not done below 0.5); CPU per request ratio ${(cpuMs(results.bare) / cpuMs(results.ingest)).toFixed(2)}`,
);
if (baseline) {
  console.log(row(`baseline (${baselineDir})`, results.baseline));
  console.log(
    `  baseline ratio ${(rate(results.baseline) / rate(results.bare)).toFixed(2)}; this code against the baseline: ${(rate(results.ingest) / rate(results.baseline)).toFixed(2)}× the rate, ${(cpuMs(results.ingest) / cpuMs(results.baseline)).toFixed(2)}× the CPU per report (server + database)`,
  );
}
console.log(
  `  database: ${(statements / results.ingest.ok).toFixed(2)} statements and ${(commits / results.ingest.ok).toFixed(3)} commits per report (${(results.ingest.ok / commits).toFixed(1)} reports per transaction)`,
);

// Every acknowledged report is a row, exactly once; the rollups are the raw runs counted.
const t0 = performance.now();
const acked = [
  ...warmupAcks.acknowledged,
  ...results.ingest.acknowledged,
  ...baselineWarmupAcks.acknowledged,
  ...results.baseline.acknowledged,
];
let found = 0;
for (let i = 0; i < acked.length; i += 5000) {
  const rows = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs WHERE id IN (?)', {
    replacements: [acked.slice(i, i + 5000)],
    type: QueryTypes.SELECT,
  });
  found += Number(rows[0]!.n);
}
const [{ n: total } = { n: 0 }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs', {
  type: QueryTypes.SELECT,
});
const distinctAcked = new Set(acked).size;
const rollupsOk =
  JSON.stringify(await storedRollups(sequelize)) === JSON.stringify(await rollupsFromRaw(sequelize));
console.log(
  `  stored: ${found} of ${acked.length} acknowledged ids (${distinctAcked} distinct), ${Number(total)} rows in all; rollups ${rollupsOk ? 'equal' : 'DIFFER FROM'} the raw runs (checked in ${seconds(performance.now() - t0)})`,
);
await sequelize.close();
if (found !== acked.length || distinctAcked !== acked.length || !rollupsOk) {
  console.error('ingest benchmark: an acknowledged report is missing or stored twice');
  process.exitCode = 1;
}
