import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Settings an organisation's owners and admins choose; one row per organisation, made on first change. */
export class OrganizationSetting extends Model<
  InferAttributes<OrganizationSetting>,
  InferCreationAttributes<OrganizationSetting>
> {
  declare organizationId: number;
  /** Runs and leads older than this many months are purged daily; null keeps them. */
  declare retentionMonths: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    OrganizationSetting.init(
      {
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        retentionMonths: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'organization_settings', underscored: true },
    );
  }
}
