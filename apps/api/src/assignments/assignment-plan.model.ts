import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { PlannerRequest, PlannerResponse } from '@rhotrace/api-types';
import { jsonColumn } from '../db/json-column';

/** The measurement plan attached to an assignment: the request and the plan computed from it. */
export class AssignmentPlan extends Model<
  InferAttributes<AssignmentPlan>,
  InferCreationAttributes<AssignmentPlan>
> {
  declare id: CreationOptional<number>;
  declare assignmentId: number;
  declare request: PlannerRequest;
  declare plan: PlannerResponse;
  declare createdById: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAssignmentPlanModel(sequelize: Sequelize): void {
  AssignmentPlan.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      assignmentId: { type: DataTypes.INTEGER, allowNull: false },
      request: jsonColumn('request', false),
      plan: jsonColumn('plan', false),
      createdById: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'assignment_plans', underscored: true },
  );
}
