import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

/**
 * Rate-limit and sign-in throttle counters, shared by every server process over the one database
 * (a counter kept in one process's memory would let N processes allow N times the limit).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable(
    'rate_limit_counters',
    {
      // sha256 of the counter's key (which can hold an e-mail address): bounded, and no address stored.
      key_hash: { type: DataTypes.CHAR(64).BINARY, primaryKey: true },
      hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      window_ends_at: { type: DataTypes.DATE(3), allowNull: false },
      last_hit_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { charset: 'ascii', collate: 'ascii_bin' },
  );
  // The sweep of ended windows.
  await qi.addIndex('rate_limit_counters', ['window_ends_at'], { name: 'rate_limit_counters_ends' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('rate_limit_counters');
};
