import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { documentProblems } from '../openapi/testing/document-validator';
import { makeWafer } from '../sweeps/sweep-test-helpers';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

const csv = (offset: number) =>
  ['temperature_K,resistivity_ohm_cm', ...[290, 295, 300].map((t) => `${t},${10 + offset}`)].join(
    '\n',
  );

async function assignTask(waferId: number) {
  const res = await request(ctx.app).post('/api/assignments').set(ctx.auth('manager')).send({
    waferId,
    assigneeId: ctx.users.technician.id,
    task: 'Measure rho(T)',
    dueDate: '2030-01-01',
  });
  expect(res.status).toBe(201);
  return res.body.id as number;
}

const upload = (waferId: number, role: 'technician' | 'engineer', name: string, offset: number) =>
  request(ctx.app)
    .post(`/api/wafers/${waferId}/sweeps`)
    .set(ctx.auth(role))
    .field('method', 'resistivity')
    .attach('file', Buffer.from(csv(offset)), name);

describe('states follow the work', () => {
  it('moves the assignee’s task to in progress, the wafer to measured, and links the sweep', async () => {
    const wafer = await makeWafer({});
    await Wafer.update({ state: 'queued' }, { where: { id: wafer.id } });
    const taskId = await assignTask(wafer.id);

    const stored = await upload(wafer.id, 'technician', 'first.csv', 0);
    expect(stored.status).toBe(201);
    const task = await request(ctx.app).get(`/api/assignments/${taskId}`).set(ctx.auth('manager'));
    expect(task.body.state).toBe('in progress');
    expect(task.body.sweeps).toEqual([
      { id: stored.body.id, originalName: 'first.csv', createdAt: expect.any(String) },
    ]);
    expect(documentProblems('GET', '/assignments/{id}', 200, task.body)).toEqual([]);
    expect((await Wafer.findByPk(wafer.id))!.state).toBe('measured');

    // A second sweep by the assignee is linked too; the task stays in progress until marked done.
    const again = await upload(wafer.id, 'technician', 'second.csv', 1);
    const list = await request(ctx.app)
      .get('/api/assignments')
      .query({ assignee: 'me' })
      .set(ctx.auth('technician'));
    const mine = list.body.items.find((a: { id: number }) => a.id === taskId);
    expect(mine.state).toBe('in progress');
    expect(mine.sweeps.map((s: { id: number }) => s.id)).toEqual([stored.body.id, again.body.id]);
  });

  it('leaves the task alone when someone else uploads to the wafer', async () => {
    const wafer = await makeWafer({});
    await Wafer.update({ state: 'received' }, { where: { id: wafer.id } });
    const taskId = await assignTask(wafer.id);
    expect((await upload(wafer.id, 'engineer', 'other.csv', 2)).status).toBe(201);
    const task = await request(ctx.app).get(`/api/assignments/${taskId}`).set(ctx.auth('manager'));
    expect(task.body.state).toBe('assigned');
    expect(task.body.sweeps).toEqual([]);
    expect((await Wafer.findByPk(wafer.id))!.state).toBe('received');
  });
});
