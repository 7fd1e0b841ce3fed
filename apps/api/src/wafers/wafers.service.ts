import type { Page, SessionUser, WaferDto, WaferState } from '@rhotrace/api-types';
import { Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import { visibleLot, visibleWafer, visibleWafers } from '../access/visibility.service';
import { Assignment } from '../assignments/assignment.model';
import { auditChange, type Actor } from '../audit/audit.service';
import { conflict, notFound, unprocessable } from '../errors';
import { Lot } from '../lots/lot.model';
import { likePattern, orderFrom } from '../db/query';
import { Sweep } from '../sweeps/sweep.model';
import { Wafer } from './wafer.model';
import { inTransaction } from '../db/connection';

/** The API's view of a wafer; `lotCode` when the lot is at hand. */
export function toWaferDto(wafer: Wafer, lotCode?: string): WaferDto {
  return {
    id: wafer.id,
    lotId: wafer.lotId,
    ...(lotCode === undefined ? {} : { lotCode }),
    number: wafer.number,
    thicknessCm: wafer.thicknessCm,
    state: wafer.state,
    notes: wafer.notes,
    countedSweepId: wafer.countedSweepId ?? null,
    createdAt: wafer.createdAt.toISOString(),
    updatedAt: wafer.updatedAt.toISOString(),
  };
}

export interface WaferInput {
  number: string;
  thicknessCm: number | null;
  state?: WaferState;
  notes: string | null;
  /** The sweep that counts for the 23 °C value; null returns to the newest. */
  countedSweepId?: number | null;
}

export interface WaferListOptions {
  page: number;
  pageSize: number;
  sort?: string;
  q?: string;
  lotId?: number;
  state?: WaferState;
  material?: string;
}

/** A page of the wafers the user may see, across lots (or in one lot), each with its lot code. */
export async function listWafers(
  user: SessionUser,
  options: WaferListOptions,
): Promise<Page<WaferDto>> {
  const where: WhereOptions<Wafer>[] = [visibleWafers(user)];
  if (options.lotId !== undefined) where.push({ lotId: options.lotId });
  if (options.state) where.push({ state: options.state });
  if (options.material) {
    const lots = await Lot.findAll({ attributes: ['id'], where: { material: options.material } });
    where.push({ lotId: { [Op.in]: lots.map((l) => l.id) } });
  }
  if (options.q) {
    const like = likePattern(options.q);
    const lots = await Lot.findAll({ attributes: ['id'], where: { code: { [Op.like]: like } } });
    where.push({
      [Op.or]: [
        { number: { [Op.like]: like } },
        { notes: { [Op.like]: like } },
        { lotId: { [Op.in]: lots.map((l) => l.id) } },
      ],
    });
  }
  const { rows, count } = await Wafer.findAndCountAll({
    where: { [Op.and]: where },
    order: orderFrom(options.sort, 'lotId'),
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  const lotIds = [...new Set(rows.map((w) => w.lotId))];
  const lots = lotIds.length ? await Lot.findAll({ where: { id: { [Op.in]: lotIds } } }) : [];
  const codes = new Map(lots.map((l) => [l.id, l.code]));
  return {
    items: rows.map((w) => toWaferDto(w, codes.get(w.lotId) ?? '')),
    total: count,
    page: options.page,
    pageSize: options.pageSize,
  };
}

/** The wafers of one lot the user may see (404 when the lot is hidden or missing). */
export async function listLotWafers(
  user: SessionUser,
  lotId: number,
  options: Omit<WaferListOptions, 'lotId' | 'material'>,
): Promise<Page<WaferDto>> {
  await visibleLot(user, lotId);
  return listWafers(user, { ...options, lotId });
}

/** One wafer with its lot code (404 for technicians not assigned to it). */
export async function getWafer(user: SessionUser, id: number): Promise<WaferDto> {
  const { wafer, lot } = await visibleWafer(user, id);
  return toWaferDto(wafer, lot.code);
}

function duplicateNumber(error: unknown, number: string | undefined): never {
  if (error instanceof UniqueConstraintError) {
    throw conflict(`This lot already has a wafer numbered "${number}"`, { field: 'number' });
  }
  throw error;
}

/** Adds a wafer to a lot, with its audit event. */
export async function createWafer(
  lotId: number,
  input: WaferInput,
  actor: Actor,
): Promise<WaferDto> {
  try {
    return await inTransaction(async (t) => {
      const lot = await Lot.findByPk(lotId, { transaction: t });
      if (!lot) throw notFound(`Lot ${lotId}`);
      const wafer = await Wafer.create({ ...input, lotId }, { transaction: t });
      const dto = toWaferDto(wafer, lot.code);
      await auditChange(t, actor, 'create', 'wafer', wafer.id, { after: dto });
      return dto;
    });
  } catch (error) {
    return duplicateNumber(error, input.number);
  }
}

/** Changes a wafer's number, measured thickness, state or notes. */
export async function updateWafer(
  id: number,
  changes: Partial<WaferInput>,
  actor: Actor,
): Promise<WaferDto> {
  try {
    return await inTransaction(async (t) => {
      const wafer = await Wafer.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction: t }) : null;
      if (!wafer || !lot) throw notFound(`Wafer ${id}`);
      const before = toWaferDto(wafer, lot.code);
      if (changes.countedSweepId != null) {
        const sweep = await Sweep.findOne({
          where: { id: changes.countedSweepId, waferId: id },
          transaction: t,
        });
        if (!sweep) {
          throw unprocessable(`Sweep ${changes.countedSweepId} is not a sweep of this wafer`, [
            { field: 'body.countedSweepId', problem: 'is not a sweep of this wafer' },
          ]);
        }
      }
      await wafer.update(changes, { transaction: t });
      const dto = toWaferDto(wafer, lot.code);
      await auditChange(t, actor, 'update', 'wafer', id, { before, after: dto });
      return dto;
    });
  } catch (error) {
    return duplicateNumber(error, changes.number);
  }
}

/** Soft-deletes a wafer without sweeps (409 otherwise) and cancels its open assignments. */
export async function deleteWafer(id: number, actor: Actor): Promise<void> {
  await inTransaction(async (t) => {
    const wafer = await Wafer.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!wafer) throw notFound(`Wafer ${id}`);
    const sweeps = await Sweep.count({ where: { waferId: id }, transaction: t });
    if (sweeps > 0) {
      throw conflict(
        `Wafer ${wafer.number} has been measured (${sweeps} sweeps); it cannot be deleted`,
        {
          sweepCount: sweeps,
        },
      );
    }
    const open = await Assignment.findAll({
      where: { waferId: id, state: { [Op.in]: ['assigned', 'in progress'] } },
      transaction: t,
    });
    for (const a of open) {
      const before = a.toJSON();
      await a.update({ state: 'cancelled' }, { transaction: t });
      await auditChange(t, actor, 'update', 'assignment', a.id, { before, after: a.toJSON() });
    }
    const before = toWaferDto(wafer);
    await wafer.destroy({ transaction: t });
    await auditChange(t, actor, 'delete', 'wafer', id, { before, after: null });
  });
}
