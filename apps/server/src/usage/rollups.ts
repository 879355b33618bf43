import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

/*
 * The daily rollups (`run_daily`, `run_warning_daily`) kept equal to the raw runs: every change to
 * the runs or to which runs have a lead goes through here, inside the transaction that makes the
 * change, as one `INSERT ... ON DUPLICATE KEY UPDATE n = n + delta` per table. Adding and removing
 * runs are the same upsert with opposite signs.
 */

/** What a run contributes to the rollups. */
export interface RollupRun {
  organizationId: number;
  widgetId: number;
  calculatorId: string;
  origin: string;
  createdAt: Date;
  hasWarning: boolean;
  agreed: boolean;
  warningCodes: readonly string[];
  /** Whether a lead is linked to it. */
  led: boolean;
}

/** The UTC calendar day of an instant, `YYYY-MM-DD`: the rollups' day. */
export const utcDay = (d: Date): string => d.toISOString().slice(0, 10);

interface DailyDelta {
  key: [number, string, number, string, string];
  runs: number;
  warned: number;
  disagreed: number;
  warnedDisagreed: number;
  led: number;
}
interface WarningDelta {
  key: [number, string, number, string];
  runs: number;
}

/** Rows per upsert statement: well under max_allowed_packet, few round trips. */
const UPSERT_ROWS = 500;

function group(
  runs: readonly RollupRun[],
  sign: 1 | -1,
  only: 'all' | 'led',
): { daily: DailyDelta[]; warnings: WarningDelta[] } {
  const daily = new Map<string, DailyDelta>();
  const warnings = new Map<string, WarningDelta>();
  // A batch's runs mostly share their time (the ingest gives a batch one): its day is made once.
  let lastTime = NaN;
  let day = '';
  for (const r of runs) {
    if (r.createdAt.getTime() !== lastTime) {
      lastTime = r.createdAt.getTime();
      day = utcDay(r.createdAt);
    }
    const dk: DailyDelta['key'] = [r.organizationId, day, r.widgetId, r.calculatorId, r.origin];
    const ds = JSON.stringify(dk);
    let d = daily.get(ds);
    if (!d) daily.set(ds, (d = { key: dk, runs: 0, warned: 0, disagreed: 0, warnedDisagreed: 0, led: 0 }));
    d.led += r.led ? sign : 0;
    if (only === 'led') continue;
    d.runs += sign;
    d.warned += r.hasWarning ? sign : 0;
    d.disagreed += r.agreed ? 0 : sign;
    d.warnedDisagreed += r.hasWarning && !r.agreed ? sign : 0;
    for (const code of new Set(r.warningCodes)) {
      const wk: WarningDelta['key'] = [r.organizationId, day, r.widgetId, code];
      const ws = JSON.stringify(wk);
      const w = warnings.get(ws);
      if (w) w.runs += sign;
      else warnings.set(ws, { key: wk, runs: sign });
    }
  }
  // Always in key order, so two transactions touching the same rows lock them in the same order.
  const byKey = <T extends { key: unknown[] }>(m: Map<string, T>) =>
    [...m.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([, v]) => v);
  return {
    daily: byKey(daily).filter((d) => d.runs || d.led),
    warnings: byKey(warnings).filter((w) => w.runs),
  };
}

/** A statement with its `?` values, for a caller that sends it on a connection of its own. */
export interface Statement {
  sql: string;
  values: unknown[];
}

function upserts(tableAndColumns: string, counters: string[], rows: unknown[][]): Statement[] {
  const out: Statement[] = [];
  for (let i = 0; i < rows.length; i += UPSERT_ROWS) {
    const chunk = rows.slice(i, i + UPSERT_ROWS);
    const tuple = `(${chunk[0]!.map(() => '?').join(',')})`;
    out.push({
      sql: `INSERT INTO ${tableAndColumns} VALUES ${chunk.map(() => tuple).join(',')}
       ON DUPLICATE KEY UPDATE ${counters.map((c) => `${c} = ${c} + VALUES(${c})`).join(', ')}`,
      values: chunk.flat(),
    });
  }
  return out;
}

function statements(deltas: { daily: DailyDelta[]; warnings: WarningDelta[] }): Statement[] {
  return [
    ...upserts(
      'run_daily (organization_id, day, widget_id, calculator_id, origin, runs, warned, disagreed, warned_disagreed, led)',
      ['runs', 'warned', 'disagreed', 'warned_disagreed', 'led'],
      deltas.daily.map((d) => [...d.key, d.runs, d.warned, d.disagreed, d.warnedDisagreed, d.led]),
    ),
    ...upserts(
      'run_warning_daily (organization_id, day, widget_id, code, runs)',
      ['runs'],
      deltas.warnings.map((w) => [...w.key, w.runs]),
    ),
  ];
}

async function apply(
  sequelize: Sequelize,
  deltas: { daily: DailyDelta[]; warnings: WarningDelta[] },
  transaction: Transaction | null,
): Promise<void> {
  for (const s of statements(deltas)) {
    await sequelize.query(s.sql, { replacements: s.values, type: QueryTypes.INSERT, transaction });
  }
}

/** The upserts that count newly stored runs: increments summed per rollup row, rows in key order. */
export function addRunsStatements(runs: readonly RollupRun[]): Statement[] {
  return statements(group(runs, 1, 'all'));
}

/** Count newly stored runs (in the transaction that inserted them). */
export async function addRuns(
  sequelize: Sequelize,
  runs: readonly RollupRun[],
  transaction: Transaction | null,
): Promise<void> {
  await apply(sequelize, group(runs, 1, 'all'), transaction);
}

/** Uncount runs being deleted (in the transaction that deletes them), and drop rows left at zero. */
export async function removeRuns(
  sequelize: Sequelize,
  runs: readonly RollupRun[],
  transaction: Transaction | null,
): Promise<void> {
  if (!runs.length) return;
  await apply(sequelize, group(runs, -1, 'all'), transaction);
  const orgs = [...new Set(runs.map((r) => r.organizationId))];
  await sequelize.query('DELETE FROM run_daily WHERE organization_id IN (?) AND runs <= 0', {
    replacements: [orgs],
    type: QueryTypes.DELETE,
    transaction,
  });
  await sequelize.query('DELETE FROM run_warning_daily WHERE organization_id IN (?) AND runs <= 0', {
    replacements: [orgs],
    type: QueryTypes.DELETE,
    transaction,
  });
}

/**
 * A lead was linked to each of these runs (+1) or unlinked from it (-1). The caller holds the
 * runs' row locks, so a run cannot be purged between the check and this count.
 */
export async function countLeads(
  sequelize: Sequelize,
  runs: readonly Omit<RollupRun, 'led'>[],
  sign: 1 | -1,
  transaction: Transaction | null,
): Promise<void> {
  await apply(
    sequelize,
    group(
      runs.map((r) => ({ ...r, led: true })),
      sign,
      'led',
    ),
    transaction,
  );
}

/** Columns of `runs r` a `RollupRun` is read from, with whether a lead is linked; see `rollupRunOf`. */
export const ROLLUP_COLUMNS = `r.organization_id, r.widget_id, r.calculator_id, r.origin, r.created_at, r.has_warning, r.agreed, r.warning_codes,
  EXISTS (SELECT 1 FROM leads l WHERE l.run_id = r.id) AS led`;

export interface RollupColumnsRow {
  organization_id: number;
  widget_id: number;
  calculator_id: string;
  origin: string;
  created_at: Date;
  has_warning: number | boolean;
  agreed: number | boolean;
  warning_codes: string | string[];
  led: number | boolean;
}

/** A JSON column as the driver hands it over: already parsed, or as text. */
export function jsonValue<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T;
}

export function rollupRunOf(row: RollupColumnsRow): RollupRun {
  return {
    organizationId: Number(row.organization_id),
    widgetId: Number(row.widget_id),
    calculatorId: row.calculator_id,
    origin: row.origin,
    createdAt: row.created_at,
    hasWarning: Boolean(Number(row.has_warning)),
    agreed: Boolean(Number(row.agreed)),
    warningCodes: jsonValue<string[]>(row.warning_codes),
    led: Boolean(Number(row.led)),
  };
}

export interface DailyRollupRow {
  organization_id: number;
  day: string;
  widget_id: number;
  calculator_id: string;
  origin: string;
  runs: number;
  warned: number;
  disagreed: number;
  warned_disagreed: number;
  led: number;
}
export interface WarningRollupRow {
  organization_id: number;
  day: string;
  widget_id: number;
  code: string;
  runs: number;
}

/** Counts as numbers (SUM answers DECIMAL), rows in one order whatever the collation of each query. */
function normalise<T extends object>(rows: T[]): T[] {
  const counters = new Set([
    'organization_id',
    'widget_id',
    'runs',
    'warned',
    'disagreed',
    'warned_disagreed',
    'led',
  ]);
  const out = rows.map(
    (r) => Object.fromEntries(Object.entries(r).map(([k, v]) => [k, counters.has(k) ? Number(v) : v])) as T,
  );
  const key = (r: T) =>
    JSON.stringify(Object.entries(r).filter(([k]) => !counters.has(k) || k.endsWith('_id')));
  return out.sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0));
}

/** The rollup tables as stored, in key order. */
export async function storedRollups(
  sequelize: Sequelize,
): Promise<{ daily: DailyRollupRow[]; warnings: WarningRollupRow[] }> {
  const q = <T extends object>(sql: string) =>
    sequelize.query<T>(sql, { type: QueryTypes.SELECT }).then(normalise);
  return {
    daily: await q<DailyRollupRow>(
      `SELECT organization_id, DATE_FORMAT(day, '%Y-%m-%d') AS day, widget_id, calculator_id, origin, runs, warned, disagreed, warned_disagreed, led FROM run_daily`,
    ),
    warnings: await q<WarningRollupRow>(
      `SELECT organization_id, DATE_FORMAT(day, '%Y-%m-%d') AS day, widget_id, code, runs FROM run_warning_daily`,
    ),
  };
}

/**
 * What the rollup tables should hold, counted from the raw runs with plain GROUP BY: the check
 * that the incremental counts are right (tests, and the benchmark's seed after a million runs).
 */
export async function rollupsFromRaw(
  sequelize: Sequelize,
): Promise<{ daily: DailyRollupRow[]; warnings: WarningRollupRow[] }> {
  const q = <T extends object>(sql: string) =>
    sequelize.query<T>(sql, { type: QueryTypes.SELECT }).then(normalise);
  return {
    daily: await q<DailyRollupRow>(
      `SELECT r.organization_id, DATE_FORMAT(DATE(r.created_at), '%Y-%m-%d') AS day, r.widget_id, r.calculator_id, r.origin,
              COUNT(*) AS runs, SUM(r.has_warning) AS warned, SUM(NOT r.agreed) AS disagreed,
              SUM(r.has_warning AND NOT r.agreed) AS warned_disagreed,
              SUM(EXISTS (SELECT 1 FROM leads l WHERE l.run_id = r.id)) AS led
       FROM runs r GROUP BY r.organization_id, DATE(r.created_at), r.widget_id, r.calculator_id, r.origin`,
    ),
    warnings: await q<WarningRollupRow>(
      `SELECT r.organization_id, DATE_FORMAT(DATE(r.created_at), '%Y-%m-%d') AS day, r.widget_id, w.code, COUNT(DISTINCT r.id) AS runs
       FROM runs r, JSON_TABLE(r.warning_codes, '$[*]' COLUMNS (code VARCHAR(60) PATH '$')) w
       GROUP BY r.organization_id, DATE(r.created_at), r.widget_id, w.code`,
    ),
  };
}
