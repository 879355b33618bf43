import type { CreationAttributes, Sequelize, Transaction } from 'sequelize';
import { Lead, Run } from '../db/models/index.js';
import { addRuns, countLeads } from '../usage/rollups.js';

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
  await Run.bulkCreate([...rows], { transaction });
  await addRuns(
    sequelize,
    rows.map((r) => ({ ...r, led: false })),
    transaction,
  );
}

const DEADLOCK = 1213;
function isDeadlock(e: unknown): boolean {
  const original = (e as { original?: { errno?: unknown } } | null)?.original;
  return original?.errno === DEADLOCK;
}

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
