import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Assignment } from '../assignments/assignment.model';
import { AuditEvent } from '../audit/audit-event.model';
import { makeLot } from '../analysis/testing/fixtures';
import { createTestContext, type TestContext } from '../testing/test-context';
import { User } from './user.model';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

async function task(waferId: number, assigneeId: number, state: string, dueDate: string) {
  return Assignment.create({
    waferId,
    assigneeId,
    assignedById: ctx.users.manager.id,
    task: 'Measure rho(T)',
    dueDate,
    state,
    notes: null,
  } as never);
}

describe('deactivating a person with open tasks', () => {
  it('lists their open tasks and hands them over in the same step, audited', async () => {
    const { user: leaving } = await ctx.addUser('technician');
    const { user: taking } = await ctx.addUser('technician');
    const { wafers } = await makeLot({}, ['HO-1', 'HO-2', 'HO-3']);
    const overdue = await task(wafers[0]!.id, leaving.id, 'assigned', '2020-01-01');
    const running = await task(wafers[1]!.id, leaving.id, 'in progress', '2030-01-01');
    const finished = await task(wafers[2]!.id, leaving.id, 'done', '2020-01-01');

    const open = await request(ctx.app)
      .get(`/api/assignments?assignee=${leaving.id}&open=true`)
      .set(ctx.auth('admin'));
    expect(open.status).toBe(200);
    expect(open.body.items.map((a: { id: number }) => a.id).sort()).toEqual(
      [overdue.id, running.id].sort(),
    );

    const off = await request(ctx.app)
      .patch(`/api/users/${leaving.id}`)
      .set(ctx.auth('admin'))
      .send({ active: false, reassignTo: taking.id });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    await overdue.reload();
    await running.reload();
    await finished.reload();
    expect(overdue.assigneeId).toBe(taking.id);
    expect(running.assigneeId).toBe(taking.id);
    expect(running.state).toBe('in progress');
    expect(finished.assigneeId).toBe(leaving.id); // history stays as it was
    const trail = await AuditEvent.findAll({
      where: { entity: 'assignment', entityId: String(overdue.id) },
    });
    expect(trail.some((e) => JSON.stringify(e.after).includes(`"assigneeId":${taking.id}`))).toBe(
      true,
    );
  });

  it('refuses a bad hand-over with the field named, changing nothing', async () => {
    const { user: leaving } = await ctx.addUser('engineer');
    const { user: gone } = await ctx.addUser('technician');
    await User.update({ active: false }, { where: { id: gone.id } });
    const { wafers } = await makeLot({}, ['HO-9']);
    const open = await task(wafers[0]!.id, leaving.id, 'assigned', '2030-01-01');
    const send = (body: object) =>
      request(ctx.app).patch(`/api/users/${leaving.id}`).set(ctx.auth('admin')).send(body);

    const toSelf = await send({ active: false, reassignTo: leaving.id });
    expect(toSelf.status).toBe(422);
    expect(toSelf.body.error.details[0].field).toBe('body.reassignTo');
    const toGone = await send({ active: false, reassignTo: gone.id });
    expect(toGone.status).toBe(422);
    expect(toGone.body.error.message).toMatch(/deactivated/);
    const withoutDeactivation = await send({ reassignTo: ctx.users.technician.id });
    expect(withoutDeactivation.status).toBe(400);
    expect((await User.findByPk(leaving.id))!.active).toBe(true);
    await open.reload();
    expect(open.assigneeId).toBe(leaving.id);
  });

  it('never lets an admin deactivate their own account, even with another admin', async () => {
    const { user: second, header } = await ctx.addUser('admin');
    const self = await request(ctx.app)
      .patch(`/api/users/${second.id}`)
      .set(header)
      .send({ active: false });
    expect(self.status).toBe(409);
    expect(self.body.error.message).toMatch(/your own account/);
  });
});
