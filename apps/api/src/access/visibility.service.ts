/**
 * Who may see which records: the technician rule, stated once. A role with `records:see-all`
 * sees every lot, wafer and sweep; any other role (the technician) sees only wafers assigned to
 * it in a state that still shows them, the lots holding those wafers and the sweeps on them.
 * A hidden record answers 404 like a missing one, so its existence does not leak.
 *
 * Queries take a scope from here (`visibleWafers`, `visibleLots`, `visibleSweeps`,
 * `visibleFits`, or `visibleWaferSql` inside raw SQL); single reads go through `visibleWafer`,
 * `visibleLot` and `visibleSweep` (or `visibleSweepWithUploader`).
 */
import type { SessionUser } from '@rhotrace/api-types';
import { literal, Op, type Transaction, type WhereOptions } from 'sequelize';
import { notFound } from '../errors';
import { Fit } from '../fits/fit.model';
import { Lot } from '../lots/lot.model';
import { Sweep } from '../sweeps/sweep.model';
import { Wafer } from '../wafers/wafer.model';
import { assertCan, can } from './policy';
import { database } from '../db/connection';

/** Assignment states that still give a technician sight of the wafer (all but cancelled). */
const VISIBLE_ASSIGNMENT_STATES = ['assigned', 'in progress', 'done'] as const;

/** True when the user sees every record, false when only assigned wafers and what hangs on them. */
export function seesAllRecords(user: SessionUser): boolean {
  return can(user, 'records:see-all');
}

/**
 * SQL true when the wafer in column `waferColumn` is one the user may see (for raw queries that
 * join their way to a wafer). `TRUE` for roles that see everything.
 */
export function visibleWaferSql(user: SessionUser, waferColumn: string): string {
  if (seesAllRecords(user)) return 'TRUE';
  const db = database();
  const states = VISIBLE_ASSIGNMENT_STATES.map((v) => db.escape(v)).join(', ');
  return (
    `EXISTS (SELECT 1 FROM assignments AS a WHERE a.wafer_id = ${waferColumn}` +
    ` AND a.assignee_id = ${db.escape(user.id)} AND a.state IN (${states}))`
  );
}

/** Ids of the wafers (not deleted) the user may see, as a subquery. */
function visibleWaferIdsSql(user: SessionUser, select: 'id' | 'lot_id'): string {
  return (
    `(SELECT w.${select} FROM wafers AS w WHERE w.deleted_at IS NULL` +
    ` AND ${visibleWaferSql(user, 'w.id')})`
  );
}

/** A `where` on wafers keeping those the user may see. */
export function visibleWafers(user: SessionUser): WhereOptions<Wafer> {
  if (seesAllRecords(user)) return {};
  return { id: { [Op.in]: literal(visibleWaferIdsSql(user, 'id')) } };
}

/** A `where` on lots keeping those the user may see (technicians: lots holding their wafers). */
export function visibleLots(user: SessionUser): WhereOptions<Lot> {
  if (seesAllRecords(user)) return {};
  return { id: { [Op.in]: literal(visibleWaferIdsSql(user, 'lot_id')) } };
}

/** A `where` on sweeps keeping those on wafers the user may see. */
export function visibleSweeps(user: SessionUser): WhereOptions<Sweep> {
  if (seesAllRecords(user)) return {};
  return { waferId: { [Op.in]: literal(visibleWaferIdsSql(user, 'id')) } };
}

/** A `where` on fits keeping those on sweeps (not deleted) the user may see. */
export function visibleFits(user: SessionUser): WhereOptions<Fit> {
  const onWafer = seesAllRecords(user)
    ? ''
    : ` AND s.wafer_id IN ${visibleWaferIdsSql(user, 'id')}`;
  const sweeps = `(SELECT s.id FROM sweeps AS s WHERE s.deleted_at IS NULL${onWafer})`;
  return { sweepId: { [Op.in]: literal(sweeps) } };
}

/** The wafer and its lot when the user may see it; missing, deleted or hidden is 404. */
export async function visibleWafer(
  user: SessionUser,
  waferId: number,
  transaction?: Transaction,
): Promise<{ wafer: Wafer; lot: Lot }> {
  const wafer = await Wafer.findOne({
    where: { [Op.and]: [{ id: waferId }, visibleWafers(user)] },
    transaction,
  });
  const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction }) : null;
  if (!wafer || !lot) throw notFound(`Wafer ${waferId}`);
  return { wafer, lot };
}

/** A lot the user may see (technicians: only lots holding their wafers), else 404. */
export async function visibleLot(
  user: SessionUser,
  lotId: number,
  transaction?: Transaction,
): Promise<Lot> {
  const lot = await Lot.findOne({
    where: { [Op.and]: [{ id: lotId }, visibleLots(user)] },
    transaction,
  });
  if (!lot) throw notFound(`Lot ${lotId}`);
  return lot;
}

/**
 * The sweep with its uploader's name when the user may see it: one query joining the wafer and
 * lot (neither deleted) and the visibility rule. Hidden, deleted or missing is 404.
 */
export async function visibleSweepWithUploader(
  user: SessionUser,
  sweepId: number,
): Promise<{ sweep: Sweep; uploaderName: string | null }> {
  const rows = await database().query(
    'SELECT s.*, u.name AS uploader_name FROM sweeps AS s' +
      ' JOIN wafers AS w ON w.id = s.wafer_id AND w.deleted_at IS NULL' +
      ' JOIN lots AS l ON l.id = w.lot_id AND l.deleted_at IS NULL' +
      ' LEFT JOIN users AS u ON u.id = s.uploaded_by_id' +
      ` WHERE s.id = :id AND s.deleted_at IS NULL AND ${visibleWaferSql(user, 'w.id')}`,
    { replacements: { id: sweepId }, model: Sweep, mapToModel: true },
  );
  const sweep = rows[0];
  if (!sweep) throw notFound(`Sweep ${sweepId}`);
  const uploaderName = sweep.get('uploader_name');
  return { sweep, uploaderName: typeof uploaderName === 'string' ? uploaderName : null };
}

/** A sweep with the wafer and lot it belongs to, already checked for visibility. */
export interface VisibleSweep {
  sweep: Sweep;
  wafer: Wafer;
  lot: Lot;
}

/** The sweep with its wafer and lot when the user may see it (`visibleSweepWithUploader`). */
export async function visibleSweep(user: SessionUser, sweepId: number): Promise<VisibleSweep> {
  const { sweep } = await visibleSweepWithUploader(user, sweepId);
  const wafer = await Wafer.findByPk(sweep.waferId);
  const lot = wafer ? await Lot.findByPk(wafer.lotId) : null;
  // Deleted between the two reads: as hidden as if never there.
  if (!wafer || !lot) throw notFound(`Sweep ${sweepId}`);
  return { sweep, wafer, lot };
}

/**
 * The wafer a sweep may be uploaded to, with its lot: the role needs `sweeps:upload` (403) and
 * the wafer must be visible to the user (404), so a technician uploads only to assigned wafers.
 */
export async function mayUploadTo(
  user: SessionUser,
  waferId: number,
  transaction?: Transaction,
): Promise<{ wafer: Wafer; lot: Lot }> {
  assertCan(user, 'sweeps:upload');
  return visibleWafer(user, waferId, transaction);
}
