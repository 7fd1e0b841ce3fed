import {
  type AssignmentDto,
  type AssignmentStationUpload,
  type AssignmentState,
  type Page,
  type SessionUser,
} from '@rhotrace/api-types';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { can, seesAllAssignments } from '../access/policy';
import { forbidden, notFound, validationFailed } from '../errors';
import { Lot } from '../lots/lot.model';
import { assignmentMail } from '../mail/templates/assignment.mail';
import type { Mailer } from '../mail/mailer.service';
import { orderFrom, todayIso } from '../db/query';
import { User } from '../users/user.model';
import { stationUploadsByAssignment } from '../station-posts/station-uploads';
import { Station } from '../stations/station.model';
import { Wafer } from '../wafers/wafer.model';
import { Assignment } from './assignment.model';
import { safetyCautionsFor } from './assignment-safety';
import { inTransaction } from '../db/connection';
import type { AssignmentPlan } from './assignment-plan.model';
import { plansOf, setAssignmentPlan, toPlanDto } from './assignment-plan.service';
import type { PlannerInput } from '../planner/planner.schemas';

/** States in which an assignment is still open (and can become overdue). */
export const OPEN_STATES: AssignmentState[] = ['assigned', 'in progress'];
/** The order an assignee may move their own assignment along. */
const FORWARD: AssignmentState[] = ['assigned', 'in progress', 'done'];

interface Related {
  wafers: Map<number, Wafer>;
  lots: Map<number, Lot>;
  users: Map<number, User>;
  stationUploads: Map<number, AssignmentStationUpload>;
  plans: Map<number, AssignmentPlan>;
}

async function related(rows: Assignment[], transaction?: Transaction): Promise<Related> {
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
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  };
}

/** The audit snapshot of an assignment (its own columns only). */
const snapshot = (a: Assignment) => toAssignmentDto(a);

async function activeAssignee(id: number, transaction: Transaction): Promise<User> {
  const user = await User.findByPk(id, { transaction });
  if (!user || !user.active) {
    throw validationFailed('The assignee must be an active account', [
      { field: 'body.assigneeId', problem: 'is not an active user' },
    ]);
  }
  return user;
}

async function queueMail(
  a: Assignment,
  context: {
    wafer: Wafer;
    lot: Lot;
    assignee: User;
    assignerName: string;
    plan: AssignmentPlan | null;
  },
  mail: { mailer: Mailer; publicUrl: string },
  transaction: Transaction,
): Promise<void> {
  await mail.mailer.enqueue(
    assignmentMail({
      to: context.assignee.email,
      assigneeName: context.assignee.name,
      assignedByName: context.assignerName,
      assignmentId: a.id,
      task: a.task,
      dueDate: a.dueDate,
      notes: a.notes,
      waferNumber: context.wafer.number,
      lotCode: context.lot.code,
      material: context.lot.material,
      link: `${mail.publicUrl}/wafers/${context.wafer.id}`,
      cautions: safetyCautionsFor(context.lot.material, a.task),
      plan: context.plan?.plan ?? null,
    }),
    transaction,
  );
}

export interface NewAssignment {
  waferId: number;
  assigneeId: number;
  task: string;
  dueDate: string;
  notes: string | null;
  stationId: number | null;
  /** A planner request for the assignment's wafer: the plan computed from it is attached. */
  plan?: PlannerInput;
}

/** 400 unless `stationId` is null or a station that exists (not deleted). */
async function knownStation(stationId: number | null | undefined, t: Transaction): Promise<void> {
  if (stationId == null) return;
  if (!(await Station.findByPk(stationId, { transaction: t }))) {
    throw validationFailed('The station does not exist', [
      { field: 'body.stationId', problem: 'is not a probe station' },
    ]);
  }
}

/**
 * Assigns a task on a wafer. The assignment, its audit event and the e-mail to the assignee
 * (queued, delivered after commit and retried) are written in one transaction.
 */
export async function createAssignment(
  input: NewAssignment,
  actor: Actor & SessionUser,
  mail: { mailer: Mailer; publicUrl: string },
): Promise<AssignmentDto> {
  return inTransaction(async (t) => {
    const wafer = await Wafer.findByPk(input.waferId, { transaction: t });
    const lot = wafer ? await Lot.findByPk(wafer.lotId, { transaction: t }) : null;
    if (!wafer || !lot) throw notFound(`Wafer ${input.waferId}`);
    const assignee = await activeAssignee(input.assigneeId, t);
    await knownStation(input.stationId, t);
    const { plan: planRequest, ...fields } = input;
    const a = await Assignment.create({ ...fields, assignedById: actor.id }, { transaction: t });
    await auditChange(t, actor, 'create', 'assignment', a.id, { after: snapshot(a) });
    const plan = planRequest ? await setAssignmentPlan(t, a, planRequest, actor) : null;
    await queueMail(a, { wafer, lot, assignee, assignerName: actor.name, plan }, mail, t);
    return toAssignmentDto(a, await related([a], t));
  });
}

export interface AssignmentListOptions {
  page: number;
  pageSize: number;
  sort?: string;
  assignee?: 'me' | number;
  state?: AssignmentState;
  waferId?: number;
  overdue?: boolean;
  open?: boolean;
}

/** A page of assignments; technicians may only list their own (403 for anyone else's). */
export async function listAssignments(
  user: SessionUser,
  options: AssignmentListOptions,
): Promise<Page<AssignmentDto>> {
  let assigneeId = options.assignee === 'me' ? user.id : options.assignee;
  if (!seesAllAssignments(user)) {
    if (assigneeId !== undefined && assigneeId !== user.id) {
      throw forbidden('Technicians may list only their own assignments (assignee=me)');
    }
    assigneeId = user.id;
  }
  const where: WhereOptions<Assignment>[] = [];
  if (assigneeId !== undefined) where.push({ assigneeId });
  if (options.state) where.push({ state: options.state });
  if (options.waferId) where.push({ waferId: options.waferId });
  if (options.open !== undefined) {
    where.push({ state: { [options.open ? Op.in : Op.notIn]: OPEN_STATES } });
  }
  if (options.overdue === true) {
    where.push({ state: { [Op.in]: OPEN_STATES }, dueDate: { [Op.lt]: todayIso() } });
  } else if (options.overdue === false) {
    where.push({
      [Op.or]: [{ state: { [Op.notIn]: OPEN_STATES } }, { dueDate: { [Op.gte]: todayIso() } }],
    });
  }
  const { rows, count } = await Assignment.findAndCountAll({
    where: { [Op.and]: where },
    order: orderFrom(options.sort, 'dueDate'),
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  const r = await related(rows);
  return {
    items: rows.map((a) => toAssignmentDto(a, r)),
    total: count,
    page: options.page,
    pageSize: options.pageSize,
  };
}

/** One assignment; a technician sees only their own (404 otherwise). */
export async function getAssignment(user: SessionUser, id: number): Promise<AssignmentDto> {
  const a = await Assignment.findByPk(id);
  if (!a || (!seesAllAssignments(user) && a.assigneeId !== user.id)) {
    throw notFound(`Assignment ${id}`);
  }
  return toAssignmentDto(a, await related([a]));
}

export interface AssignmentChanges {
  state?: AssignmentState;
  task?: string;
  dueDate?: string;
  notes?: string | null;
  assigneeId?: number;
  stationId?: number | null;
  /** A new plan for the assignment's wafer, or null to detach the plan. */
  plan?: PlannerInput | null;
}

/**
 * Changes an assignment. Admins and managers may change anything (a new assignee is e-mailed);
 * the assignee may only move the state forward (assigned → in progress → done).
 */
export async function updateAssignment(
  user: SessionUser,
  id: number,
  changes: AssignmentChanges,
  actor: Actor,
  mail: { mailer: Mailer; publicUrl: string },
): Promise<AssignmentDto> {
  return inTransaction(async (t) => {
    const a = await Assignment.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!a || (!seesAllAssignments(user) && a.assigneeId !== user.id)) {
      throw notFound(`Assignment ${id}`);
    }
    if (!can(user, 'assignments:assign')) {
      if (a.assigneeId !== user.id)
        throw forbidden('Only admins, managers and the assignee may change this');
      const others = Object.keys(changes).filter((k) => k !== 'state');
      if (others.length) {
        throw forbidden(`The assignee may change only the state, not ${others.join(', ')}`);
      }
      if (changes.state !== undefined && changes.state !== a.state) {
        const from = FORWARD.indexOf(a.state);
        const to = FORWARD.indexOf(changes.state);
        if (from < 0 || to <= from) {
          throw forbidden(
            `The assignee may move the state only forward (${FORWARD.join(' → ')}), not from "${a.state}" to "${changes.state}"`,
          );
        }
      }
    }
    await knownStation(changes.stationId, t);
    const before = snapshot(a);
    const newAssignee =
      changes.assigneeId !== undefined && changes.assigneeId !== a.assigneeId
        ? await activeAssignee(changes.assigneeId, t)
        : null;
    const { plan: planRequest, ...fields } = changes;
    await a.update(fields, { transaction: t });
    await auditChange(t, actor, 'update', 'assignment', id, { before, after: snapshot(a) });
    if (planRequest !== undefined) {
      await setAssignmentPlan(t, a, planRequest, { ...user, requestId: actor.requestId ?? null });
    }
    const r = await related([a], t);
    const wafer = r.wafers.get(a.waferId);
    const lot = wafer ? r.lots.get(wafer.lotId) : undefined;
    if (newAssignee && wafer && lot) {
      const plan = r.plans.get(a.id) ?? null;
      await queueMail(
        a,
        { wafer, lot, assignee: newAssignee, assignerName: user.name, plan },
        mail,
        t,
      );
    }
    return toAssignmentDto(a, r);
  });
}
