import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

const table = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable(
    'runs',
    {
      // The id the visitor's browser made: the key that makes a retried report land once.
      id: { type: DataTypes.CHAR(36), primaryKey: true },
      organization_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'organizations', key: 'id' },
        onDelete: 'CASCADE',
      },
      widget_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'widgets', key: 'id' },
        onDelete: 'CASCADE',
      },
      calculator_id: { type: DataTypes.STRING(60), allowNull: false },
      origin: { type: DataTypes.STRING(200), allowNull: false },
      page_url: { type: DataTypes.STRING(2000), allowNull: true },
      release: { type: DataTypes.STRING(40), allowNull: false },
      calc_version: { type: DataTypes.STRING(40), allowNull: false },
      unit_system: { type: DataTypes.ENUM('si', 'us'), allowNull: false },
      inputs: { type: DataTypes.JSON, allowNull: false },
      client_result: { type: DataTypes.JSON, allowNull: false },
      server_result: { type: DataTypes.JSON, allowNull: true },
      warning_codes: { type: DataTypes.JSON, allowNull: false },
      has_warning: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      agreed: { type: DataTypes.BOOLEAN, allowNull: false },
      mismatch: { type: DataTypes.JSON, allowNull: true },
      input_hash: { type: DataTypes.STRING(128), allowNull: false },
      // SHA-256 of the report as sent: the same id with another body is refused, not overwritten.
      body_hash: { type: DataTypes.CHAR(64), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );
  await qi.addIndex('runs', ['organization_id', 'created_at']);
  await qi.addIndex('runs', ['organization_id', 'widget_id', 'created_at']);

  await qi.createTable(
    'leads',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organization_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'organizations', key: 'id' },
        onDelete: 'CASCADE',
      },
      widget_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'widgets', key: 'id' },
        onDelete: 'CASCADE',
      },
      // Unlinked (null) when the run is purged; the run stays when the lead's personal data is erased.
      run_id: { type: DataTypes.CHAR(36), allowNull: true },
      status: {
        type: DataTypes.ENUM('new', 'contacted', 'qualified', 'closed'),
        allowNull: false,
        defaultValue: 'new',
      },
      name: { type: DataTypes.STRING(120), allowNull: true },
      email: { type: DataTypes.STRING(254), allowNull: true },
      company: { type: DataTypes.STRING(160), allowNull: true },
      phone: { type: DataTypes.STRING(32), allowNull: true },
      message: { type: DataTypes.TEXT, allowNull: true },
      site_address: { type: DataTypes.STRING(300), allowNull: true },
      consent_text: { type: DataTypes.STRING(600), allowNull: false },
      consent_at: { type: DataTypes.DATE(3), allowNull: false },
      origin: { type: DataTypes.STRING(200), allowNull: false },
      send_copy: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      assignee_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      erased_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );
  await qi.addIndex('leads', ['organization_id', 'created_at']);
  await qi.addIndex('leads', ['run_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('leads');
  await qi.dropTable('runs');
};
