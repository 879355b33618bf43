import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

// Requests the embed API refused (403) because the page's origin is not one the widget allows,
// counted per widget, origin and day, so a developer sees a site that was left off the list.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('refused_origins', {
    widget_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      primaryKey: true,
      references: { model: 'widgets', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    origin: { type: DataTypes.STRING(200), allowNull: false, primaryKey: true },
    day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
    refusals: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('refused_origins');
};
