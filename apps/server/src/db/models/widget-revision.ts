import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export interface WidgetChange {
  path: string;
  before: unknown;
  after: unknown;
}

export class WidgetRevision extends Model<
  InferAttributes<WidgetRevision>,
  InferCreationAttributes<WidgetRevision>
> {
  declare id: CreationOptional<number>;
  declare widgetId: number;
  declare organizationId: number;
  declare authorId: number | null;
  declare changes: WidgetChange[];
  /** The widget as it stood after this save. */
  declare snapshot: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    WidgetRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        widgetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        changes: { type: DataTypes.JSON, allowNull: false },
        snapshot: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'widget_revisions', underscored: true, updatedAt: false },
    );
  }
}
