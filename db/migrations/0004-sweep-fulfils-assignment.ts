import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * sweeps.assignment_id: the task a sweep fulfils (set when the assignee uploads to the wafer of
 * an open task of theirs), so a task lists the sweeps that answer it. Null for other uploads.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('sweeps', 'assignment_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'assignments', key: 'id' },
    onDelete: 'SET NULL',
  });
  await qi.addIndex('sweeps', ['assignment_id'], { name: 'sweeps_assignment' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeIndex('sweeps', 'sweeps_assignment');
  await qi.removeColumn('sweeps', 'assignment_id');
}
