import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { jsonColumn } from '../db/json-column';

export class AuditEvent extends Model<
  InferAttributes<AuditEvent>,
  InferCreationAttributes<AuditEvent>
> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare action: string;
  declare entity: string;
  declare entityId: string;
  declare before: unknown;
  declare after: unknown;
  declare requestId: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEventModel(sequelize: Sequelize): void {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      actorId: DataTypes.INTEGER,
      action: { type: DataTypes.STRING(24), allowNull: false },
      entity: { type: DataTypes.STRING(32), allowNull: false },
      entityId: { type: DataTypes.STRING(64), allowNull: false },
      before: jsonColumn('before'),
      after: jsonColumn('after'),
      requestId: DataTypes.STRING(64),
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'audit_events', underscored: true, updatedAt: false },
  );
}
