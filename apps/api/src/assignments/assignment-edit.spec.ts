import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
let waferId: number;
beforeAll(async () => {
  ctx = await createTestContext();
  const lot = await request(ctx.app)
    .post('/api/lots')
    .set(ctx.auth('manager'))
    .send({ code: 'ED-1', material: 'Si' });
  const wafer = await request(ctx.app)
    .post(`/api/lots/${lot.body.id}/wafers`)
    .set(ctx.auth('manager'))
    .send({ number: 'E1' });
  waferId = wafer.body.id;
});
afterAll(async () => ctx.close());

/** Waits for the mail queue to hand a message for `email` to the captured mailbox. */
async function mailTo(email: string, from: number): Promise<string> {
  for (let i = 0; i < 200; i++) {
    const found = ctx.mailbox.slice(from).find((m) => m.to.includes(email));
    if (found) return found.raw.toString();
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error(`no message to ${email}`);
}

describe('editing an assignment after it was handed out', () => {
  it('hands it to another person (e-mailed, audited) and moves its due date', async () => {
    const created = await request(ctx.app).post('/api/assignments').set(ctx.auth('manager')).send({
      waferId,
      assigneeId: ctx.users.technician.id,
      task: 'Room-temperature sweep',
      dueDate: '2031-05-02',
    });
    expect(created.status).toBe(201);
    const other = await ctx.addUser('technician', 'Wren Otterly');
    const before = ctx.mailbox.length;

    const moved = await request(ctx.app)
      .patch(`/api/assignments/${created.body.id}`)
      .set(ctx.auth('manager'))
      .send({ assigneeId: other.user.id, dueDate: '2031-06-01' });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ assigneeId: other.user.id, dueDate: '2031-06-01' });
    expect(await mailTo(other.user.email, before)).toContain('Room-temperature sweep');

    const events = await AuditEvent.findAll({
      where: { entity: 'assignment', entityId: String(created.body.id), action: 'update' },
    });
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ assigneeId: ctx.users.technician.id });
    expect(events[0]!.after).toMatchObject({ assigneeId: other.user.id, dueDate: '2031-06-01' });
  });

  it('refuses a deactivated assignee with the field named, and an engineer, changing nothing', async () => {
    const created = await request(ctx.app)
      .post('/api/assignments')
      .set(ctx.auth('manager'))
      .send({ waferId, assigneeId: ctx.users.technician.id, task: 'Sweep', dueDate: '2031-05-02' });
    const gone = await ctx.addUser('technician');
    await request(ctx.app)
      .patch(`/api/users/${gone.user.id}`)
      .set(ctx.auth('admin'))
      .send({ active: false })
      .expect(200);

    const refused = await request(ctx.app)
      .patch(`/api/assignments/${created.body.id}`)
      .set(ctx.auth('manager'))
      .send({ assigneeId: gone.user.id });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details).toContainEqual({
      field: 'body.assigneeId',
      problem: 'is not an active user',
    });
    const engineer = await request(ctx.app)
      .patch(`/api/assignments/${created.body.id}`)
      .set(ctx.auth('engineer'))
      .send({ dueDate: '2031-07-01' });
    expect(engineer.status).toBe(403);

    const after = await request(ctx.app)
      .get(`/api/assignments/${created.body.id}`)
      .set(ctx.auth('manager'));
    expect(after.body).toMatchObject({
      assigneeId: ctx.users.technician.id,
      dueDate: '2031-05-02',
    });
  });
});
