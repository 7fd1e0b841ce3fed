/** An assignment as the API answers it, and the records that answer names. */
import type {
  AssignmentDto,
  AssignmentStationUpload,
  AssignmentState,
  AssignmentSweepDto,
} from '@rhotrace/api-types';
import { Op, type Transaction } from 'sequelize';
import { todayIso } from '../db/query';
import { Lot } from '../lots/lot.model';
import { stationUploadsByAssignment } from '../station-posts/station-uploads';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';
import type { Assignment } from './assignment.model';
import type { AssignmentPlan } from './assignment-plan.model';
import { plansOf, toPlanDto } from './assignment-plan.service';
import { safetyCautionsFor } from './assignment-safety';
import { sweepsOfTasks } from './task-sweeps';

/** States in which an assignment is still open (and can become overdue). */
export const OPEN_STATES: AssignmentState[] = ['assigned', 'in progress'];

/** The records an assignment's answer names, read once for a page of assignments. */
export interface Related {
  wafers: Map<number, Wafer>;
  lots: Map<number, Lot>;
  users: Map<number, User>;
  stationUploads: Map<number, AssignmentStationUpload>;
  plans: Map<number, AssignmentPlan>;
  sweeps: Map<number, AssignmentSweepDto[]>;
}

export async function related(rows: Assignment[], transaction?: Transaction): Promise<Related> {
  const waferIds = [...new Set(rows.map((a) => a.waferId))];
  const wafers = waferIds.length
    ? await Wafer.findAll({ where: { id: { [Op.in]: waferIds } }, paranoid: false, transaction })
    : [];
  const lotIds = [...new Set(wafers.map((w) => w.lotId))];
  const lots = lotIds.length
    ? await Lot.findAll({ where: { id: { [Op.in]: lotIds } }, paranoid: false, transaction })
    : [];
  const userIds = [...new Set(rows.map((a) => a.assigneeId))];
  const users = userIds.length
    ? await User.findAll({ where: { id: { [Op.in]: userIds } }, transaction })
    : [];
  const stationed = rows.filter((a) => a.stationId != null).map((a) => a.id);
  return {
    wafers: new Map(wafers.map((w) => [w.id, w])),
    lots: new Map(lots.map((l) => [l.id, l])),
    users: new Map(users.map((u) => [u.id, u])),
    stationUploads: await stationUploadsByAssignment(stationed, transaction),
    plans: await plansOf(
      rows.map((a) => a.id),
      transaction,
    ),
    sweeps: await sweepsOfTasks(
      rows.map((a) => a.id),
      transaction,
    ),
  };
}

/** The API's view of an assignment, with wafer number, lot code, assignee and safety notes. */
export function toAssignmentDto(a: Assignment, r?: Related): AssignmentDto {
  const wafer = r?.wafers.get(a.waferId);
  const lot = wafer ? r?.lots.get(wafer.lotId) : undefined;
  return {
    id: a.id,
    waferId: a.waferId,
    ...(wafer ? { waferNumber: wafer.number } : {}),
    ...(lot ? { lotCode: lot.code } : {}),
    assigneeId: a.assigneeId,
    ...(r?.users.get(a.assigneeId) ? { assigneeName: r.users.get(a.assigneeId)!.name } : {}),
    assignedById: a.assignedById,
    task: a.task,
    dueDate: a.dueDate,
    state: a.state,
    notes: a.notes,
    overdue: OPEN_STATES.includes(a.state) && a.dueDate < todayIso(),
    ...(lot ? { safetyCautions: safetyCautionsFor(lot.material, a.task) } : {}),
    stationId: a.stationId ?? null,
    ...(r ? { stationUpload: r.stationUploads.get(a.id) ?? null } : {}),
    ...(r ? { plan: r.plans.has(a.id) ? toPlanDto(r.plans.get(a.id)!) : null } : {}),
    ...(r ? { sweeps: r.sweeps.get(a.id) ?? [] } : {}),
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  };
}
