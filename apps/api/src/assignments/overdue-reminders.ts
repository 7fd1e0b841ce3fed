import { Op } from 'sequelize';
import { inTransaction } from '../db/connection';
import { todayIso } from '../db/query';
import type { Mailer } from '../mail/mailer.service';
import { overdueMail } from '../mail/templates/overdue.mail';
import { Lot } from '../lots/lot.model';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';
import { Assignment } from './assignment.model';
import { OPEN_STATES } from './assignments.service';

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Queues one reminder per overdue open task whose assignee has not been reminded today, through
 * the mail queue. Each task is claimed by moving `reminded_on` to today in one UPDATE inside the
 * transaction that queues its e-mail, so two instances running at once send it once. Answers how
 * many reminders were queued.
 */
export async function remindOverdue(
  mail: { mailer: Mailer; publicUrl: string },
  today = todayIso(),
): Promise<number> {
  const due = await Assignment.findAll({
    attributes: ['id'],
    where: {
      state: { [Op.in]: OPEN_STATES },
      dueDate: { [Op.lt]: today },
      [Op.or]: [{ remindedOn: null }, { remindedOn: { [Op.lt]: today } }],
    },
  });
  let queued = 0;
  for (const { id } of due) {
    queued += await inTransaction(async (t) => {
      const [claimed] = await Assignment.update(
        { remindedOn: today },
        {
          where: {
            id,
            state: { [Op.in]: OPEN_STATES },
            [Op.or]: [{ remindedOn: null }, { remindedOn: { [Op.lt]: today } }],
          },
          transaction: t,
        },
      );
      if (claimed !== 1) return 0;
      const a = (await Assignment.findByPk(id, { transaction: t }))!;
      const [assignee, wafer] = await Promise.all([
        User.findByPk(a.assigneeId, { transaction: t }),
        Wafer.findByPk(a.waferId, { transaction: t }),
      ]);
      const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction: t }) : null;
      if (!assignee?.active || !wafer || !lot) return 0;
      await mail.mailer.enqueue(
        overdueMail({
          to: assignee.email,
          assigneeName: assignee.name,
          assignmentId: a.id,
          task: a.task,
          dueDate: a.dueDate,
          daysLate: Math.round((Date.parse(today) - Date.parse(a.dueDate)) / DAY_MS),
          waferNumber: wafer.number,
          lotCode: lot.code,
          link: `${mail.publicUrl}/wafers/${wafer.id}`,
        }),
        t,
      );
      return 1;
    });
  }
  return queued;
}
