import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { Assignment } from '../assignments/assignment.model';
import { OPEN_STATES } from '../assignments/assignments.service';
import type { Actor } from '../audit/audit.service';
import { auditChange } from '../audit/audit.service';
import { unprocessable } from '../errors';
import { User } from './user.model';

/**
 * Hands a person's open tasks (assigned or in progress) to `toUserId` inside the deactivation's
 * transaction, one audit event per task. The new assignee must be another active account (as for
 * any assignment; 422 naming `reassignTo` otherwise). Answers how many tasks moved.
 */
export async function handOverOpenTasks(
  t: Transaction,
  fromUserId: number,
  toUserId: number,
  actor: Actor,
): Promise<number> {
  const field = (problem: string) =>
    unprocessable(`reassignTo ${problem}`, [{ field: 'body.reassignTo', problem }]);
  if (toUserId === fromUserId) throw field('must be another person');
  const to = await User.findByPk(toUserId, { transaction: t });
  if (!to) throw field(`names no account (${toUserId})`);
  if (!to.active) throw field(`names a deactivated account (${to.name})`);
  const open = await Assignment.findAll({
    where: { assigneeId: fromUserId, state: { [Op.in]: OPEN_STATES } },
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
  for (const task of open) {
    const before = { assigneeId: task.assigneeId, state: task.state };
    await task.update({ assigneeId: toUserId }, { transaction: t });
    await auditChange(t, actor, 'update', 'assignment', task.id, {
      before,
      after: { assigneeId: toUserId, state: task.state },
    });
  }
  return open.length;
}
