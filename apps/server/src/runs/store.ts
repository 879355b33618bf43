import { QueryTypes, type CreationAttributes, type Sequelize, type Transaction } from 'sequelize';
import { Lead, type Run } from '../db/models/index.js';
import { addRuns, countLeads, type Statement } from '../usage/rollups.js';

/** A run as stored, with its time chosen by the caller: the rollups count it on that time's UTC day. */
export type RunRow = CreationAttributes<Run> & { createdAt: Date };

/**
 * Insert runs and count them in the daily rollups, in the caller's transaction: the one way runs
 * are stored (the embed API, the demo seed and the benchmark's seed all come through here).
 */
export async function storeRuns(
  sequelize: Sequelize,
  rows: readonly RunRow[],
  transaction: Transaction,
): Promise<void> {
  if (!rows.length) return;
  await insertRuns(sequelize, rows, transaction);
  await addRuns(
    sequelize,
    rows.map((r) => ({ ...r, led: false })),
    transaction,
  );
}

const RUN_COLUMNS =
  'id, organization_id, widget_id, calculator_id, origin, page_url, `release`, calc_version, unit_system, inputs, ' +
  'client_result, server_result, warning_codes, has_warning, agreed, mismatch, input_hash, body_hash, created_at, over_allowance';
const RUN_TUPLE = `(${RUN_COLUMNS.split(',')
  .map(() => '?')
  .join(',')})`;
/** Rows per INSERT: a few hundred kilobytes at most, well under max_allowed_packet. */
const INSERT_ROWS = 500;

/**
 * A frozen object's JSON, made once: the ingest's recomputations are shared (frozen) by every
 * report with the same inputs, and so is the text of their `server_result`.
 */
const frozenJson = new WeakMap<object, string>();
function json(v: unknown): string | null {
  if (v === null || v === undefined) return null;
  if (typeof v !== 'object' || !Object.isFrozen(v)) return JSON.stringify(v);
  let text = frozenJson.get(v);
  if (text === undefined) frozenJson.set(v, (text = JSON.stringify(v)));
  return text;
}

function runValues(r: RunRow, over: boolean): unknown[] {
  return [
    r.id,
    r.organizationId,
    r.widgetId,
    r.calculatorId,
    r.origin,
    r.pageUrl ?? null,
    r.release,
    r.calcVersion,
    r.unitSystem,
    json(r.inputs),
    json(r.clientResult),
    json(r.serverResult),
    json(r.warningCodes),
    r.hasWarning ?? false,
    r.agreed,
    json(r.mismatch),
    r.inputHash,
    r.bodyHash,
    r.createdAt,
    over,
  ];
}

/**
 * Multi-row INSERTs of runs with `?` values, built directly (no model instances: the ingest's hot
 * path sends them on a connection of its own). A duplicate id fails the whole statement
 * (ER_DUP_ENTRY) and InnoDB rolls back just that statement. Runs whose id is in `overAllowance` are
 * stored marked as past their plan's monthly allowance.
 */
export function insertRunStatements(
  rows: readonly RunRow[],
  overAllowance: ReadonlySet<string> = new Set(),
): Statement[] {
  const out: Statement[] = [];
  for (let i = 0; i < rows.length; i += INSERT_ROWS) {
    const chunk = rows.slice(i, i + INSERT_ROWS);
    out.push({
      sql: `INSERT INTO runs (${RUN_COLUMNS}) VALUES ${chunk.map(() => RUN_TUPLE).join(',')}`,
      values: chunk.flatMap((r) => runValues(r, overAllowance.has(r.id))),
    });
  }
  return out;
}

/** The same INSERTs in the caller's Sequelize transaction (seeds, fixtures). */
export async function insertRuns(
  sequelize: Sequelize,
  rows: readonly RunRow[],
  transaction: Transaction,
): Promise<void> {
  for (const s of insertRunStatements(rows)) {
    await sequelize.query(s.sql, { replacements: s.values, type: QueryTypes.INSERT, transaction });
  }
}

/** The server's error number, from the connector's error or Sequelize's wrapper around it. */
function errno(e: unknown): unknown {
  const err = e as { errno?: unknown; original?: { errno?: unknown } } | null;
  return err?.original?.errno ?? err?.errno;
}

/** A duplicate key (the client-made run id reported twice). */
export const isDuplicateKey = (e: unknown): boolean => errno(e) === 1062;

const isDeadlock = (e: unknown): boolean => errno(e) === 1213;

/**
 * Run a transaction again when InnoDB chose it as a deadlock victim (it was rolled back whole).
 * Concurrent upserts of the same new rollup row can deadlock on their insert-intention locks.
 */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await work();
    } catch (e) {
      if (i >= attempts || !isDeadlock(e)) throw e;
      await new Promise((r) => setTimeout(r, 5 * i + Math.random() * 10));
    }
  }
}

/** A lead as stored, linked to a run. */
export type LinkedLeadRow = CreationAttributes<Lead> & { runId: string };

/**
 * Insert leads for runs stored in the same transaction (seeded data: nothing else can know those
 * runs yet, so no row lock is needed) and count each run as having led to a lead.
 */
export async function storeLeadsForRuns(
  sequelize: Sequelize,
  pairs: readonly { lead: LinkedLeadRow; run: RunRow }[],
  transaction: Transaction,
): Promise<void> {
  if (!pairs.length) return;
  await Lead.bulkCreate(
    pairs.map((p) => p.lead),
    { transaction },
  );
  await countLeads(
    sequelize,
    pairs.map((p) => p.run),
    1,
    transaction,
  );
}
