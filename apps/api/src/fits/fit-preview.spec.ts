import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '@rhotrace/physics';
import { linearRegression } from 'simple-statistics';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { Fit } from './fit.model';

let ctx: TestContext;
let sweepId: number;
let points: Array<{ temperatureK: number; resistivityOhmCm: number }>;

const EA_TRUE = 0.25; // eV
beforeAll(async () => {
  ctx = await createTestContext();
  const { wafers } = await makeLot({ material: 'Si' });
  points = synthesize(
    range(320, 620, 41),
    (t) => 2e-3 * Math.exp(EA_TRUE / (BOLTZMANN_EV_PER_K * t)),
    { noise: 0.004, seed: 5 },
  );
  sweepId = (await makeSweep(wafers[0]!.id, ctx.users.engineer.id, points)).id;
});
afterAll(async () => ctx.close());

type Role = 'admin' | 'engineer' | 'physicist' | 'manager' | 'technician';
const body = { kind: 'arrhenius', minK: 350, maxK: 600, regime: 'intrinsic' };
const preview = (payload: object, role: Role = 'physicist', id = sweepId) =>
  request(ctx.app).post(`/api/sweeps/${id}/fits/preview`).set(ctx.auth(role)).send(payload);
const stored = async () => ({
  fits: await Fit.count({ paranoid: false }),
  events: await AuditEvent.count({ where: { entity: 'fit' } }),
});

describe('POST /api/sweeps/:id/fits/preview', () => {
  it('answers the fit a save would store, without id, author or time, and stores nothing', async () => {
    const before = await stored();
    const res = await preview(body);
    expect(res.status).toBe(200);
    expect(await stored()).toEqual(before);
    expect(res.body).not.toHaveProperty('id');
    expect(res.body).not.toHaveProperty('createdAt');
    expect(res.body).not.toHaveProperty('createdBy');
    // Independent reference: simple-statistics' least squares of ln ρ on 1/(kT).
    const window = points.filter((p) => p.temperatureK >= 350 && p.temperatureK <= 600);
    const ref = linearRegression(
      window.map((p) => [1 / (BOLTZMANN_EV_PER_K * p.temperatureK), Math.log(p.resistivityOhmCm)]),
    );
    expect(Math.abs(res.body.parameters.activationEnergyEv / ref.m - 1)).toBeLessThan(1e-9);
    expect(res.body.goodness.count).toBe(window.length);

    // Saving the same request stores exactly what the preview showed.
    const saved = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits`)
      .set(ctx.auth('physicist'))
      .send(body);
    expect(saved.status).toBe(201);
    const { id: _id, createdAt: _at, createdBy: _by, ...rest } = saved.body;
    expect(rest).toEqual(res.body);
    const after = await stored();
    expect(after.fits).toBe(before.fits + 1);
    expect(after.events).toBe(before.events + 1);
  });

  it('follows the permission of saving a fit', async () => {
    for (const role of ['admin', 'manager', 'engineer', 'physicist'] as const) {
      expect((await preview(body, role)).status, role).toBe(200);
    }
    const before = await stored();
    expect((await preview(body, 'technician')).status).toBe(403);
    expect(
      (await request(ctx.app).post(`/api/sweeps/${sweepId}/fits/preview`).send(body)).status,
    ).toBe(401);
    expect((await preview(body, 'physicist', 999_999)).status).toBe(404);
    expect(await stored()).toEqual(before);
  });

  it('refuses a bad body as the save does, naming the field', async () => {
    const reversed = await preview({ ...body, minK: 600, maxK: 350 });
    expect(reversed.status).toBe(400);
    expect(JSON.stringify(reversed.body.error)).toMatch(/maxK/);
    const narrow = await preview({ kind: 'arrhenius', minK: 350, maxK: 352 });
    expect(narrow.status).toBe(400);
    expect(JSON.stringify(narrow.body.error)).toMatch(/minK/);
  });
});
