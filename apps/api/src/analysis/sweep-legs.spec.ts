import type { SweepAnalysisResponse } from '@rhotrace/api-types';
import { seededNormal, seededRandom } from '@rhotrace/physics';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeWafer } from '../sweeps/sweep-test-helpers';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('GET /api/sweeps/:id/analysis per leg', () => {
  it('lists the legs, analyses the first by default and reads a 1.0 K thermal lag within 0.3 K', async () => {
    // Invented: a sample trailing its sensor by 1 K reads rho(T - 1) warming, rho(T + 1) cooling.
    const normal = seededNormal(seededRandom(31));
    const rho = (t: number) => Math.exp(-1500 / t + 0.003 * t);
    const up = Array.from({ length: 31 }, (_, i) => 250 + 5 * i);
    const rows = [
      ...up.map((t) => [t, rho(t - 1)] as const),
      ...up
        .slice(0, -1)
        .reverse()
        .map((t) => [t, rho(t + 1)] as const),
    ].map(([t, r]) => `${t},1,${(100 * r * (1 + 0.001 * normal())).toPrecision(7)}`);
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', Buffer.from(`T (K),I (mA),V (mV)\n${rows.join('\n')}\n`), 'lag.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const get = (query = '') =>
      request(ctx.app).get(`/api/sweeps/${res.body.id}/analysis${query}`).set(ctx.auth('engineer'));
    const a = (await get()).body as SweepAnalysisResponse;
    expect(a.legs).toEqual([
      { index: 1, direction: 'up', minK: 250, maxK: 400, stepCount: 31 },
      { index: 2, direction: 'down', minK: 250, maxK: 395, stepCount: 30 },
    ]);
    expect(a.leg).toBe(1);
    expect(a.steps).toHaveLength(31);
    expect(Math.abs(a.thermalLag!.lagK - 1)).toBeLessThan(0.3);
    expect(a.thermalLag!.standardErrorK).toBeLessThan(0.3);
    const all = (await get('?leg=all')).body as SweepAnalysisResponse;
    expect(all.leg).toBeNull();
    const second = (await get('?leg=2')).body as SweepAnalysisResponse;
    expect(second.steps).toHaveLength(30);
    const none = await get('?leg=3');
    expect(none.status).toBe(400);
    expect(none.body.error.details[0]).toMatchObject({ field: 'leg' });
  });
});
