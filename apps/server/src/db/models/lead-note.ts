import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user.js';

/** One dated note on an enquiry, by a member (null once that member's account is gone). */
export class LeadNote extends Model<InferAttributes<LeadNote>, InferCreationAttributes<LeadNote>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare leadId: number;
  declare authorUserId: number | null;
  declare body: string;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    LeadNote.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        leadId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        authorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'lead_notes', underscored: true, updatedAt: false },
    );
  }
}
