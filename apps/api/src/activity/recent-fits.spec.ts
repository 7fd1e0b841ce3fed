import type { RecentFitsResponse } from '@rhotrace/api-types';
import { BOLTZMANN_EV_PER_K } from '@rhotrace/physics';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assign, makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
let hiddenSweepId: number;
let assignedSweepId: number;
let assignedWaferId: number;
let lotCode: string;

// rho = 1e-3 exp(Ea / kT) with Ea = 0.3 eV: an activated sample, so Arrhenius fits succeed.
const activated = synthesize(
  range(300, 600, 31),
  (t) => 1e-3 * Math.exp(0.3 / (BOLTZMANN_EV_PER_K * t)),
  {
    noise: 0.002,
    seed: 5,
  },
);

const fit = async (sweepId: number, role: 'engineer' | 'physicist', minK: number) => {
  const res = await request(ctx.app)
    .post(`/api/sweeps/${sweepId}/fits`)
    .set(ctx.auth(role))
    .send({ kind: 'arrhenius', minK, maxK: 600 });
  expect(res.status).toBe(201);
  return res.body.id as number;
};

const get = (query: string, role: 'engineer' | 'physicist' | 'technician' = 'physicist') =>
  request(ctx.app).get(`/api/fits/recent${query}`).set(ctx.auth(role));

let ids: number[];

beforeAll(async () => {
  ctx = await createTestContext();
  const { lot, wafers } = await makeLot({ material: 'Si' }, ['F01', 'F02']);
  lotCode = lot.code;
  assignedWaferId = wafers[0]!.id;
  assignedSweepId = (await makeSweep(wafers[0]!.id, ctx.users.engineer.id, activated, 'f01.csv'))
    .id;
  hiddenSweepId = (await makeSweep(wafers[1]!.id, ctx.users.engineer.id, activated, 'f02.csv')).id;
  ids = [];
  ids.push(await fit(assignedSweepId, 'physicist', 300)); // oldest
  ids.push(await fit(hiddenSweepId, 'engineer', 350));
  ids.push(await fit(hiddenSweepId, 'physicist', 400)); // newest
});
afterAll(async () => ctx.close());

describe('GET /api/fits/recent', () => {
  it('lists the newest fits first with sweep, wafer and lot labels and the headline parameter', async () => {
    const res = await get('');
    expect(res.status).toBe(200);
    const body = res.body as RecentFitsResponse;
    expect(body.items.map((f) => f.id)).toEqual([ids[2], ids[1], ids[0]]);
    const newest = body.items[0]!;
    expect(newest).toMatchObject({
      kind: 'arrhenius',
      sweepId: hiddenSweepId,
      sweepName: 'f02.csv',
      waferNumber: 'F02',
      lotCode,
      windowMinK: 400,
      windowMaxK: 600,
      converged: true,
      createdBy: { id: ctx.users.physicist.id, name: ctx.users.physicist.name },
    });
    // The headline is the stored fit's own first parameter, with its standard error.
    const stored = await request(ctx.app).get(`/api/fits/${newest.id}`).set(ctx.auth('physicist'));
    const [key, value] = Object.entries(stored.body.parameters as Record<string, number>)[0]!;
    expect(newest.headline).toEqual({
      parameter: key,
      value,
      standardError: stored.body.standardErrors[key],
    });
    expect(key).toBe('activationEnergyEv');
    expect(value).toBeCloseTo(0.3, 1);
  });

  it('mine=true keeps only the caller’s fits; limit keeps to the newest', async () => {
    const mine = await get('?mine=true', 'engineer');
    expect(mine.status).toBe(200);
    expect(mine.body.items.map((f: { id: number }) => f.id)).toEqual([ids[1]]);
    const one = await get('?limit=1&mine=false');
    expect(one.body.items.map((f: { id: number }) => f.id)).toEqual([ids[2]]);
  });

  it('gives technicians only fits on sweeps of wafers assigned to them', async () => {
    const none = await get('', 'technician');
    expect(none.status).toBe(200);
    expect(none.body.items).toEqual([]);
    await assign(assignedWaferId, ctx.users.technician.id, ctx.users.manager.id);
    const visible = await get('', 'technician');
    expect(visible.body.items.map((f: { id: number }) => f.id)).toEqual([ids[0]]);
    expect(visible.body.items[0].sweepId).toBe(assignedSweepId);
  });

  it('leaves out fits whose sweep was deleted', async () => {
    const extra = await makeLot({ material: 'Si' }, ['F03']);
    const sweep = await makeSweep(extra.wafers[0]!.id, ctx.users.engineer.id, activated, 'f03.csv');
    const id = await fit(sweep.id, 'physicist', 320);
    expect((await get('')).body.items[0].id).toBe(id);
    await sweep.destroy();
    expect((await get('')).body.items.map((f: { id: number }) => f.id)).not.toContain(id);
  });

  it('refuses bad parameters by field (never reads recent as a fit id) and needs a session', async () => {
    const bad = await get('?mine=yes');
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('query.mine');
    const limit = await get('?limit=0');
    expect(limit.status).toBe(400);
    expect(limit.body.error.details[0].field).toBe('query.limit');
    expect((await request(ctx.app).get('/api/fits/recent')).status).toBe(401);
  });
});
