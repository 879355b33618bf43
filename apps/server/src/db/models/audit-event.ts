import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { AuditEntry } from '@wickstone/contracts';
import type { Organization } from './organization.js';
import type { User } from './user.js';

export type AuditEventType = AuditEntry['type'];

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']> | null;
  declare type: AuditEventType;
  declare actorUserId: ForeignKey<User['id']> | null;
  declare subject: string | null;
  declare ip: string | null;
  declare details: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        type: { type: DataTypes.STRING(40), allowNull: false },
        subject: { type: DataTypes.STRING(254), allowNull: true },
        ip: { type: DataTypes.STRING(45), allowNull: true },
        details: {
          type: DataTypes.TEXT,
          allowNull: false,
          get(): Record<string, unknown> {
            const raw = this.getDataValue('details') as unknown;
            if (typeof raw !== 'string') return (raw as Record<string, unknown>) ?? {};
            try {
              return JSON.parse(raw) as Record<string, unknown>;
            } catch {
              return {};
            }
          },
          set(value: Record<string, unknown>) {
            this.setDataValue('details', JSON.stringify(value ?? {}) as unknown as Record<string, unknown>);
          },
        },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'audit_events', underscored: true, updatedAt: false },
    );
  }
}
