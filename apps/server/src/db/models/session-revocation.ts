import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A session (the JWT's `sid`, shared by all its renewals) that was signed out before it ran out. */
export class SessionRevocation extends Model<
  InferAttributes<SessionRevocation>,
  InferCreationAttributes<SessionRevocation>
> {
  declare sid: string;
  declare expiresAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SessionRevocation.init(
      {
        sid: { type: DataTypes.CHAR(32), primaryKey: true },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'session_revocations', underscored: true, updatedAt: false },
    );
  }
}
