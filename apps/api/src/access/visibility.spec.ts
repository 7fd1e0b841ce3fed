import { ROLES, roleCan, type Role, type SessionUser } from '@rhotrace/api-types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assign, makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { Assignment } from '../assignments/assignment.model';
import { Fit } from '../fits/fit.model';
import { Lot } from '../lots/lot.model';
import { Sweep } from '../sweeps/sweep.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';
import {
  visibleFits,
  visibleLot,
  visibleLots,
  visibleSweep,
  visibleSweeps,
  visibleWafer,
  visibleWafers,
} from './visibility.service';

/**
 * The technician rule is stated once and read two ways: as query scopes for lists and as single
 * reads. For every role, both must agree on every record, and a technician must see exactly the
 * wafers assigned to them in a state other than cancelled.
 */
let ctx: TestContext;
let waferIds: Record<'assigned' | 'inProgress' | 'done' | 'cancelled' | 'other', number>;
let deletedWaferId: number;

const sessionOf = (role: Role): SessionUser => {
  const u = ctx.users[role];
  return { id: u.id, email: u.email, name: u.name, role };
};

async function allowed(read: () => Promise<unknown>): Promise<boolean> {
  try {
    await read();
    return true;
  } catch (error) {
    if ((error as { code?: string }).code === 'not_found') return false;
    throw error;
  }
}

beforeAll(async () => {
  ctx = await createTestContext();
  const a = await makeLot({}, ['V01', 'V02', 'V03']);
  const b = await makeLot({}, ['V04', 'V05', 'V06']);
  const [a1, a2, a3] = a.wafers;
  const [b1, b2, b3] = b.wafers;
  waferIds = {
    assigned: a1!.id,
    inProgress: a2!.id,
    done: b1!.id,
    cancelled: a3!.id,
    other: b2!.id,
  };
  deletedWaferId = b3!.id;
  const technician = ctx.users.technician.id;
  const manager = ctx.users.manager.id;
  const states = {
    assigned: 'assigned',
    inProgress: 'in progress',
    done: 'done',
    cancelled: 'cancelled',
  } as const;
  for (const [key, state] of Object.entries(states)) {
    const waferId = waferIds[key as keyof typeof states];
    await assign(waferId, technician, manager);
    await Assignment.update({ state }, { where: { waferId } });
  }
  // Assigned, but the wafer is deleted: hidden like any deleted wafer.
  await assign(deletedWaferId, technician, manager);
  await b3!.destroy();
  const points = synthesize(range(250, 350, 4), (t) => 10 + t / 100);
  for (const id of Object.values(waferIds)) {
    const sweep = await makeSweep(id, ctx.users.engineer.id, points, `v-${id}.csv`);
    await Fit.create({
      sweepId: sweep.id,
      kind: 'tcr',
      inputs: {},
      windowMinK: 250,
      windowMaxK: 350,
      parameters: { alphaPerK: 0.001 },
      standardErrors: { alphaPerK: 0.0001 },
      confidenceIntervals: {},
      goodness: { rSquared: null, count: 0, residualRms: 0, residualUnit: 'relative' },
      residuals: [],
      converged: true,
      reason: null,
      reading: null,
      modelVersion: 'test',
      createdById: ctx.users.engineer.id,
    });
  }
});

afterAll(async () => {
  await ctx?.close();
});

describe('visibility', () => {
  it('shows a technician the wafers assigned, in progress or done, never cancelled ones', async () => {
    const ids = (await Wafer.findAll({ where: visibleWafers(sessionOf('technician')) })).map(
      (w) => w.id,
    );
    expect(ids.sort()).toEqual([waferIds.assigned, waferIds.inProgress, waferIds.done].sort());
  });

  it.each(ROLES)('%s: every scope agrees with the single read of the same record', async (role) => {
    const user = sessionOf(role);
    const seesAll = roleCan(role, 'records:see-all');
    const wafers = await Wafer.findAll();
    const inScope = new Set((await Wafer.findAll({ where: visibleWafers(user) })).map((w) => w.id));
    for (const wafer of wafers) {
      expect(await allowed(() => visibleWafer(user, wafer.id)), `wafer ${wafer.id}`).toBe(
        inScope.has(wafer.id),
      );
      if (seesAll) expect(inScope.has(wafer.id)).toBe(true);
    }
    const lotsInScope = new Set((await Lot.findAll({ where: visibleLots(user) })).map((l) => l.id));
    for (const lot of await Lot.findAll()) {
      expect(await allowed(() => visibleLot(user, lot.id)), `lot ${lot.id}`).toBe(
        lotsInScope.has(lot.id),
      );
    }
    const sweepsInScope = new Set(
      (await Sweep.findAll({ where: visibleSweeps(user) })).map((s) => s.id),
    );
    for (const sweep of await Sweep.findAll()) {
      expect(await allowed(() => visibleSweep(user, sweep.id)), `sweep ${sweep.id}`).toBe(
        sweepsInScope.has(sweep.id),
      );
    }
    const fitSweeps = (await Fit.findAll({ where: visibleFits(user) })).map((f) => f.sweepId);
    expect(new Set(fitSweeps)).toEqual(sweepsInScope);
  });
});
