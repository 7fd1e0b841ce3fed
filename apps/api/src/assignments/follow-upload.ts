/**
 * States follow the work: when the assignee of an open task uploads a sweep to its wafer, the
 * task moves from assigned to in progress, the sweep is recorded as fulfilling it, and the wafer
 * becomes measured — inside the upload's transaction, each change in the audit trail.
 */
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { Wafer } from '../wafers/wafer.model';
import { Assignment } from './assignment.model';
import { OPEN_STATES } from './assignment-dto';

/** Wafer states an upload by the assignee moves on to `measured`. */
const BEFORE_MEASURED = ['received', 'queued', 'measuring'];

/** Moves the uploader's open tasks on this wafer and the wafer itself along; answers the task ids. */
export async function followUpload(
  actor: Actor,
  waferId: number,
  sweepId: number,
  t: Transaction,
): Promise<number[]> {
  const tasks = await Assignment.findAll({
    where: { waferId, assigneeId: actor.id, state: { [Op.in]: OPEN_STATES } },
    order: [['dueDate', 'ASC']],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  if (tasks.length === 0) return [];
  for (const task of tasks) {
    if (task.state !== 'assigned') continue;
    await task.update({ state: 'in progress' }, { transaction: t });
    await auditChange(t, actor, 'update', 'assignment', task.id, {
      before: { state: 'assigned' },
      after: { state: 'in progress', sweepId },
    });
  }
  // The sweep answers the task due first.
  await Assignment.sequelize!.query('UPDATE sweeps SET assignment_id = ? WHERE id = ?', {
    replacements: [tasks[0]!.id, sweepId],
    type: QueryTypes.UPDATE,
    transaction: t,
  });
  const wafer = await Wafer.findByPk(waferId, { transaction: t });
  if (wafer && BEFORE_MEASURED.includes(wafer.state)) {
    const before = wafer.state;
    await wafer.update({ state: 'measured' }, { transaction: t });
    await auditChange(t, actor, 'update', 'wafer', wafer.id, {
      before: { state: before },
      after: { state: 'measured', sweepId },
    });
  }
  return tasks.map((task) => task.id);
}
