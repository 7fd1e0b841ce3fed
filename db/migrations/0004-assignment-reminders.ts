import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * assignments.reminded_on: the day the assignee was last reminded of the overdue task (null:
 * never). A reminder is claimed by moving this date to today in one UPDATE, so each overdue task
 * is reminded once a day however many server instances run the chore.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('assignments', 'reminded_on', { type: DataTypes.DATEONLY, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('assignments', 'reminded_on');
}
