import { QueryTypes, type Sequelize } from 'sequelize';
import { getCalculator } from '@wickstone/calc-core';
import { MAX_SUMMARY_DAYS, type UsageCounts, type UsageSummary } from '@wickstone/contracts';
import { Widget } from '../db/models/index.js';
import { fieldError } from '../errors.js';
import { addDays, daysBetween, eachDay, todayUtc } from './days.js';

export interface SummaryQuery {
  from?: string | undefined;
  to?: string | undefined;
  widgetId?: number | undefined;
}

export interface UsageService {
  /**
   * Runs per day, by widget, by calculator and by site, runs that led to a lead, the warnings
   * raised most often, and the period of the same length before: read from the daily rollups only.
   * Without dates, the 30 days up to today (UTC).
   */
  summary(orgId: number, query: SummaryQuery, now?: Date): Promise<UsageSummary>;
}

const DEFAULT_DAYS = 30;
const TOP_WARNINGS = 10;

interface SumRow {
  runs: string | number | null;
  warned: string | number | null;
  led: string | number | null;
  disagreed: string | number | null;
}
const SUMS = 'SUM(runs) AS runs, SUM(warned) AS warned, SUM(led) AS led, SUM(disagreed) AS disagreed';

const counts = (r: SumRow | undefined): UsageCounts => ({
  runs: Number(r?.runs ?? 0),
  withWarning: Number(r?.warned ?? 0),
  withLead: Number(r?.led ?? 0),
  disagreed: Number(r?.disagreed ?? 0),
});
const mostFirst = <T extends { runs: number }>(rows: T[], name: (r: T) => string) =>
  rows.sort((a, b) => b.runs - a.runs || name(a).localeCompare(name(b)));

export function createUsageService(deps: { sequelize: Sequelize }): UsageService {
  const { sequelize } = deps;

  return {
    async summary(orgId, q, now = new Date()) {
      const to = q.to ?? (q.from && q.from > todayUtc(now) ? q.from : todayUtc(now));
      const from = q.from ?? addDays(to, -(DEFAULT_DAYS - 1));
      const length = daysBetween(from, to);
      // Both dates given are checked by the query schema; one alone is checked here.
      if (length > MAX_SUMMARY_DAYS)
        throw fieldError(q.from ? 'query.from' : 'query.to', `At most ${MAX_SUMMARY_DAYS} days`);
      if (length < 1) throw fieldError('query.to', 'Must not be before from');
      const previous = { from: addDays(from, -length), to: addDays(from, -1) };

      const scope = (range: { from: string; to: string }) => ({
        sql: `organization_id = ? AND day BETWEEN ? AND ?${q.widgetId !== undefined ? ' AND widget_id = ?' : ''}`,
        params: [orgId, range.from, range.to, ...(q.widgetId !== undefined ? [q.widgetId] : [])],
      });
      const current = scope({ from, to });
      const sel = <T extends object>(sql: string, params: unknown[]) =>
        sequelize.query<T>(sql, { replacements: params, type: QueryTypes.SELECT });
      const grouped = <K extends string>(column: string, alias: K) =>
        sel<SumRow & Record<K, string | number>>(
          `SELECT ${column} AS ${alias}, ${SUMS} FROM run_daily WHERE ${current.sql} GROUP BY ${column}`,
          current.params,
        );

      const [perDay, byWidget, byCalculator, bySite, before, warnings, widgets] = await Promise.all([
        grouped("DATE_FORMAT(day, '%Y-%m-%d')", 'day'),
        grouped('widget_id', 'widgetId'),
        grouped('calculator_id', 'calculatorId'),
        grouped('origin', 'origin'),
        sel<SumRow>(`SELECT ${SUMS} FROM run_daily WHERE ${scope(previous).sql}`, scope(previous).params),
        sel<{ widgetId: number; code: string; runs: string | number }>(
          `SELECT widget_id AS widgetId, code, SUM(runs) AS runs FROM run_warning_daily WHERE ${current.sql} GROUP BY widget_id, code`,
          current.params,
        ),
        Widget.findAll({ where: { organizationId: orgId }, attributes: ['id', 'name', 'calculatorId'] }),
      ]);

      const widgetById = new Map(widgets.map((w) => [w.id, w]));
      const days = new Map(perDay.map((r) => [String(r.day), counts(r)]));
      const totals = perDay.reduce<UsageCounts>((t, r) => {
        const c = counts(r);
        return {
          runs: t.runs + c.runs,
          withWarning: t.withWarning + c.withWarning,
          withLead: t.withLead + c.withLead,
          disagreed: t.disagreed + c.disagreed,
        };
      }, counts(undefined));

      const topWarnings = new Map<
        string,
        { code: string; calculatorId: string; summary: string; runs: number }
      >();
      for (const w of warnings) {
        const calculatorId = widgetById.get(Number(w.widgetId))?.calculatorId ?? 'unknown';
        const key = `${calculatorId} ${w.code}`;
        const hit = topWarnings.get(key);
        if (hit) hit.runs += Number(w.runs);
        else {
          const summary =
            getCalculator(calculatorId)?.warnings.find((d) => d.code === w.code)?.summary ?? w.code;
          topWarnings.set(key, { code: w.code, calculatorId, summary, runs: Number(w.runs) });
        }
      }

      return {
        from,
        to,
        widgetId: q.widgetId ?? null,
        totals,
        previous: { ...previous, totals: counts(before[0]) },
        perDay: eachDay(from, to).map((day) => ({ day, ...(days.get(day) ?? counts(undefined)) })),
        byWidget: mostFirst(
          byWidget.map((r) => {
            const w = widgetById.get(Number(r.widgetId));
            return {
              widgetId: Number(r.widgetId),
              name: w?.name ?? `Widget ${r.widgetId}`,
              calculatorId: w?.calculatorId ?? 'unknown',
              ...counts(r),
            };
          }),
          (r) => r.name,
        ),
        byCalculator: mostFirst(
          byCalculator.map((r) => {
            const id = String(r.calculatorId);
            return { calculatorId: id, title: getCalculator(id)?.title ?? id, ...counts(r) };
          }),
          (r) => r.title,
        ),
        bySite: mostFirst(
          bySite.map((r) => ({ origin: String(r.origin), ...counts(r) })),
          (r) => r.origin,
        ),
        topWarnings: mostFirst([...topWarnings.values()], (r) => `${r.code} ${r.calculatorId}`).slice(
          0,
          TOP_WARNINGS,
        ),
      };
    },
  };
}
