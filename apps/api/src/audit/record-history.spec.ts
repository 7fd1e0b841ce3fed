import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeLot } from '../analysis/testing/fixtures';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

describe('a record’s history on its own page', () => {
  it('gives a wafer’s changes and its tasks’ in words, to anyone who sees the wafer', async () => {
    const { lot, wafers } = await makeLot({}, ['HX-1']);
    const wafer = wafers[0]!;
    const patch = await request(ctx.app)
      .patch(`/api/wafers/${wafer.id}`)
      .set(ctx.auth('engineer'))
      .send({ thicknessCm: 0.038 });
    expect(patch.status).toBe(200);
    const task = await request(ctx.app).post('/api/assignments').set(ctx.auth('manager')).send({
      waferId: wafer.id,
      assigneeId: ctx.users.technician.id,
      task: 'Measure rho(T)',
      dueDate: '2030-01-01',
    });
    expect(task.status).toBe(201);

    const res = await request(ctx.app)
      .get(`/api/wafers/${wafer.id}/history`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    const [created, updated] = res.body.items as Array<{
      entity: string;
      recordName: string;
      changes: Array<{ label: string; before: string | null; after: string | null }>;
    }>;
    expect(created!.entity).toBe('assignment');
    expect(created!.recordName).toBe(`task on wafer HX-1 of lot ${lot.code}`);
    expect(created!.changes).toContainEqual({
      field: 'assigneeId',
      label: 'Assignee',
      before: null,
      after: ctx.users.technician.name,
    });
    expect(updated!.recordName).toBe(`wafer HX-1 of lot ${lot.code}`);
    const thickness = updated!.changes.find((c) => c.label === 'Thickness');
    expect(thickness?.after).toBe('380 µm');
    // No raw ids in what people read.
    const shown = res.body.items.flatMap(
      (e: { changes: Array<{ before: string; after: string }> }) =>
        e.changes.flatMap((c) => [c.before, c.after]),
    );
    expect(shown).not.toContain(String(wafer.id));
    expect(shown).not.toContain(String(ctx.users.technician.id));
  });

  it('is a 404 for a record the reader cannot see or that does not exist', async () => {
    const { lot, wafers } = await makeLot({}, ['HX-9']);
    for (const path of [`/api/wafers/${wafers[0]!.id}/history`, `/api/lots/${lot.id}/history`]) {
      expect((await request(ctx.app).get(path).set(ctx.auth('technician'))).status).toBe(404);
    }
    expect(
      (await request(ctx.app).get('/api/stations/987654/history').set(ctx.auth('engineer'))).status,
    ).toBe(404);
  });
});
