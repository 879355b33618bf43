import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { unitSystems, type SheetProject, type UnitSystem } from '@wickstone/contracts';

/** What calc-core gave, kept as JSON: outputs, warnings, band, version, input hash; rows stored before runs dropped the working also hold it (see runs/working.ts). */
export type StoredResult = Record<string, unknown>;

export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: string;
  declare organizationId: number;
  declare widgetId: number;
  declare calculatorId: string;
  declare origin: string;
  declare pageUrl: string | null;
  declare release: string;
  declare calcVersion: string;
  declare unitSystem: UnitSystem;
  /** Numbers, choice values and table rows (a list of cells per row), as the browser sent them. */
  declare inputs: Record<string, number | string | Record<string, unknown>[]>;
  declare clientResult: StoredResult;
  declare serverResult: StoredResult | null;
  declare warningCodes: string[];
  declare hasWarning: boolean;
  declare agreed: boolean;
  declare mismatch: Record<string, unknown> | null;
  declare inputHash: string;
  declare bodyHash: string;
  /** The project block the visitor filled before downloading the sheet (reprinted on later copies). */
  declare sheetProject: CreationOptional<SheetProject | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Run.init(
      {
        id: { type: DataTypes.CHAR(36), primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        widgetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        calculatorId: { type: DataTypes.STRING(60), allowNull: false },
        origin: { type: DataTypes.STRING(200), allowNull: false },
        pageUrl: { type: DataTypes.STRING(2000), allowNull: true },
        release: { type: DataTypes.STRING(40), allowNull: false },
        calcVersion: { type: DataTypes.STRING(40), allowNull: false },
        unitSystem: { type: DataTypes.ENUM(...unitSystems), allowNull: false },
        inputs: { type: DataTypes.JSON, allowNull: false },
        clientResult: { type: DataTypes.JSON, allowNull: false },
        serverResult: { type: DataTypes.JSON, allowNull: true },
        warningCodes: { type: DataTypes.JSON, allowNull: false },
        hasWarning: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        agreed: { type: DataTypes.BOOLEAN, allowNull: false },
        mismatch: { type: DataTypes.JSON, allowNull: true },
        inputHash: { type: DataTypes.STRING(128), allowNull: false },
        bodyHash: { type: DataTypes.CHAR(64), allowNull: false },
        sheetProject: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'runs', underscored: true, updatedAt: false },
    );
  }
}
