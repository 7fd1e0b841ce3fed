import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { WaferState } from '@rhotrace/api-types';

export class Wafer extends Model<InferAttributes<Wafer>, InferCreationAttributes<Wafer>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare number: string;
  declare thicknessCm: number | null;
  declare state: CreationOptional<WaferState>;
  declare notes: string | null;
  /** The sweep chosen to give the 23 °C value (null: the newest that reaches 23 °C). */
  declare countedSweepId: CreationOptional<number | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initWaferModel(sequelize: Sequelize): void {
  Wafer.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.STRING(32), allowNull: false },
      thicknessCm: DataTypes.DOUBLE,
      state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'received' },
      notes: DataTypes.TEXT,
      countedSweepId: DataTypes.INTEGER,
      deletedAt: DataTypes.DATE(3),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'wafers', underscored: true, paranoid: true },
  );
}
