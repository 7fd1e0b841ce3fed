import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare material: string;
  declare dopant: string | null;
  declare dopantType: 'n' | 'p' | null;
  declare orientation: string | null;
  declare diameterCm: number | null;
  declare thicknessCm: number | null;
  /** +/- thickness tolerance (half-width), cm; null when not stated. */
  declare thicknessToleranceCm: number | null;
  declare supplier: string | null;
  declare receivedOn: string | null;
  declare specMinOhmCm: number | null;
  declare specMaxOhmCm: number | null;
  declare notes: string | null;
  declare createdById: number | null;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initLotModel(sequelize: Sequelize): void {
  Lot.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      code: { type: DataTypes.STRING(64), allowNull: false },
      material: { type: DataTypes.STRING(16), allowNull: false },
      dopant: DataTypes.STRING(8),
      dopantType: DataTypes.STRING(1),
      orientation: DataTypes.STRING(16),
      diameterCm: DataTypes.DOUBLE,
      thicknessCm: DataTypes.DOUBLE,
      thicknessToleranceCm: DataTypes.DOUBLE,
      supplier: DataTypes.STRING(200),
      receivedOn: DataTypes.DATEONLY,
      specMinOhmCm: DataTypes.DOUBLE,
      specMaxOhmCm: DataTypes.DOUBLE,
      notes: DataTypes.TEXT,
      createdById: DataTypes.INTEGER,
      deletedAt: DataTypes.DATE(3),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'lots', underscored: true, paranoid: true },
  );
}
