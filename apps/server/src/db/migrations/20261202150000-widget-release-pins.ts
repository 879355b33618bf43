import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

// A widget's release pin: an exact version or a minor line (`~0.2`). `release` stays the resolved
// version the snippet points at; widgets made before pins existed have none (they stay where they are).
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('widgets', 'release_pin', {
    type: DataTypes.STRING(40),
    allowNull: true,
    defaultValue: null,
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('widgets', 'release_pin');
};
