import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { StationSensor, Thermometer } from '@rhotrace/api-types';
import { jsonColumn } from '../db/json-column';

export class Station extends Model<InferAttributes<Station>, InferCreationAttributes<Station>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare probeSpacingCm: number;
  declare tipRadiusCm: number | null;
  declare thermometer: Thermometer;
  declare rtdR0Ohm: number | null;
  declare sensor: CreationOptional<StationSensor | null>;
  declare minTemperatureK: number;
  declare maxTemperatureK: number;
  declare calibratedOn: string | null;
  declare probeSpacingToleranceCm: CreationOptional<number | null>;
  declare temperatureToleranceK: CreationOptional<number | null>;
  declare notes: string | null;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initStationModel(sequelize: Sequelize): void {
  Station.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(100), allowNull: false },
      probeSpacingCm: { type: DataTypes.DOUBLE, allowNull: false },
      tipRadiusCm: DataTypes.DOUBLE,
      thermometer: { type: DataTypes.STRING(16), allowNull: false },
      rtdR0Ohm: DataTypes.DOUBLE,
      sensor: jsonColumn('sensor'),
      minTemperatureK: { type: DataTypes.DOUBLE, allowNull: false },
      maxTemperatureK: { type: DataTypes.DOUBLE, allowNull: false },
      calibratedOn: DataTypes.DATEONLY,
      probeSpacingToleranceCm: DataTypes.DOUBLE,
      temperatureToleranceK: DataTypes.DOUBLE,
      notes: DataTypes.TEXT,
      deletedAt: DataTypes.DATE(3),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'stations', underscored: true, paranoid: true },
  );
}
