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

  const refused = () => new ConnectionRefusedError(new Error('connect ECONNREFUSED'));
  /** Makes the wafer lookup fail, whichever form the route uses. */
  const failWaferLookup = () => {
    const model = vi.spyOn(Wafer, 'findByPk').mockRejectedValue(refused());
    const query = ctx.sequelize.query.bind(ctx.sequelize);
    // the sweep read checks sweep, wafer and lot in one joined query
    const joined = vi
      .spyOn(ctx.sequelize, 'query')
      .mockImplementation(((sql: unknown, options: unknown) =>
        typeof sql === 'string' && sql.includes('JOIN wafers AS w')
          ? Promise.reject(refused())
          : query(sql as string, options as never)) as never);
    return () => {
      model.mockRestore();
      joined.mockRestore();
    };
  };

  it.each([
    ['the sweep', () => `/api/sweeps/${sweepId}`],
    ['its analysis', () => `/api/sweeps/${sweepId}/analysis`],
    ['a fit on it', () => `/api/fits/${fitId}`],
  ])(
    'reading %s answers 503 with a retry hint when the wafer lookup fails',
    async (_what, path) => {
      const restore = failWaferLookup();
      try {
        const res = await request(ctx.app).get(path()).set(ctx.auth('physicist'));
        expect(res.status).toBe(503);
        expect(res.headers['retry-after']).toBeDefined();
      } finally {
        restore();
      }
      const ok = await request(ctx.app).get(path()).set(ctx.auth('physicist'));
      expect(ok.status).toBe(200);
    },
  );
});
