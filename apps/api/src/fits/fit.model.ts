import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { jsonColumn } from '../db/json-column';

export class Fit extends Model<InferAttributes<Fit>, InferCreationAttributes<Fit>> {
  declare id: CreationOptional<number>;
  declare sweepId: number;
  declare kind: string;
  declare inputs: unknown;
  declare windowMinK: number | null;
  declare windowMaxK: number | null;
  declare parameters: unknown;
  declare standardErrors: unknown;
  declare confidenceIntervals: unknown;
  declare goodness: unknown;
  declare residuals: unknown;
  declare converged: boolean;
  declare reason: string | null;
  declare reading: string | null;
  declare modelVersion: string;
  declare createdById: number;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initFitModel(sequelize: Sequelize): void {
  Fit.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      sweepId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      inputs: jsonColumn('inputs', false),
      windowMinK: DataTypes.DOUBLE,
      windowMaxK: DataTypes.DOUBLE,
      parameters: jsonColumn('parameters', false),
      standardErrors: jsonColumn('standardErrors', false),
      confidenceIntervals: jsonColumn('confidenceIntervals', false),
      goodness: jsonColumn('goodness', false),
      residuals: jsonColumn('residuals', false),
      converged: { type: DataTypes.BOOLEAN, allowNull: false },
      reason: DataTypes.TEXT,
      reading: DataTypes.TEXT,
      modelVersion: { type: DataTypes.STRING(32), allowNull: false },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      deletedAt: DataTypes.DATE(3),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'fits', underscored: true, paranoid: true },
  );
}
