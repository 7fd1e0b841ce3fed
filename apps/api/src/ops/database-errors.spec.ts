import { ConnectionRefusedError } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { makeWafer } from '../sweeps/sweep-test-helpers';
import { fourPointCsv } from '../testing/sweep-files';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';

/**
 * A database failure while checking who may see a wafer is a 503, never a 404: the visibility
 * checks re-label only real 404s (a fault test once saw "Sweep 3 was not found" mid-outage).
 */
describe('database failures during visibility checks', () => {
  let ctx: TestContext;
  let sweepId: number;
  let fitId: number;
  beforeAll(async () => {
    ctx = await createTestContext();
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const up = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', fourPointCsv(50), 'v.csv');
    sweepId = up.body.id;
    const fit = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'arrhenius', minK: 100, maxK: 400, regime: 'extrinsic' });
    expect(fit.status).toBe(201);
    fitId = fit.body.id;
  });
  afterAll(async () => {
    vi.restoreAllMocks();
    await ctx.close();
  });

  it.each([
    ['the sweep', () => `/api/sweeps/${sweepId}`],
    ['its analysis', () => `/api/sweeps/${sweepId}/analysis`],
    ['a fit on it', () => `/api/fits/${fitId}`],
  ])(
    'reading %s answers 503 with a retry hint when the wafer lookup fails',
    async (_what, path) => {
      const spy = vi
        .spyOn(Wafer, 'findByPk')
        .mockRejectedValue(new ConnectionRefusedError(new Error('connect ECONNREFUSED')));
      try {
        const res = await request(ctx.app).get(path()).set(ctx.auth('physicist'));
        expect(res.status).toBe(503);
        expect(res.headers['retry-after']).toBeDefined();
      } finally {
        spy.mockRestore();
      }
      const ok = await request(ctx.app).get(path()).set(ctx.auth('physicist'));
      expect(ok.status).toBe(200);
    },
  );
});
