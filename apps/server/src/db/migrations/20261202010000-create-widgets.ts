import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

const table = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const orgRef = {
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model: 'organizations', key: 'id' },
  onDelete: 'CASCADE',
};

export const up: Migration = async ({ context: qi }) => {
  // Logos: small images (≤ 512 KB, checked by content) kept in the database beside the widget
  // settings that use them, so a backup of one holds both.
  await qi.createTable(
    'assets',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organization_id: orgRef,
      content_type: { type: DataTypes.STRING(40), allowNull: false },
      bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      data: { type: DataTypes.BLOB('medium'), allowNull: false },
      uploaded_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      ...timestamps,
    },
    table,
  );
  await qi.addIndex('assets', ['organization_id', 'sha256']);

  await qi.createTable(
    'widgets',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organization_id: orgRef,
      public_key: { type: DataTypes.CHAR(23), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      calculator_id: { type: DataTypes.STRING(60), allowNull: false },
      status: { type: DataTypes.ENUM('draft', 'live', 'paused'), allowNull: false, defaultValue: 'draft' },
      allowed_origins: { type: DataTypes.JSON, allowNull: false },
      settings: { type: DataTypes.JSON, allowNull: false },
      release: { type: DataTypes.STRING(40), allowNull: false },
      ...timestamps,
    },
    table,
  );
  await qi.addIndex('widgets', ['organization_id', 'id']);

  await qi.createTable(
    'widget_revisions',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      widget_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'widgets', key: 'id' },
        onDelete: 'CASCADE',
      },
      organization_id: orgRef,
      author_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      changes: { type: DataTypes.JSON, allowNull: false },
      snapshot: { type: DataTypes.JSON, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );
  await qi.addIndex('widget_revisions', ['widget_id', 'id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('widget_revisions');
  await qi.dropTable('widgets');
  await qi.dropTable('assets');
};
