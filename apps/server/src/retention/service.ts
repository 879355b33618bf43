import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AuditTrail } from '../audit/service.js';
import type { Retention } from '@wickstone/contracts';
import { OrganizationSetting } from '../db/models/index.js';
import { retryOnDeadlock } from '../runs/store.js';
import { countLeads, ROLLUP_COLUMNS, rollupRunOf, utcDay, type RollupColumnsRow } from '../usage/rollups.js';

const DAY_MS = 86_400_000;

/** The affected row count Sequelize answers a DELETE with (a number; a bigint from some drivers). */
function affectedRows(result: unknown): number {
  if (typeof result !== 'number' && typeof result !== 'bigint')
    throw new Error('a DELETE answered no row count');
  return Number(result);
}

export interface PurgeResult {
  runs: number;
  leads: number;
}

export interface RetentionService {
  get(orgId: number, now?: Date): Promise<Retention>;
  /** `trail` records the change in the audit log. */
  set(orgId: number, months: number | null, now?: Date, trail?: AuditTrail): Promise<Retention>;
  /**
   * Delete one organisation's runs and leads created before the cutoff for `months`, a chunk per
   * transaction, keeping the rollups equal to what is left. A lead newer than the cutoff whose run
   * goes stays, unlinked from it.
   */
  purgeOrganization(orgId: number, months: number, now?: Date): Promise<PurgeResult>;
  /** Every organisation that chose a retention period: what the daily timer runs. */
  purgeAll(now?: Date): Promise<PurgeResult & { organizations: number }>;
}

/** UTC midnight of the same day `months` calendar months back (the month's last day when it has fewer). */
export function retentionCutoff(months: number, now: Date): Date {
  const y = now.getUTCFullYear();
  const m = now.getUTCMonth() - months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, m, Math.min(now.getUTCDate(), lastDay)));
}

type LockedRun = RollupColumnsRow & { id: string };

export function createRetentionService(deps: { sequelize: Sequelize; chunkSize: number }): RetentionService {
  const { sequelize, chunkSize } = deps;
  const sel = <T extends object>(sql: string, replacements: unknown[], transaction: Transaction) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });

  const view = (months: number | null, now: Date): Retention => ({
    months,
    cutoff: months === null ? null : retentionCutoff(months, now).toISOString(),
  });

  /** Repeat one chunk's transaction until a chunk comes back short. */
  async function inChunks(chunk: () => Promise<number>): Promise<number> {
    let total = 0;
    for (;;) {
      const n = await retryOnDeadlock(chunk);
      total += n;
      if (n < chunkSize) return total;
    }
  }

  /**
   * One UTC day of runs at a time, oldest first, each in one transaction: the requests linked to
   * them unlinked, the runs deleted as one range of the (organisation, time, id) key, and that
   * day's rollup rows deleted whole. The cutoff is a UTC midnight and rollups are per UTC day, so
   * every run a rollup row counts goes in the same transaction as the row: the rollups stay equal
   * to what is left after every commit, without reading the runs into the server to uncount them.
   */
  async function purgeRuns(orgId: number, cutoff: Date): Promise<number> {
    if (cutoff.getTime() % DAY_MS !== 0) throw new Error('the retention cutoff must be a UTC midnight');
    let total = 0;
    for (;;) {
      const [oldest] = await sequelize.query<{ created_at: Date }>(
        'SELECT created_at FROM runs WHERE organization_id = ? AND created_at < ? ORDER BY created_at LIMIT 1',
        { replacements: [orgId, cutoff], type: QueryTypes.SELECT },
      );
      if (!oldest) return total;
      const from = new Date(Math.floor(new Date(oldest.created_at).getTime() / DAY_MS) * DAY_MS);
      const to = new Date(from.getTime() + DAY_MS);
      total += await retryOnDeadlock(() =>
        sequelize.transaction(async (transaction) => {
          const day = [orgId, from, to];
          await sequelize.query(
            `UPDATE leads l JOIN runs r ON r.id = l.run_id SET l.run_id = NULL
             WHERE l.organization_id = ? AND r.organization_id = ? AND r.created_at >= ? AND r.created_at < ?`,
            { replacements: [orgId, ...day], type: QueryTypes.UPDATE, transaction },
          );
          // A bulk delete is what Sequelize answers with its affected row count.
          const deleted: unknown = await sequelize.query(
            'DELETE FROM runs WHERE organization_id = ? AND created_at >= ? AND created_at < ?',
            { replacements: day, type: QueryTypes.BULKDELETE, transaction },
          );
          for (const table of ['run_daily', 'run_warning_daily'])
            await sequelize.query(`DELETE FROM ${table} WHERE organization_id = ? AND day = ?`, {
              replacements: [orgId, utcDay(from)],
              type: QueryTypes.DELETE,
              transaction,
            });
          return affectedRows(deleted);
        }),
      );
    }
  }

  async function purgeLeads(orgId: number, cutoff: Date): Promise<number> {
    return inChunks(() =>
      sequelize.transaction(async (transaction) => {
        const batch = await sel<{ id: number; run_id: string | null }>(
          `SELECT id, run_id FROM leads WHERE organization_id = ? AND created_at < ? ORDER BY created_at, id LIMIT ${chunkSize}`,
          [orgId, cutoff],
          transaction,
        );
        if (!batch.length) return 0;
        const ids = batch.map((l) => l.id);
        // A lead older than its run (only imported data can be) still counts in the run's rollup:
        // lock such runs before the leads, the order every other writer uses, and uncount them.
        const runIds = batch.map((l) => l.run_id).filter((id): id is string => id !== null);
        const runs = runIds.length
          ? await sel<LockedRun>(
              `SELECT r.id, ${ROLLUP_COLUMNS} FROM runs r WHERE r.id IN (?) FOR UPDATE`,
              [runIds],
              transaction,
            )
          : [];
        const locked = await sel<{ id: number; run_id: string | null }>(
          'SELECT id, run_id FROM leads WHERE id IN (?) FOR UPDATE',
          [ids],
          transaction,
        );
        const stillLinked = new Set(locked.map((l) => l.run_id));
        const linkedRuns = runs.filter((r) => stillLinked.has(r.id));
        if (linkedRuns.length) await countLeads(sequelize, linkedRuns.map(rollupRunOf), -1, transaction);
        await sequelize.query('DELETE FROM leads WHERE organization_id = ? AND id IN (?)', {
          replacements: [orgId, ids],
          type: QueryTypes.DELETE,
          transaction,
        });
        return batch.length;
      }),
    );
  }

  const service: RetentionService = {
    async get(orgId, now = new Date()) {
      const s = await OrganizationSetting.findByPk(orgId);
      return view(s?.retentionMonths ?? null, now);
    },

    async set(orgId, months, now = new Date(), trail) {
      await sequelize.transaction(async (transaction) => {
        const before = (await OrganizationSetting.findByPk(orgId, { transaction }))?.retentionMonths ?? null;
        await OrganizationSetting.upsert({ organizationId: orgId, retentionMonths: months }, { transaction });
        if (before !== months)
          await trail?.(
            { type: 'retention.changed', subject: null, details: { months: { from: before, to: months } } },
            transaction,
          );
      });
      return view(months, now);
    },

    async purgeOrganization(orgId, months, now = new Date()) {
      const cutoff = retentionCutoff(months, now);
      const runs = await purgeRuns(orgId, cutoff);
      const leads = await purgeLeads(orgId, cutoff);
      return { runs, leads };
    },

    async purgeAll(now = new Date()) {
      const settings = await OrganizationSetting.findAll({ where: { retentionMonths: { [Op.ne]: null } } });
      const total = { organizations: 0, runs: 0, leads: 0 };
      for (const s of settings) {
        if (s.retentionMonths === null) continue;
        const r = await service.purgeOrganization(s.organizationId, s.retentionMonths, now);
        total.organizations += 1;
        total.runs += r.runs;
        total.leads += r.leads;
      }
      return total;
    },
  };
  return service;
}
