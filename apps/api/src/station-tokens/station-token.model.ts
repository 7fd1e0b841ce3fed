import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A probe station's bearer token; only its SHA-256 is stored. */
export class StationToken extends Model<
  InferAttributes<StationToken>,
  InferCreationAttributes<StationToken>
> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare label: string;
  declare prefix: string;
  declare tokenSha256: string;
  declare createdById: number;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initStationTokenModel(sequelize: Sequelize): void {
  StationToken.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      stationId: { type: DataTypes.INTEGER, allowNull: false },
      label: { type: DataTypes.STRING(100), allowNull: false },
      prefix: { type: DataTypes.STRING(16), allowNull: false },
      tokenSha256: { type: DataTypes.CHAR(64), allowNull: false, field: 'token_sha256' },
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      lastUsedAt: DataTypes.DATE(3),
      revokedAt: DataTypes.DATE(3),
      revokedById: DataTypes.INTEGER,
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'station_tokens', underscored: true },
  );
}
