import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

describe('the sweep that counts for a wafer’s 23 °C value', () => {
  it('is the newest by default, the engineer’s choice once made, and the choice is audited', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 8, specMaxOhmCm: 13 }, ['CS-1', 'CS-2']);
    const around23C = range(291, 301, 11);
    const first = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(around23C, () => 10),
    );
    const newest = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(around23C, () => 20),
    );
    const other = await makeSweep(
      wafers[1]!.id,
      ctx.users.engineer.id,
      synthesize(around23C, () => 11),
    );
    const summary = async () =>
      (await request(ctx.app).get(`/api/lots/${lot.id}/summary`).set(ctx.auth('manager'))).body
        .wafers[0] as { sweepId: number; resistivityAt23COhmCm: number; verdict: string };

    expect((await summary()).sweepId).toBe(newest.id);
    expect((await summary()).verdict).toBe('fail');

    const choose = (countedSweepId: number | null) =>
      request(ctx.app)
        .patch(`/api/wafers/${wafers[0]!.id}`)
        .set(ctx.auth('engineer'))
        .send({ countedSweepId });
    const chosen = await choose(first.id);
    expect(chosen.status).toBe(200);
    expect(chosen.body.countedSweepId).toBe(first.id);
    const counted = await summary();
    expect(counted.sweepId).toBe(first.id);
    expect(counted.resistivityAt23COhmCm).toBeCloseTo(10, 9);
    expect(counted.verdict).toBe('pass');

    const history = await request(ctx.app)
      .get(`/api/wafers/${wafers[0]!.id}/history`)
      .set(ctx.auth('engineer'));
    const change = history.body.items[0].changes.find(
      (c: { field: string }) => c.field === 'countedSweepId',
    );
    expect(change.label).toBe('Sweep that counts at 23 °C');
    expect(change.after).toBe(`${first.originalName} (sweep ${first.id})`);

    const foreign = await choose(other.id);
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.details[0].field).toBe('body.countedSweepId');
    expect((await choose(null)).status).toBe(200);
    expect((await summary()).sweepId).toBe(newest.id);
    const technician = await request(ctx.app)
      .patch(`/api/wafers/${wafers[0]!.id}`)
      .set(ctx.auth('technician'))
      .send({ countedSweepId: first.id });
    expect([403, 404]).toContain(technician.status);
  });
});
