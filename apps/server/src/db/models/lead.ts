import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { leadStatuses, type LeadStatus } from '@wickstone/contracts';

export class Lead extends Model<InferAttributes<Lead>, InferCreationAttributes<Lead>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare widgetId: number;
  declare runId: string | null;
  declare status: CreationOptional<LeadStatus>;
  declare name: string | null;
  declare email: string | null;
  declare company: string | null;
  declare phone: string | null;
  declare message: string | null;
  declare siteAddress: string | null;
  declare consentText: string;
  declare consentAt: Date;
  declare origin: string;
  declare sendCopy: boolean;
  declare assigneeId: CreationOptional<number | null>;
  declare erasedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Lead.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        widgetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        runId: { type: DataTypes.CHAR(36), allowNull: true },
        status: {
          type: DataTypes.ENUM(...leadStatuses),
          allowNull: false,
          defaultValue: 'new',
        },
        name: { type: DataTypes.STRING(120), allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: true },
        company: { type: DataTypes.STRING(160), allowNull: true },
        phone: { type: DataTypes.STRING(32), allowNull: true },
        message: { type: DataTypes.TEXT, allowNull: true },
        siteAddress: { type: DataTypes.STRING(300), allowNull: true },
        consentText: { type: DataTypes.STRING(600), allowNull: false },
        consentAt: { type: DataTypes.DATE(3), allowNull: false },
        origin: { type: DataTypes.STRING(200), allowNull: false },
        sendCopy: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        assigneeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        erasedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'leads', underscored: true },
    );
  }
}
