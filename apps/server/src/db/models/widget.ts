import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { widgetStatuses, type WidgetSettings, type WidgetStatus } from '@wickstone/contracts';

export class Widget extends Model<InferAttributes<Widget>, InferCreationAttributes<Widget>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare publicKey: string;
  declare name: string;
  declare calculatorId: string;
  declare status: CreationOptional<WidgetStatus>;
  declare allowedOrigins: string[];
  declare settings: WidgetSettings;
  declare release: string;
  declare releasePin: CreationOptional<string | null>;
  /** The key a rotation replaced, served until `previousKeyValidUntil` (then refused as replaced). */
  declare previousPublicKey: CreationOptional<string | null>;
  declare keyReplacedAt: CreationOptional<Date | null>;
  declare previousKeyValidUntil: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Widget.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        publicKey: { type: DataTypes.CHAR(23), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        calculatorId: { type: DataTypes.STRING(60), allowNull: false },
        status: { type: DataTypes.ENUM(...widgetStatuses), allowNull: false, defaultValue: 'draft' },
        allowedOrigins: { type: DataTypes.JSON, allowNull: false },
        settings: { type: DataTypes.JSON, allowNull: false },
        release: { type: DataTypes.STRING(40), allowNull: false },
        releasePin: { type: DataTypes.STRING(40), allowNull: true, defaultValue: null },
        previousPublicKey: { type: DataTypes.CHAR(23), allowNull: true, defaultValue: null, unique: true },
        keyReplacedAt: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
        previousKeyValidUntil: { type: DataTypes.DATE(3), allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'widgets', underscored: true },
    );
  }
}
