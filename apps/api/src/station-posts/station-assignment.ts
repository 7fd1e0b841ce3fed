/**
 * The assignment a station post fulfils: an open assignment of the wafer that names the
 * station. When the sweep is stored, the assignment is done, the wafer measured, the sweep
 * attributed to the station's token and the manager who assigned it told by e-mail, all in the
 * upload's transaction.
 */
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { Assignment } from '../assignments/assignment.model';
import { OPEN_STATES } from '../assignments/assignments.service';
import { auditChange, type Actor } from '../audit/audit.service';
import { database } from '../db/connection';
import { Lot } from '../lots/lot.model';
import type { Mailer } from '../mail/mailer.service';
import { stationSweepMail } from '../mail/templates/station-sweep.mail';
import type { StationCaller } from '../station-tokens/station-tokens.service';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';

/** The oldest open assignment of `waferId` naming the caller's station (locked with `lock`). */
export function openAssignmentFor(
  caller: StationCaller,
  waferId: number,
  transaction?: Transaction,
): Promise<Assignment | null> {
  return Assignment.findOne({
    where: { waferId, stationId: caller.stationId, state: { [Op.in]: OPEN_STATES } },
    order: [
      ['dueDate', 'ASC'],
      ['id', 'ASC'],
    ],
    ...(transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {}),
  });
}

/**
 * Closes the assignment the stored sweep fulfils. Resolves with its id, or null when no open
 * assignment names the station any more (the caller then rolls everything back).
 */
export async function closeAssignment(
  caller: StationCaller,
  post: { waferId: number; sweepId: number },
  actor: Actor,
  mail: { mailer: Mailer; publicUrl: string },
  transaction: Transaction,
): Promise<number | null> {
  const assignment = await openAssignmentFor(caller, post.waferId, transaction);
  if (!assignment) return null;
  const via = {
    stationId: caller.stationId,
    stationName: caller.stationName,
    tokenId: caller.tokenId,
    tokenLabel: caller.tokenLabel,
  };
  const t = transaction;
  await database().query('UPDATE sweeps SET station_token_id = ? WHERE id = ?', {
    replacements: [caller.tokenId, post.sweepId],
    type: QueryTypes.UPDATE,
    transaction: t,
  });
  await auditChange(t, actor, 'station-post', 'sweep', post.sweepId, {
    after: { ...via, waferId: post.waferId, assignmentId: assignment.id },
  });
  const stateBefore = assignment.state;
  await assignment.update({ state: 'done' }, { transaction: t });
  await auditChange(t, actor, 'update', 'assignment', assignment.id, {
    before: { state: stateBefore },
    after: { state: 'done', sweepId: post.sweepId, via },
  });
  const wafer = await Wafer.findByPk(post.waferId, { transaction: t });
  const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction: t }) : null;
  if (wafer && wafer.state !== 'measured') {
    const waferBefore = wafer.state;
    await wafer.update({ state: 'measured' }, { transaction: t });
    await auditChange(t, actor, 'update', 'wafer', wafer.id, {
      before: { state: waferBefore },
      after: { state: 'measured', sweepId: post.sweepId, via },
    });
  }
  const manager = await User.findByPk(assignment.assignedById, { transaction: t });
  if (manager?.active && wafer && lot) {
    await mail.mailer.enqueue(
      stationSweepMail({
        to: manager.email,
        managerName: manager.name,
        stationName: caller.stationName,
        tokenLabel: caller.tokenLabel,
        assignmentId: assignment.id,
        task: assignment.task,
        waferNumber: wafer.number,
        lotCode: lot.code,
        link: `${mail.publicUrl}/wafers/${wafer.id}`,
      }),
      t,
    );
  }
  return assignment.id;
}
