import type { SessionUser } from '@rhotrace/api-types';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { Assignment } from '../assignments/assignment.model';
import { notFound } from '../errors';
import { Lot } from '../lots/lot.model';
import { Wafer } from './wafer.model';

/** Assignment states that still give a technician sight of the wafer. */
const VISIBLE_ASSIGNMENT_STATES = ['assigned', 'in progress', 'done'];

/** Ids of the wafers a technician has been assigned (any state but cancelled). */
export async function assignedWaferIds(
  userId: number,
  transaction?: Transaction,
): Promise<number[]> {
  const rows = await Assignment.findAll({
    attributes: ['waferId'],
    where: { assigneeId: userId, state: { [Op.in]: VISIBLE_ASSIGNMENT_STATES } },
    transaction,
  });
  return [...new Set(rows.map((r) => r.waferId))];
}

/**
 * The same rule as SQL, for queries that join their way to a wafer: true when the wafer in
 * column `waferColumn` is assigned to user `userId` in a state that still shows it.
 */
export function assignedWaferSql(waferColumn: string, userId: number): string {
  const db = Wafer.sequelize!;
  const states = VISIBLE_ASSIGNMENT_STATES.map((v) => db.escape(v)).join(', ');
  return (
    `EXISTS (SELECT 1 FROM assignments AS a WHERE a.wafer_id = ${waferColumn}` +
    ` AND a.assignee_id = ${db.escape(userId)} AND a.state IN (${states}))`
  );
}

/**
 * A `where` clause limiting wafers to those the user may see: everything for every role but
 * technicians, who see only wafers assigned to them.
 */
export async function visibleWaferWhere(user: SessionUser): Promise<WhereOptions<Wafer>> {
  if (user.role !== 'technician') return {};
  return { id: { [Op.in]: await assignedWaferIds(user.id) } };
}

/**
 * The wafer and its lot when the user may see it. A missing wafer and a wafer hidden from a
 * technician both answer 404, so existence does not leak.
 */
export async function visibleWafer(
  user: SessionUser,
  waferId: number,
  transaction?: Transaction,
): Promise<{ wafer: Wafer; lot: Lot }> {
  const wafer = await Wafer.findByPk(waferId, { transaction });
  const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction }) : null;
  if (!wafer || !lot) throw notFound(`Wafer ${waferId}`);
  if (user.role === 'technician') {
    const ids = await assignedWaferIds(user.id, transaction);
    if (!ids.includes(waferId)) throw notFound(`Wafer ${waferId}`);
  }
  return { wafer, lot };
}
