import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable(
    'audit_events',
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      // Null only for events that belong to no organisation (a failed sign-in for an unknown address).
      organization_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: true,
        references: { model: 'organizations', key: 'id' },
        onDelete: 'CASCADE',
        onUpdate: 'CASCADE',
      },
      type: { type: DataTypes.STRING(40), allowNull: false },
      actor_user_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: true,
        references: { model: 'users', key: 'id' },
        onDelete: 'SET NULL',
        onUpdate: 'CASCADE',
      },
      subject: { type: DataTypes.STRING(254), allowNull: true },
      ip: { type: DataTypes.STRING(45), allowNull: true },
      // JSON text; parsed by the model (MariaDB's JSON type is LONGTEXT, and drivers differ in what they return).
      details: { type: DataTypes.TEXT, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  // The audit page reads one organisation's events newest first.
  await qi.addIndex('audit_events', ['organization_id', 'id'], { name: 'audit_events_org_id' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('audit_events');
};
