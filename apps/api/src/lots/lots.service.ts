import type { LotDto, LotInput, Material, Page, SessionUser } from '@rhotrace/api-types';
import { col, fn, literal, Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import {
  visibleLot,
  visibleLots,
  visibleWafers,
  visibleWaferSql,
} from '../access/visibility.service';
import { Assignment } from '../assignments/assignment.model';
import { auditChange, type Actor } from '../audit/audit.service';
import { conflict, notFound, validationFailed } from '../errors';
import { likePattern, orderFrom } from '../db/query';
import { Sweep } from '../sweeps/sweep.model';
import { Wafer } from '../wafers/wafer.model';
import { Lot } from './lot.model';
import { inTransaction } from '../db/connection';

/** The API's view of a lot. */
export function toLotDto(lot: Lot, waferCount?: number): LotDto {
  return {
    id: lot.id,
    code: lot.code,
    material: lot.material as Material,
    dopant: lot.dopant,
    dopantType: lot.dopantType,
    orientation: lot.orientation,
    diameterCm: lot.diameterCm,
    thicknessCm: lot.thicknessCm,
    thicknessToleranceCm: lot.thicknessToleranceCm,
    supplier: lot.supplier,
    receivedOn: lot.receivedOn,
    specMinOhmCm: lot.specMinOhmCm,
    specMaxOhmCm: lot.specMaxOhmCm,
    notes: lot.notes,
    ...(waferCount === undefined ? {} : { waferCount }),
    createdAt: lot.createdAt.toISOString(),
    updatedAt: lot.updatedAt.toISOString(),
  };
}

/** Wafer counts per lot (only wafers the user may see). */
async function waferCounts(user: SessionUser, lotIds: number[]): Promise<Map<number, number>> {
  if (!lotIds.length) return new Map();
  const rows = (await Wafer.findAll({
    attributes: ['lotId', [fn('COUNT', col('id')), 'count']],
    where: { [Op.and]: [{ lotId: { [Op.in]: lotIds } }, visibleWafers(user)] },
    group: ['lotId'],
    raw: true,
  })) as unknown as Array<{ lotId: number; count: number }>;
  return new Map(rows.map((r) => [r.lotId, Number(r.count)]));
}

/**
 * SQL for the number of a lot's wafers the user may see (`Lot` is the outer row): wafers not
 * deleted and visible to the user.
 */
function waferCountSql(user: SessionUser): string {
  return (
    '(SELECT COUNT(*) FROM wafers AS w WHERE w.lot_id = `Lot`.`id` AND w.deleted_at IS NULL' +
    ` AND ${visibleWaferSql(user, 'w.id')})`
  );
}

export interface LotListOptions {
  page: number;
  pageSize: number;
  sort?: string;
  q?: string;
  material?: string;
  dopantType?: 'n' | 'p';
}

/** A page of lots the user may see, with their wafer counts. */
export async function listLots(user: SessionUser, options: LotListOptions): Promise<Page<LotDto>> {
  const where: WhereOptions<Lot>[] = [visibleLots(user)];
  if (options.q) {
    const like = likePattern(options.q);
    where.push({
      [Op.or]: ['code', 'supplier', 'dopant', 'orientation', 'notes'].map((f) => ({
        [f]: { [Op.like]: like },
      })),
    });
  }
  if (options.material) where.push({ material: options.material });
  if (options.dopantType) where.push({ dopantType: options.dopantType });
  // One query: the page, each lot's visible wafer count and the total of matching lots
  const rows = await Lot.findAll({
    attributes: {
      include: [
        [literal(waferCountSql(user)), 'visibleWaferCount'],
        [literal('COUNT(*) OVER ()'), 'matchingTotal'],
      ],
    },
    where: { [Op.and]: where },
    order: orderFrom(options.sort, 'code'),
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  const total = rows.length
    ? Number(rows[0]!.get('matchingTotal'))
    : options.page > 1
      ? await Lot.count({ where: { [Op.and]: where } })
      : 0;
  return {
    items: rows.map((l) => toLotDto(l, Number(l.get('visibleWaferCount')))),
    total,
    page: options.page,
    pageSize: options.pageSize,
  };
}

/** One lot with its wafer count. */
export async function getLot(user: SessionUser, id: number): Promise<LotDto> {
  const lot = await visibleLot(user, id);
  return toLotDto(lot, (await waferCounts(user, [id])).get(id) ?? 0);
}

function assertSpecOrder(min: number | null | undefined, max: number | null | undefined): void {
  if (min != null && max != null && min > max) {
    throw validationFailed('The resistivity specification is reversed', [
      { field: 'body.specMinOhmCm', problem: `must not exceed specMaxOhmCm (${max})` },
    ]);
  }
}

function duplicateCode(error: unknown, code: string | undefined): never {
  if (error instanceof UniqueConstraintError) {
    throw conflict(`A lot with code "${code}" already exists (deleted lots keep their codes)`, {
      field: 'code',
    });
  }
  throw error;
}

/** Creates a lot and its audit event in one transaction. */
export async function createLot(input: LotInput, actor: Actor): Promise<LotDto> {
  assertSpecOrder(input.specMinOhmCm, input.specMaxOhmCm);
  try {
    return await inTransaction(async (t) => {
      const lot = await Lot.create({ ...input, createdById: actor.id }, { transaction: t });
      const dto = toLotDto(lot, 0);
      await auditChange(t, actor, 'create', 'lot', lot.id, { after: dto });
      return dto;
    });
  } catch (error) {
    return duplicateCode(error, input.code);
  }
}

/** Changes a lot (specMin ≤ specMax checked against the stored values too). */
export async function updateLot(
  id: number,
  changes: Partial<LotInput>,
  actor: Actor,
): Promise<LotDto> {
  try {
    return await inTransaction(async (t) => {
      const lot = await Lot.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!lot) throw notFound(`Lot ${id}`);
      const before = toLotDto(lot);
      assertSpecOrder(
        changes.specMinOhmCm !== undefined ? changes.specMinOhmCm : lot.specMinOhmCm,
        changes.specMaxOhmCm !== undefined ? changes.specMaxOhmCm : lot.specMaxOhmCm,
      );
      await lot.update(changes, { transaction: t });
      const count = await Wafer.count({ where: { lotId: id }, transaction: t });
      const dto = toLotDto(lot, count);
      await auditChange(t, actor, 'update', 'lot', id, { before, after: toLotDto(lot) });
      return dto;
    });
  } catch (error) {
    return duplicateCode(error, changes.code);
  }
}

/**
 * Soft-deletes a lot, its wafers and cancels their open assignments, each with an audit event.
 * A lot with any measured wafer (a sweep not deleted) is refused with 409.
 */
export async function deleteLot(id: number, actor: Actor): Promise<void> {
  await inTransaction(async (t) => {
    const lot = await Lot.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!lot) throw notFound(`Lot ${id}`);
    const wafers = await Wafer.findAll({ where: { lotId: id }, transaction: t, paranoid: false });
    const waferIds = wafers.map((w) => w.id);
    const sweeps = waferIds.length
      ? await Sweep.count({ where: { waferId: { [Op.in]: waferIds } }, transaction: t })
      : 0;
    if (sweeps > 0) {
      throw conflict(
        `Lot ${lot.code} has measured wafers (${sweeps} sweep${sweeps === 1 ? '' : 's'}); delete the sweeps first or keep the lot`,
        { sweepCount: sweeps },
      );
    }
    const audit = (
      entity: string,
      entityId: number,
      before: unknown,
      after: unknown,
      action = 'delete',
    ) => auditChange(t, actor, action, entity, entityId, { before, after });
    const open = waferIds.length
      ? await Assignment.findAll({
          where: {
            waferId: { [Op.in]: waferIds },
            state: { [Op.in]: ['assigned', 'in progress'] },
          },
          transaction: t,
        })
      : [];
    for (const a of open) {
      const before = a.toJSON();
      await a.update({ state: 'cancelled' }, { transaction: t });
      await audit('assignment', a.id, before, a.toJSON(), 'update');
    }
    for (const wafer of wafers.filter((w) => !w.deletedAt)) {
      const before = wafer.toJSON();
      await wafer.destroy({ transaction: t });
      await audit('wafer', wafer.id, before, null);
    }
    const before = toLotDto(lot, wafers.length);
    await lot.destroy({ transaction: t });
    await audit('lot', id, before, null);
  });
}
