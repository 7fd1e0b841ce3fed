/**
 * The measurement plan attached to an assignment: computed by the planner when attached (never
 * taken from the client as is), stored with the request it came from, read with the assignment.
 */
import type { AssignmentPlanDto, SessionUser } from '@rhotrace/api-types';
import { Op, type Transaction } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { validationFailed } from '../errors';
import type { PlannerInput } from '../planner/planner.schemas';
import { planMeasurement } from '../planner/planner.service';
import { AssignmentPlan } from './assignment-plan.model';

/** The API's view of an attached plan. */
export function toPlanDto(p: AssignmentPlan): AssignmentPlanDto {
  return { request: p.request, plan: p.plan, createdAt: p.createdAt.toISOString() };
}

/** The plans of these assignments, by assignment id. */
export async function plansOf(
  assignmentIds: number[],
  transaction?: Transaction,
): Promise<Map<number, AssignmentPlan>> {
  if (!assignmentIds.length) return new Map();
  const rows = await AssignmentPlan.findAll({
    where: { assignmentId: { [Op.in]: assignmentIds } },
    transaction,
  });
  return new Map(rows.map((p) => [p.assignmentId, p]));
}

/**
 * Computes the plan for `request` on the assignment's wafer and attaches it, replacing any plan
 * already there (`null` detaches). Errors name the fields under `body.plan`.
 */
export async function setAssignmentPlan(
  t: Transaction,
  assignment: { id: number; waferId: number },
  request: PlannerInput | null,
  actor: SessionUser & Actor,
): Promise<AssignmentPlan | null> {
  const existing = await AssignmentPlan.findOne({
    where: { assignmentId: assignment.id },
    transaction: t,
  });
  const before = existing ? { request: existing.request } : undefined;
  if (request === null) {
    if (existing) {
      await existing.destroy({ transaction: t });
      await auditChange(t, actor, 'delete', 'assignment-plan', assignment.id, { before });
    }
    return null;
  }
  if (request.waferId !== assignment.waferId) {
    const problem = `must be the assignment's wafer (${assignment.waferId})`;
    throw validationFailed(`body.plan.waferId ${problem}`, [
      { field: 'body.plan.waferId', problem },
    ]);
  }
  const plan = await planMeasurement(actor, request, { transaction: t, prefix: 'body.plan' });
  const row = existing
    ? await existing.update({ request, plan, createdById: actor.id }, { transaction: t })
    : await AssignmentPlan.create(
        { assignmentId: assignment.id, request, plan, createdById: actor.id },
        { transaction: t },
      );
  await auditChange(t, actor, existing ? 'update' : 'create', 'assignment-plan', assignment.id, {
    before,
    after: { request },
  });
  return row;
}
