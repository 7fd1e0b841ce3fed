import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type {
  HallFactorName,
  SweepColumnOverride,
  SweepGeometryInput,
  SweepLayoutInput,
  SweepMapInput,
  SweepMethod,
} from '@rhotrace/api-types';
import { jsonColumn } from '../db/json-column';

/** The fields of one method saved beside the rest (a Hall factor, a map's site fields). */
export interface ImportMethodDetails {
  hallFactor?: number | HallFactorName;
  map?: SweepMapInput;
}

/** How files of one shape from one station are read. */
export class ImportSettings extends Model<
  InferAttributes<ImportSettings>,
  InferCreationAttributes<ImportSettings>
> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare shapeSha256: string;
  declare shapeLabel: string;
  declare method: SweepMethod;
  declare columns: SweepColumnOverride[];
  declare geometry: SweepGeometryInput;
  declare layout: SweepLayoutInput;
  declare methodDetails: ImportMethodDetails | null;
  declare savedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initImportSettingsModel(sequelize: Sequelize): void {
  ImportSettings.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      stationId: { type: DataTypes.INTEGER, allowNull: false },
      shapeSha256: { type: DataTypes.CHAR(64), allowNull: false },
      shapeLabel: { type: DataTypes.STRING(500), allowNull: false },
      method: { type: DataTypes.STRING(32), allowNull: false },
      columns: jsonColumn('columns', false),
      geometry: jsonColumn('geometry', false),
      layout: jsonColumn('layout', false),
      methodDetails: jsonColumn('methodDetails'),
      savedById: DataTypes.INTEGER,
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'import_settings', underscored: true },
  );
}
