import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

const table = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const orgRef = {
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model: 'organizations', key: 'id' },
  onDelete: 'CASCADE',
};

export const up: Migration = async ({ context: qi }) => {
  // What each firm pays for, as the provider's webhooks last told us. No row: the free plan.
  await qi.createTable(
    'billing_accounts',
    {
      organization_id: { ...orgRef, primaryKey: true },
      plan: { type: DataTypes.STRING(20), allowNull: false },
      // The provider's subscription status (active, past_due, unpaid, canceled, ...).
      status: { type: DataTypes.STRING(30), allowNull: false },
      customer_id: { type: DataTypes.STRING(100), allowNull: true, unique: true },
      subscription_id: { type: DataTypes.STRING(100), allowNull: true, unique: true },
      current_period_end: { type: DataTypes.DATE(3), allowNull: true },
      cancel_at_period_end: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      next_payment_attempt: { type: DataTypes.DATE(3), allowNull: true },
      // The provider's time of the last event applied: an older event arriving late changes nothing.
      synced_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );

  // Each webhook event once: its id is the key, inserted in the transaction that applies it.
  await qi.createTable(
    'billing_events',
    {
      id: { type: DataTypes.STRING(100), primaryKey: true },
      type: { type: DataTypes.STRING(80), allowNull: false },
      organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );

  // The 80 % and 100 % e-mails, once per firm, month and level, even with several app processes.
  await qi.createTable(
    'billing_usage_notices',
    {
      organization_id: { ...orgRef, primaryKey: true },
      month: { type: DataTypes.CHAR(7), allowNull: false, primaryKey: true },
      level: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, primaryKey: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );

  // Runs past the plan's monthly allowance are stored like any other, and marked.
  await qi.addColumn('runs', 'over_allowance', {
    type: DataTypes.BOOLEAN,
    allowNull: false,
    defaultValue: false,
  });
};

export const down: Migration = async ({ context: qi }) => {
  // Typed raw query: removeColumn's own untyped one fails with the mariadb connector.
  await qi.sequelize.query('ALTER TABLE runs DROP COLUMN over_allowance', { type: QueryTypes.RAW });
  await qi.dropTable('billing_usage_notices');
  await qi.dropTable('billing_events');
  await qi.dropTable('billing_accounts');
};
