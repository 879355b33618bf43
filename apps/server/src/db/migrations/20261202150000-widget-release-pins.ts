import { DataTypes, QueryTypes } from 'sequelize';
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
  // Raw DDL with a type: Sequelize 6's removeColumn runs an untyped query that fails with the mariadb 3 connector.
  await qi.sequelize.query('ALTER TABLE widgets DROP COLUMN release_pin', { type: QueryTypes.UPDATE });
};
