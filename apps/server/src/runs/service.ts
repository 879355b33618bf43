import { QueryTypes, type Sequelize } from 'sequelize';
import type { RunDetail, RunFilters, RunListItem, RunListQuery, RunListResponse } from '@wickstone/contracts';
import { Lead, Run, Widget } from '../db/models/index.js';
import { notFound } from '../errors.js';
import { EXPORT_CHUNK, EXPORT_COLUMNS, EXPORT_LEAD_COLUMN, runsCsv } from '../export/runs.js';
import { jsonValue } from '../usage/rollups.js';
import { nextDay } from '../usage/days.js';
import { showRun } from './present.js';
import { wholeResult, type EngineOf } from './working.js';

export interface RunService {
  /** One page of an organisation's runs; `total` counts every run the filters match. */
  list(orgId: number, query: RunListQuery): Promise<RunListResponse>;
  get(orgId: number, runId: string): Promise<RunDetail>;
  /** The filtered runs as CSV text, a chunk at a time, read from the database a chunk at a time. */
  exportCsv(orgId: number, filters: RunFilters): AsyncGenerator<string>;
}

export { EXPORT_CHUNK };

type WidgetInfo = Pick<Widget, 'id' | 'name' | 'calculatorId' | 'settings'>;

interface RunColumns {
  id: string;
  created_at: Date | string;
  widget_id: number;
  calculator_id: string;
  origin: string;
  page_url: string | null;
  release: string;
  unit_system: 'si' | 'us';
  inputs: unknown;
  outputs: unknown;
  warning_codes: unknown;
  agreed: number | boolean;
  lead_id: number | null;
}

/** What the runs table reads of a run: never the stored working, which only the run's own page needs. */
const LIST_COLUMNS = `r.id, r.created_at, r.widget_id, r.calculator_id, r.origin, r.page_url, r.\`release\`, r.unit_system, r.inputs,
  JSON_EXTRACT(r.client_result, '$.outputs') AS outputs, r.warning_codes, r.agreed,
  (SELECT MIN(l.id) FROM leads l WHERE l.run_id = r.id AND l.organization_id = r.organization_id) AS lead_id`;

const toDate = (v: Date | string): Date => (v instanceof Date ? v : new Date(`${v.replace(' ', 'T')}Z`));

export interface Where {
  sql: string;
  params: unknown[];
}

/** `AND`-ed conditions with their values, in order. */
function conditions(first: string, value: unknown) {
  const sql = [first];
  const params: unknown[] = [value];
  return {
    sql,
    params,
    add(cond: string, v: unknown) {
      sql.push(cond);
      params.push(v);
    },
  };
}

/** The filters over raw runs (`runs r`). Days are UTC and both ends are included. */
function runsWhere(orgId: number, f: RunFilters): Where {
  const { sql, params, add } = conditions('r.organization_id = ?', orgId);
  if (f.from) add('r.created_at >= ?', `${f.from} 00:00:00`);
  if (f.to) add('r.created_at < ?', `${nextDay(f.to)} 00:00:00`);
  if (f.widgetId !== undefined) add('r.widget_id = ?', f.widgetId);
  if (f.calculatorId !== undefined) add('r.calculator_id = ?', f.calculatorId);
  if (f.origin !== undefined) add('r.origin = ?', f.origin);
  if (f.hasWarning !== undefined) add('r.has_warning = ?', f.hasWarning ? 1 : 0);
  if (f.agreed !== undefined) add('r.agreed = ?', f.agreed ? 1 : 0);
  return { sql: sql.join(' AND '), params };
}

/**
 * One chunk of the runs export: up to EXPORT_CHUNK runs after the keyset cursor (time as a
 * DATETIME(3) literal, id) in the export's order, a range of the runs table's (organisation,
 * time, id) key. Exported for the export benchmark, which checks the plan with ANALYZE.
 */
export function exportChunkQuery(
  orgId: number,
  f: RunFilters,
  cursor: [string, string] | null,
  leadInQuery = false,
): Where {
  const where = runsWhere(orgId, f);
  const dir = f.sort === 'createdAt' ? 'ASC' : 'DESC';
  const after = dir === 'DESC' ? '<' : '>';
  return {
    sql: `SELECT ${EXPORT_COLUMNS}${leadInQuery ? `, ${EXPORT_LEAD_COLUMN}` : ''} FROM runs r WHERE ${where.sql}${cursor ? ` AND (r.created_at ${after} ? OR (r.created_at = ? AND r.id ${after} ?))` : ''}
     ORDER BY r.created_at ${dir}, r.id ${dir} LIMIT ${EXPORT_CHUNK}`,
    params: cursor ? [...where.params, cursor[0], cursor[0], cursor[1]] : where.params,
  };
}

/**
 * How many runs match, from the daily rollups: every filter of the runs table is one of their
 * dimensions, and their four counters give each has-warning × agreed combination exactly
 * (inclusion–exclusion), so the total never counts raw rows.
 */
function rollupCount(orgId: number, f: RunFilters): Where {
  const { sql, params, add } = conditions('organization_id = ?', orgId);
  if (f.from) add('day >= ?', f.from);
  if (f.to) add('day <= ?', f.to);
  if (f.widgetId !== undefined) add('widget_id = ?', f.widgetId);
  if (f.calculatorId !== undefined) add('calculator_id = ?', f.calculatorId);
  if (f.origin !== undefined) add('origin = ?', f.origin);
  const counted: Record<string, string> = {
    'any|any': 'runs',
    'true|any': 'warned',
    'false|any': 'runs - warned',
    'any|false': 'disagreed',
    'any|true': 'runs - disagreed',
    'true|false': 'warned_disagreed',
    'true|true': 'warned - warned_disagreed',
    'false|false': 'disagreed - warned_disagreed',
    'false|true': 'runs - warned - disagreed + warned_disagreed',
  };
  const expr = counted[`${f.hasWarning ?? 'any'}|${f.agreed ?? 'any'}`];
  return { sql: `SELECT COALESCE(SUM(${expr}), 0) AS n FROM run_daily WHERE ${sql.join(' AND ')}`, params };
}

/**
 * `reads` serves the runs list and export: the read replica when one is configured (they show what
 * visitors' reports added, so a replica's lag only delays new runs), else the primary. A run's own
 * page (`get`) reads the primary, as every other read does.
 */
export function createRunService(deps: {
  sequelize: Sequelize;
  reads?: Sequelize;
  /** Release engines: a run's working is made again with the engine of the release that made it. */
  engineOf?: EngineOf;
  /** How many linked requests the export reads whole before it looks them up per run instead (tests). */
  linkedLeadsLimit?: number;
}): RunService {
  const { sequelize } = deps;
  const reads = deps.reads ?? sequelize;

  async function widgetsOf(orgId: number): Promise<Map<number, WidgetInfo>> {
    const widgets = await Widget.findAll({
      where: { organizationId: orgId },
      attributes: ['id', 'name', 'calculatorId', 'settings'],
    });
    return new Map(widgets.map((w) => [w.id, w]));
  }

  function item(row: RunColumns, widgets: Map<number, WidgetInfo>): RunListItem {
    const w = widgets.get(Number(row.widget_id));
    // As the visitor saw it: the unit system they had chosen, stored with the run. The widget's
    // own system may have changed since, or the visitor may have switched.
    const system = row.unit_system;
    const shown = showRun(
      row.calculator_id,
      w?.settings ?? { inputs: {} },
      jsonValue<Record<string, number | string | unknown[]>>(row.inputs),
      jsonValue<Record<string, number | null> | null>(row.outputs) ?? {},
      system,
    );
    return {
      id: row.id,
      createdAt: toDate(row.created_at).toISOString(),
      widget: { id: Number(row.widget_id), name: w?.name ?? `Widget ${row.widget_id}` },
      calculator: { id: row.calculator_id, title: shown.title },
      unitSystem: w?.settings.units.system ?? row.unit_system,
      visitorUnitSystem: system,
      inputs: shown.inputs,
      outputs: shown.outputs,
      warningCodes: jsonValue<string[]>(row.warning_codes),
      origin: row.origin,
      pageUrl: row.page_url,
      release: row.release,
      agreed: Boolean(Number(row.agreed)),
      leadId: row.lead_id === null ? null : Number(row.lead_id),
    };
  }

  const select = <T extends object>(sql: string, replacements: unknown[]) =>
    reads.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  return {
    async list(orgId, q) {
      const count = rollupCount(orgId, q);
      const dir = q.sort === 'createdAt' ? 'ASC' : 'DESC';
      const where = runsWhere(orgId, q);
      // The page's ids first, from an index alone where the filters allow, then only those rows:
      // a deep page skips index entries, not whole rows with their JSON. The total comes from the
      // rollups at the same time.
      const [counted, ids, widgets] = await Promise.all([
        select<{ n: number | string }>(count.sql, count.params),
        select<{ id: string }>(
          `SELECT r.id FROM runs r WHERE ${where.sql} ORDER BY r.created_at ${dir}, r.id ${dir} LIMIT ? OFFSET ?`,
          [...where.params, q.pageSize, (q.page - 1) * q.pageSize],
        ),
        widgetsOf(orgId),
      ]);
      const total = Number(counted[0]?.n ?? 0);
      if (!ids.length) return { items: [], total };
      const rows = await select<RunColumns>(`SELECT ${LIST_COLUMNS} FROM runs r WHERE r.id IN (?)`, [
        ids.map((r) => r.id),
      ]);
      const byId = new Map(rows.map((r) => [r.id, r]));
      return {
        items: ids.flatMap(({ id }) => {
          const row = byId.get(id);
          return row ? [item(row, widgets)] : [];
        }),
        total,
      };
    },

    async get(orgId, runId) {
      const run = await Run.findOne({ where: { id: runId, organizationId: orgId } });
      if (!run) throw notFound('Run');
      const [widgets, lead] = await Promise.all([
        widgetsOf(orgId),
        Lead.findOne({ where: { runId, organizationId: orgId }, order: [['id', 'ASC']] }),
      ]);
      const listed = item(
        {
          id: run.id,
          created_at: run.createdAt,
          widget_id: run.widgetId,
          calculator_id: run.calculatorId,
          origin: run.origin,
          page_url: run.pageUrl,
          release: run.release,
          unit_system: run.unitSystem,
          inputs: run.inputs,
          outputs: (run.clientResult as { outputs?: unknown }).outputs ?? null,
          warning_codes: run.warningCodes,
          agreed: run.agreed,
          lead_id: lead?.id ?? null,
        },
        widgets,
      );
      return {
        ...listed,
        calcVersion: run.calcVersion,
        inputHash: run.inputHash,
        sentInputs: run.inputs,
        clientResult: run.clientResult,
        // The working, made again from the inputs where the row does not hold it.
        serverResult: wholeResult(run, deps.engineOf) as unknown as Record<string, unknown> | null,
        mismatch: run.mismatch,
        lead: lead
          ? {
              id: lead.id,
              status: lead.status,
              name: lead.name,
              createdAt: lead.createdAt.toISOString(),
              erasedAt: lead.erasedAt?.toISOString() ?? null,
            }
          : null,
      };
    },

    async *exportCsv(orgId, f) {
      yield* runsCsv({
        reads,
        orgId,
        widgets: await widgetsOf(orgId),
        page: (cursor, leadInQuery) => exportChunkQuery(orgId, f, cursor, leadInQuery),
        linkedLeadsLimit: deps.linkedLeadsLimit,
      });
    },
  };
}
