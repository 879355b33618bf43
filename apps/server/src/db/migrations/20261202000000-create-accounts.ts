import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator.js';

const table = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const ref = (model: string, onDelete: 'CASCADE' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
// Frozen here rather than imported: a migration must keep meaning what it meant when it ran.
const roles = ['owner', 'admin', 'analyst', 'developer'];

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable(
    'users',
    {
      id,
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.CHAR(60), allowNull: false },
      // Bumped by a password change or reset: every session signed before it stops working.
      session_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      ...timestamps,
    },
    table,
  );

  await qi.createTable(
    'memberships',
    {
      id,
      organization_id: ref('organizations', 'CASCADE'),
      user_id: ref('users', 'CASCADE'),
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      ...timestamps,
    },
    table,
  );
  await qi.addIndex('memberships', ['organization_id', 'user_id'], {
    unique: true,
    name: 'memberships_org_user',
  });
  await qi.addIndex('memberships', ['user_id'], { name: 'memberships_user' });

  await qi.createTable(
    'invitations',
    {
      id,
      organization_id: ref('organizations', 'CASCADE'),
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      // SHA-256 of the token in the link; the token itself is never stored.
      token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      invited_by_user_id: ref('users', 'SET NULL', true),
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      accepted_at: { type: DataTypes.DATE(3), allowNull: true },
      ...timestamps,
    },
    table,
  );
  await qi.addIndex('invitations', ['organization_id', 'email'], { name: 'invitations_org_email' });

  await qi.createTable(
    'password_resets',
    {
      id,
      user_id: ref('users', 'CASCADE'),
      token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );
  await qi.addIndex('password_resets', ['user_id'], { name: 'password_resets_user' });

  // A signed-out session (its `sid` claim), kept until the session could no longer be renewed anyway.
  await qi.createTable(
    'session_revocations',
    {
      sid: { type: DataTypes.CHAR(32), primaryKey: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    table,
  );
  await qi.addIndex('session_revocations', ['expires_at'], { name: 'session_revocations_expires' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('session_revocations');
  await qi.dropTable('password_resets');
  await qi.dropTable('invitations');
  await qi.dropTable('memberships');
  await qi.dropTable('users');
};
