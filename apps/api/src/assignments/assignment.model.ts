import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { AssignmentState } from '@rhotrace/api-types';

export class Assignment extends Model<
  InferAttributes<Assignment>,
  InferCreationAttributes<Assignment>
> {
  declare id: CreationOptional<number>;
  declare waferId: number;
  declare assigneeId: number;
  declare assignedById: number;
  declare task: string;
  declare dueDate: string;
  declare state: CreationOptional<AssignmentState>;
  declare notes: string | null;
  /** The probe station to measure on; its token may post the sweep. */
  declare stationId: CreationOptional<number | null>;
  /** The day the assignee was last reminded of this task being overdue (null: never). */
  declare remindedOn: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAssignmentModel(sequelize: Sequelize): void {
  Assignment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      waferId: { type: DataTypes.INTEGER, allowNull: false },
      assigneeId: { type: DataTypes.INTEGER, allowNull: false },
      assignedById: { type: DataTypes.INTEGER, allowNull: false },
      task: { type: DataTypes.STRING(500), allowNull: false },
      dueDate: { type: DataTypes.DATEONLY, allowNull: false },
      state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'assigned' },
      notes: DataTypes.TEXT,
      stationId: DataTypes.INTEGER,
      remindedOn: DataTypes.DATEONLY,
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'assignments', underscored: true },
  );
}
