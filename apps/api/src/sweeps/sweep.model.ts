import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { jsonColumn } from '../db/json-column';

export class Sweep extends Model<InferAttributes<Sweep>, InferCreationAttributes<Sweep>> {
  declare id: CreationOptional<number>;
  declare waferId: number;
  declare stationId: number | null;
  declare method: string;
  declare geometry: unknown;
  declare uploadedById: number;
  declare originalName: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare storageKind: string;
  declare storageKey: string;
  declare columnMapping: unknown;
  declare metadata: unknown;
  declare parseReport: unknown;
  declare pointCount: number;
  declare minTemperatureK: number | null;
  declare maxTemperatureK: number | null;
  /** Non-null exactly when the sweep is a wafer map (`SweepMapInfo`). */
  declare mapInfo: unknown;
  declare deletedAt: CreationOptional<Date | null>;
  declare deletedById: number | null;
  /** The station token a station post came with; null for an ordinary upload. */
  declare stationTokenId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One stored reading. Raw values keep the file's own columns and units in `raw`. */
export class SweepPoint extends Model<
  InferAttributes<SweepPoint>,
  InferCreationAttributes<SweepPoint>
> {
  declare id: CreationOptional<number>;
  declare sweepId: number;
  declare sequence: number;
  declare sourceRow: number;
  declare temperatureK: number;
  declare currentA: number | null;
  declare voltageV: number | null;
  declare resistanceOhm: number | null;
  declare sheetResistanceOhmSq: number | null;
  declare resistivityOhmCm: number;
  declare raw: unknown;
  declare flags: string;
  declare siteXMm: CreationOptional<number | null>;
  declare siteYMm: CreationOptional<number | null>;
  declare siteLabel: CreationOptional<string | null>;
  declare edgeFactor: CreationOptional<number | null>;
  /** Quantities beyond resistivity (`PointQuantities`), null for most sweeps. */
  declare quantities: CreationOptional<unknown>;
  declare leg: CreationOptional<number | null>;
}

/** Raw upload bytes, kept byte for byte (the database storage implementation). */
export class RawFile extends Model<InferAttributes<RawFile>, InferCreationAttributes<RawFile>> {
  declare storageKey: string;
  declare sizeBytes: number;
  declare content: Buffer;
  declare createdAt: CreationOptional<Date>;
}

export function initSweepModels(sequelize: Sequelize): void {
  Sweep.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      waferId: { type: DataTypes.INTEGER, allowNull: false },
      stationId: DataTypes.INTEGER,
      method: { type: DataTypes.STRING(24), allowNull: false },
      geometry: jsonColumn('geometry', false),
      uploadedById: { type: DataTypes.INTEGER, allowNull: false },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      storageKind: { type: DataTypes.STRING(8), allowNull: false },
      storageKey: { type: DataTypes.STRING(255), allowNull: false },
      columnMapping: jsonColumn('columnMapping', false),
      metadata: jsonColumn('metadata'),
      parseReport: jsonColumn('parseReport', false),
      pointCount: { type: DataTypes.INTEGER, allowNull: false },
      stationTokenId: DataTypes.INTEGER,
      minTemperatureK: DataTypes.DOUBLE,
      maxTemperatureK: DataTypes.DOUBLE,
      mapInfo: jsonColumn('mapInfo'),
      deletedAt: DataTypes.DATE(3),
      deletedById: DataTypes.INTEGER,
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'sweeps', underscored: true, paranoid: true },
  );
  SweepPoint.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      sweepId: { type: DataTypes.INTEGER, allowNull: false },
      sequence: { type: DataTypes.INTEGER, allowNull: false },
      sourceRow: { type: DataTypes.INTEGER, allowNull: false },
      temperatureK: { type: DataTypes.DOUBLE, allowNull: false },
      currentA: DataTypes.DOUBLE,
      voltageV: DataTypes.DOUBLE,
      resistanceOhm: DataTypes.DOUBLE,
      sheetResistanceOhmSq: DataTypes.DOUBLE,
      resistivityOhmCm: { type: DataTypes.DOUBLE, allowNull: false },
      raw: jsonColumn('raw', false),
      flags: { type: DataTypes.STRING(255), allowNull: false, defaultValue: '' },
      siteXMm: { type: DataTypes.DOUBLE, field: 'site_x_mm' },
      siteYMm: { type: DataTypes.DOUBLE, field: 'site_y_mm' },
      siteLabel: DataTypes.STRING(64),
      edgeFactor: DataTypes.DOUBLE,
      quantities: jsonColumn('quantities'),
      leg: DataTypes.SMALLINT,
    },
    { sequelize, tableName: 'sweep_points', underscored: true, timestamps: false },
  );
  RawFile.init(
    {
      storageKey: { type: DataTypes.STRING(64), primaryKey: true },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      content: { type: DataTypes.BLOB('long'), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'raw_files', underscored: true, updatedAt: false },
  );
}
