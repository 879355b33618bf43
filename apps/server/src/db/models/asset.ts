import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ImageType } from '@wickstone/contracts';

export class Asset extends Model<InferAttributes<Asset>, InferCreationAttributes<Asset>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare contentType: ImageType;
  declare bytes: number;
  declare width: number | null;
  declare height: number | null;
  declare sha256: string;
  declare data: Buffer;
  declare uploadedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Asset.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        data: { type: DataTypes.BLOB('medium'), allowNull: false },
        uploadedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'assets', underscored: true },
    );
  }
}
