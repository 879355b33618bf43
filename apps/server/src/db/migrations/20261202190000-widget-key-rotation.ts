import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

// A key rotation keeps the replaced key, when it was replaced and until when it is still served, so
// pages with the old snippet keep working through the overlap and are then told the key was replaced.
// Keys are 21 (reference) or 23 (`wk_`) characters.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('widgets', 'previous_public_key', {
    type: DataTypes.CHAR(23),
    allowNull: true,
    defaultValue: null,
    unique: true,
  });
  await qi.addColumn('widgets', 'key_replaced_at', {
    type: DataTypes.DATE(3),
    allowNull: true,
    defaultValue: null,
  });
  await qi.addColumn('widgets', 'previous_key_valid_until', {
    type: DataTypes.DATE(3),
    allowNull: true,
    defaultValue: null,
  });
};

export const down: Migration = async ({ context: qi }) => {
  // Raw DDL with a type: Sequelize 6's removeColumn runs an untyped query that fails with the mariadb 3 connector.
  await qi.sequelize.query(
    'ALTER TABLE widgets DROP COLUMN previous_key_valid_until, DROP COLUMN key_replaced_at, DROP COLUMN previous_public_key',
    { type: QueryTypes.UPDATE },
  );
};
