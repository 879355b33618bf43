import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

const table = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const ref = (model: string) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  primaryKey: true,
  references: { model, key: 'id' },
  onDelete: 'CASCADE',
});
// Signed on purpose: a purge applies negative deltas through the same upsert as an insert applies
// positive ones, and a count that went below zero would show up in the rollup test, not as an error.
const counter = { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 };

export const up: Migration = async ({ context: qi }) => {
  // Daily counts per widget and site, kept as runs arrive (same transaction as the run), so the
  // usage summary of a busy year reads a few thousand rows instead of a million runs.
  await qi.createTable(
    'run_daily',
    {
      organization_id: ref('organizations'),
      // The run's UTC calendar day.
      day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      widget_id: ref('widgets'),
      calculator_id: { type: DataTypes.STRING(60), allowNull: false, primaryKey: true },
      origin: { type: DataTypes.STRING(200), allowNull: false, primaryKey: true },
      runs: counter,
      // Runs with at least one validity warning.
      warned: counter,
      // Runs whose numbers the server's recomputation did not reproduce.
      disagreed: counter,
      // Both at once: with the three above, every has-warning × agreed filter has an exact total.
      warned_disagreed: counter,
      // Runs a lead is linked to.
      led: counter,
    },
    table,
  );
  await qi.addIndex('run_daily', ['organization_id', 'widget_id', 'day'], {
    name: 'run_daily_org_widget_day',
  });

  await qi.createTable(
    'run_warning_daily',
    {
      organization_id: ref('organizations'),
      day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      widget_id: ref('widgets'),
      code: { type: DataTypes.STRING(60), allowNull: false, primaryKey: true },
      // Runs that raised this warning (a run raising it twice counts once).
      runs: counter,
    },
    table,
  );
  await qi.addIndex('run_warning_daily', ['organization_id', 'widget_id', 'day'], {
    name: 'run_warning_daily_org_widget_day',
  });

  await qi.createTable(
    'organization_settings',
    {
      organization_id: ref('organizations'),
      // Runs and leads older than this many months are purged daily; null keeps them.
      retention_months: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );

  // The runs page filters by these within one organisation and pages newest first: each index ends
  // in created_at (and, implicitly, the primary key), so a filtered page is a range read in order.
  await qi.addIndex('runs', ['organization_id', 'widget_id', 'has_warning', 'created_at'], {
    name: 'runs_org_widget_warning_created',
  });
  await qi.addIndex('runs', ['organization_id', 'has_warning', 'created_at'], {
    name: 'runs_org_warning_created',
  });
  await qi.addIndex('runs', ['organization_id', 'calculator_id', 'created_at'], {
    name: 'runs_org_calculator_created',
  });
  await qi.addIndex('runs', ['organization_id', 'origin', 'created_at'], { name: 'runs_org_origin_created' });
  await qi.addIndex('runs', ['organization_id', 'agreed', 'created_at'], { name: 'runs_org_agreed_created' });
  await qi.addIndex('leads', ['organization_id', 'status', 'created_at'], {
    name: 'leads_org_status_created',
  });
  await qi.addIndex('leads', ['organization_id', 'widget_id', 'created_at'], {
    name: 'leads_org_widget_created',
  });
  await qi.addIndex('leads', ['organization_id', 'assignee_id', 'created_at'], {
    name: 'leads_org_assignee_created',
  });
  await qi.addIndex('leads', ['organization_id', 'updated_at'], { name: 'leads_org_updated' });

  // Runs stored before this migration are counted once, here.
  await qi.sequelize.query(
    `INSERT INTO run_daily (organization_id, day, widget_id, calculator_id, origin, runs, warned, disagreed, warned_disagreed, led)
     SELECT r.organization_id, DATE(r.created_at), r.widget_id, r.calculator_id, r.origin, COUNT(*), SUM(r.has_warning),
            SUM(NOT r.agreed), SUM(r.has_warning AND NOT r.agreed), SUM(EXISTS (SELECT 1 FROM leads l WHERE l.run_id = r.id))
     FROM runs r GROUP BY r.organization_id, DATE(r.created_at), r.widget_id, r.calculator_id, r.origin`,
    { type: QueryTypes.INSERT },
  );
  await qi.sequelize.query(
    `INSERT INTO run_warning_daily (organization_id, day, widget_id, code, runs)
     SELECT r.organization_id, DATE(r.created_at), r.widget_id, w.code, COUNT(DISTINCT r.id)
     FROM runs r, JSON_TABLE(r.warning_codes, '$[*]' COLUMNS (code VARCHAR(60) PATH '$')) w
     GROUP BY r.organization_id, DATE(r.created_at), r.widget_id, w.code`,
    { type: QueryTypes.INSERT },
  );
};

export const down: Migration = async ({ context: qi }) => {
  for (const name of [
    'leads_org_status_created',
    'leads_org_widget_created',
    'leads_org_assignee_created',
    'leads_org_updated',
  ])
    await qi.removeIndex('leads', name);
  for (const name of [
    'runs_org_widget_warning_created',
    'runs_org_warning_created',
    'runs_org_calculator_created',
    'runs_org_origin_created',
    'runs_org_agreed_created',
  ])
    await qi.removeIndex('runs', name);
  await qi.dropTable('organization_settings');
  await qi.dropTable('run_warning_daily');
  await qi.dropTable('run_daily');
};
