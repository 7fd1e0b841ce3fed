import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A measurement plan attached to an assignment (at most one per assignment): the planner request
 * as the assigner gave it and the plan the server computed from it, both JSON in LONGTEXT (parsed
 * by the model). The plan is stored, not recomputed on read, so the technician follows exactly
 * what was assigned even if the lot, station or model later change. Deleted with its assignment.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('assignment_plans', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false },
    assignment_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      unique: true,
      references: { model: 'assignments', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    request: { type: DataTypes.TEXT('long'), allowNull: false },
    plan: { type: DataTypes.TEXT('long'), allowNull: false },
    created_by_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
      onUpdate: 'CASCADE',
    },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('assignment_plans');
}
