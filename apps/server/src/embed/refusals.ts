import { QueryTypes, type Sequelize } from 'sequelize';
import type { OrgRefusedOrigins, RefusedOrigins } from '@wickstone/contracts';

/** The days of refusals a developer sees. */
export const REFUSAL_DAYS = 30;

export interface RefusalCounter {
  /** Count one refused request of the widget with this key from this origin, today (database clock). */
  count(publicKey: string, origin: string): Promise<void>;
  /** A widget's refusals over the last REFUSAL_DAYS days, per origin. */
  list(orgId: number, widgetId: number): Promise<RefusedOrigins>;
  /** The organisation's refusals over the last REFUSAL_DAYS days, per origin across its widgets: one query. */
  listForOrg(orgId: number): Promise<OrgRefusedOrigins>;
}

const dayOf = (d: string | Date): string =>
  typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10);

/**
 * Refused origins counted in MariaDB (one upsert per refusal, so every server process adds to the
 * same row); a key no widget has counts nothing, a replaced key counts for its widget.
 */
export function createRefusalCounter(sequelize: Sequelize): RefusalCounter {
  return {
    async count(publicKey, origin) {
      await sequelize.query(
        `INSERT INTO refused_origins (widget_id, origin, day, refusals)
         SELECT id, ?, CURRENT_DATE(), 1 FROM widgets WHERE public_key = ? OR previous_public_key = ?
         ON DUPLICATE KEY UPDATE refusals = refusals + 1`,
        {
          replacements: [origin.toLowerCase().slice(0, 200), publicKey, publicKey],
          type: QueryTypes.INSERT,
        },
      );
    },
    async list(orgId, widgetId) {
      const rows = await sequelize.query<{ origin: string; day: string | Date; refusals: number }>(
        `SELECT r.origin, r.day, r.refusals FROM refused_origins r
         JOIN widgets w ON w.id = r.widget_id
         WHERE w.organization_id = ? AND r.widget_id = ? AND r.day > CURRENT_DATE() - INTERVAL ? DAY
         ORDER BY r.day`,
        { replacements: [orgId, widgetId, REFUSAL_DAYS], type: QueryTypes.SELECT },
      );
      const byOrigin = new Map<string, RefusedOrigins['items'][number]>();
      for (const r of rows) {
        const day = dayOf(r.day);
        const item = byOrigin.get(r.origin) ?? { origin: r.origin, refusals: 0, lastDay: day, byDay: [] };
        item.refusals += Number(r.refusals);
        item.lastDay = day;
        item.byDay.push({ day, refusals: Number(r.refusals) });
        byOrigin.set(r.origin, item);
      }
      const items = [...byOrigin.values()].sort(
        (a, b) => b.refusals - a.refusals || a.origin.localeCompare(b.origin),
      );
      return { days: REFUSAL_DAYS, items };
    },
    async listForOrg(orgId) {
      const rows = await sequelize.query<{
        origin: string;
        widget_id: number;
        name: string;
        refusals: number | string;
        last_day: string | Date;
      }>(
        `SELECT r.origin, w.id AS widget_id, w.name, SUM(r.refusals) AS refusals, MAX(r.day) AS last_day
         FROM refused_origins r JOIN widgets w ON w.id = r.widget_id
         WHERE w.organization_id = ? AND r.day > CURRENT_DATE() - INTERVAL ? DAY
         GROUP BY r.origin, w.id, w.name`,
        { replacements: [orgId, REFUSAL_DAYS], type: QueryTypes.SELECT },
      );
      const byOrigin = new Map<string, OrgRefusedOrigins['items'][number]>();
      for (const r of rows) {
        const refusals = Number(r.refusals);
        const lastDay = dayOf(r.last_day);
        const item = byOrigin.get(r.origin) ?? { origin: r.origin, refusals: 0, lastDay, widgets: [] };
        item.refusals += refusals;
        if (lastDay > item.lastDay) item.lastDay = lastDay;
        item.widgets.push({ id: Number(r.widget_id), name: r.name, refusals });
        byOrigin.set(r.origin, item);
      }
      const items = [...byOrigin.values()].sort(
        (a, b) => b.refusals - a.refusals || a.origin.localeCompare(b.origin),
      );
      for (const item of items)
        item.widgets.sort((a, b) => b.refusals - a.refusals || a.name.localeCompare(b.name) || a.id - b.id);
      return { days: REFUSAL_DAYS, items };
    },
  };
}
