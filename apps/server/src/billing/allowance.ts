import { Op, QueryTypes, type Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import { allowanceNoticeLevels, type PlanId } from '@wickstone/contracts';
import { BillingAccount, Membership, Organization, User } from '../db/models/index.js';
import { sendSafely, type Mailer } from '../mail/mailer.js';
import { allowanceMail } from './mail.js';
import { standingFor, standingOf } from './plan.js';

/** What the hook needs of a stored run. */
export interface StoredRunRef {
  id: string;
  organizationId: number;
  createdAt: Date;
}

/** `2026-12` for a UTC time. */
export const monthOf = (d: Date): string => d.toISOString().slice(0, 7);

function monthBounds(month: string): [string, string] {
  const [y, m] = month.split('-').map(Number) as [number, number];
  const next = m === 12 ? `${y + 1}-01` : `${y}-${String(m + 1).padStart(2, '0')}`;
  return [`${month}-01`, `${next}-01`];
}

/** Runs an organisation logged in a month, from the daily rollups the run's own transaction kept. */
export async function runsInMonth(sequelize: Sequelize, orgId: number, month: string): Promise<number> {
  const { sql, values } = runsInMonthStatement([orgId], month);
  const rows = await sequelize.query<RunsInMonthRow>(sql, { replacements: values, type: QueryTypes.SELECT });
  return runsInMonthOf(rows).get(orgId) ?? 0;
}

export interface RunsInMonthRow {
  organization_id: number | string;
  n: number | string | null;
}

/**
 * The same count for several organisations as one statement, for a caller that sends it itself: the
 * ingest reads it inside the transaction that stores a batch (after counting the batch in the
 * rollups), so the hook below needs no round trip of its own for it.
 */
export function runsInMonthStatement(
  orgIds: readonly number[],
  month: string,
): { sql: string; values: unknown[] } {
  const [from, to] = monthBounds(month);
  return {
    sql: `SELECT organization_id, SUM(runs) AS n FROM run_daily WHERE organization_id IN (${orgIds.map(() => '?').join(',')}) AND day >= ? AND day < ? GROUP BY organization_id`,
    values: [...orgIds, from, to],
  };
}

export interface AccountRow {
  organization_id: number | string;
  plan: string;
  status: string;
  cancel_at_period_end: number | boolean | string;
}

/** Organisations' billing rows, read the same way by a caller that sends the statement itself. */
export function accountsStatement(orgIds: readonly number[]): { sql: string; values: unknown[] } {
  return {
    sql: `SELECT organization_id, plan, status, cancel_at_period_end FROM billing_accounts WHERE organization_id IN (${orgIds.map(() => '?').join(',')})`,
    values: [...orgIds],
  };
}

/** Each organisation's monthly run allowance by `standingOf` (no billing row: the free plan). */
export function allowancesOf(orgIds: readonly number[], rows: readonly AccountRow[]): Map<number, number> {
  const byOrg = new Map(rows.map((r) => [Number(r.organization_id), r]));
  return new Map(
    orgIds.map((id) => {
      const r = byOrg.get(id);
      const account = r
        ? BillingAccount.build(
            {
              organizationId: id,
              plan: r.plan as PlanId,
              status: r.status,
              cancelAtPeriodEnd: Boolean(Number(r.cancel_at_period_end)),
            },
            { isNewRecord: false },
          )
        : null;
      return [id, standingOf(account).plan.limits.runsPerMonth];
    }),
  );
}

/** What the hook would otherwise read itself, per organisation: runs in the runs' month, allowance. */
export interface AllowanceFacts {
  runs: ReadonlyMap<number, number>;
  allowances: ReadonlyMap<number, number>;
  /** The runs past the allowance were marked by the transaction that stored them (`pastAllowance`). */
  marked?: boolean;
}

/**
 * Of one organisation's runs just counted (in the order they were stored), those past its monthly
 * allowance: the last `used - allowance` of them, `used` being the month's runs with these counted.
 */
export function pastAllowance<R>(runs: readonly R[], used: number, allowance: number): R[] {
  const over = Math.min(runs.length, used - allowance);
  return over > 0 ? runs.slice(runs.length - over) : [];
}

export const runsInMonthOf = (rows: readonly RunsInMonthRow[]): Map<number, number> =>
  new Map(rows.map((r) => [Number(r.organization_id), Number(r.n ?? 0)]));

/**
 * After runs are stored (committed): mark those past the plan's monthly allowance, and tell the
 * firm's owners once when the month's runs reach 80 % and 100 % of it. Runs are never refused or
 * lost for being over: the firm's site keeps working. Call it with each stored batch; it costs one
 * query per organisation in the batch, plus an update only when runs are over.
 *
 * Two batches committing at the same moment near the limit may each count the other's runs, so a
 * run at the boundary can be marked when it was exactly the last one allowed; never the other way.
 */
export function createRunAllowance(deps: {
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
  publicUrl: string;
}) {
  const { sequelize, mailer, logger, publicUrl } = deps;

  async function notify(orgId: number, month: string, level: number, used: number, allowance: number) {
    // Once per organisation, month and level, whichever process gets there first.
    const [, affected] = await sequelize.query(
      'INSERT IGNORE INTO billing_usage_notices (organization_id, month, level, created_at) VALUES (?, ?, ?, NOW(3))',
      { replacements: [orgId, month, level], type: QueryTypes.INSERT },
    );
    if (!affected) return;
    const org = await Organization.findByPk(orgId, { attributes: ['id', 'name'] });
    const owners = await Membership.findAll({
      where: { organizationId: orgId, role: { [Op.eq]: 'owner' } },
      include: [{ model: User, as: 'user', required: true, attributes: ['email'] }],
    });
    const standing = await standingFor(orgId);
    for (const m of owners) {
      if (!m.user) continue;
      await sendSafely(
        mailer,
        logger,
        allowanceMail({
          to: m.user.email,
          orgName: org?.name ?? '',
          orgId,
          planName: standing.plan.name,
          level,
          used,
          allowance,
          month,
          publicUrl,
        }),
        'run allowance notice',
      );
    }
  }

  /**
   * `known`, when given, holds each organisation's runs in the runs' month and its allowance as read
   * by the transaction that stored them (`runsInMonthStatement`, `accountsStatement`); what it
   * lacks is read here.
   */
  return async function afterRunsStored(
    runs: readonly StoredRunRef[],
    known?: AllowanceFacts,
  ): Promise<void> {
    const groups = new Map<string, StoredRunRef[]>();
    for (const r of runs) {
      const k = `${r.organizationId}|${monthOf(r.createdAt)}`;
      const group = groups.get(k);
      if (group) group.push(r);
      else groups.set(k, [r]);
    }
    for (const [k, batch] of groups) {
      const orgId = batch[0]!.organizationId;
      const month = k.split('|')[1]!;
      const allowance = known?.allowances.get(orgId) ?? (await standingFor(orgId)).plan.limits.runsPerMonth;
      const used = known?.runs.get(orgId) ?? (await runsInMonth(sequelize, orgId, month));
      const before = used - batch.length;
      const over = pastAllowance(batch, used, allowance);
      if (over.length && !known?.marked) {
        await sequelize.query('UPDATE runs SET over_allowance = 1 WHERE id IN (?)', {
          replacements: [over.map((r) => r.id)],
          type: QueryTypes.UPDATE,
        });
      }
      for (const level of allowanceNoticeLevels) {
        const threshold = Math.ceil((allowance * level) / 100);
        if (before < threshold && used >= threshold) await notify(orgId, month, level, used, allowance);
      }
    }
  };
}

export type RunAllowanceHook = ReturnType<typeof createRunAllowance>;

/** For the plan summary: runs past the allowance this month. */
export async function runsOverAllowance(sequelize: Sequelize, orgId: number, month: string): Promise<number> {
  const [from, to] = monthBounds(month);
  const rows = await sequelize.query<{ n: number | string }>(
    'SELECT COUNT(*) AS n FROM runs WHERE organization_id = ? AND over_allowance = 1 AND created_at >= ? AND created_at < ?',
    { replacements: [orgId, `${from} 00:00:00`, `${to} 00:00:00`], type: QueryTypes.SELECT },
  );
  return Number(rows[0]?.n ?? 0);
}
