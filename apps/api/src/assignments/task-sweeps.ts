import type { AssignmentSweepDto } from '@rhotrace/api-types';
import { QueryTypes, type Transaction } from 'sequelize';
import { Assignment } from './assignment.model';

/** The sweeps (not deleted) that fulfil each of these tasks, oldest first. */
export async function sweepsOfTasks(
  taskIds: number[],
  transaction?: Transaction,
): Promise<Map<number, AssignmentSweepDto[]>> {
  const out = new Map<number, AssignmentSweepDto[]>();
  if (taskIds.length === 0) return out;
  const rows = await Assignment.sequelize!.query<{
    id: number;
    assignment_id: number;
    original_name: string;
    created_at: Date;
  }>(
    'SELECT id, assignment_id, original_name, created_at FROM sweeps ' +
      'WHERE assignment_id IN (?) AND deleted_at IS NULL ORDER BY id',
    { replacements: [taskIds], type: QueryTypes.SELECT, transaction },
  );
  for (const r of rows) {
    const list = out.get(r.assignment_id) ?? [];
    list.push({
      id: r.id,
      originalName: r.original_name,
      createdAt: new Date(r.created_at).toISOString(),
    });
    out.set(r.assignment_id, list);
  }
  return out;
}
