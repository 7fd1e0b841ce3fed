import type { FitDto } from '@rhotrace/api-types';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { jsonColumn } from '../db/json-column';

/** A stored fit; its JSON columns hold the `FitDto` fields of the same names. */
export class Fit extends Model<InferAttributes<Fit>, InferCreationAttributes<Fit>> {
  declare id: CreationOptional<number>;
  declare sweepId: number;
  declare kind: FitDto['kind'];
  declare inputs: FitDto['inputs'];
  declare windowMinK: number | null;
  declare windowMaxK: number | null;
  declare parameters: FitDto['parameters'];
  declare standardErrors: FitDto['standardErrors'];
  declare confidenceIntervals: FitDto['confidenceIntervals'];
  declare goodness: FitDto['goodness'];
  declare residuals: FitDto['residuals'];
  declare converged: boolean;
  declare reason: string | null;
  declare reading: string | null;
  /** Null on fits stored before dwell steps (and on the columns below likewise). */
  declare stepCount: number | null;
  declare excludedSequences: FitDto['excludedSequences'] | null;
  declare interpretation: FitDto['interpretation'];
  declare curvature: FitDto['curvature'];
  declare warnings: FitDto['warnings'] | null;
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
      stepCount: DataTypes.INTEGER,
      excludedSequences: jsonColumn('excludedSequences'),
      interpretation: jsonColumn('interpretation'),
      curvature: jsonColumn('curvature'),
      warnings: jsonColumn('warnings'),
      modelVersion: { type: DataTypes.STRING(96), allowNull: false },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      deletedAt: DataTypes.DATE(3),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'fits', underscored: true, paranoid: true },
  );
}
