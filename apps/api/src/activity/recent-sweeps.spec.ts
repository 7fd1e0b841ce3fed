import type { RecentSweepsResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assign, makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { createTestContext, type TestContext } from '../testing/test-context';
import type { Sweep } from '../sweeps/sweep.model';

let ctx: TestContext;
let lotCodes: string[];
let sweeps: Sweep[];
let deleted: Sweep;
let assignedWaferId: number;

const points = (n: number) => synthesize(range(250, 400, n), (t) => 10 + t / 100);

beforeAll(async () => {
  ctx = await createTestContext();
  const a = await makeLot({ material: 'Si' }, ['A01', 'A02']);
  const b = await makeLot({ material: 'Ge', dopant: 'Ga', dopantType: 'p' }, ['B01']);
  lotCodes = [a.lot.code, b.lot.code];
  assignedWaferId = a.wafers[1]!.id;
  sweeps = [];
  // Oldest to newest: A01 (5 pts), A02 (7 pts), B01 (9 pts), A02 (11 pts).
  sweeps.push(await makeSweep(a.wafers[0]!.id, ctx.users.engineer.id, points(5), 'a01.csv'));
  sweeps.push(await makeSweep(a.wafers[1]!.id, ctx.users.technician.id, points(7), 'a02-1.csv'));
  sweeps.push(await makeSweep(b.wafers[0]!.id, ctx.users.engineer.id, points(9), 'b01.csv'));
  sweeps.push(await makeSweep(a.wafers[1]!.id, ctx.users.physicist.id, points(11), 'a02-2.csv'));
  deleted = await makeSweep(b.wafers[0]!.id, ctx.users.engineer.id, points(4), 'gone.csv');
  await deleted.destroy();
});
afterAll(async () => ctx.close());

const get = (query: string, role: 'engineer' | 'technician' | 'manager' = 'engineer') =>
  request(ctx.app).get(`/api/sweeps/recent${query}`).set(ctx.auth(role));

describe('GET /api/sweeps/recent', () => {
  it('lists the newest sweeps first with wafer, lot, uploader and point count', async () => {
    const res = await get('?limit=10');
    expect(res.status).toBe(200);
    const body = res.body as RecentSweepsResponse;
    expect(body.items.map((s) => s.originalName)).toEqual([
      'a02-2.csv',
      'b01.csv',
      'a02-1.csv',
      'a01.csv',
    ]);
    const [newest, second] = body.items;
    expect(newest).toMatchObject({
      id: sweeps[3]!.id,
      waferNumber: 'A02',
      lotCode: lotCodes[0],
      material: 'Si',
      method: 'four-point',
      pointCount: 11,
      uploadedBy: { id: ctx.users.physicist.id, name: ctx.users.physicist.name },
    });
    expect(second).toMatchObject({ waferNumber: 'B01', lotCode: lotCodes[1], material: 'Ge' });
    expect(newest!.minTemperatureK).toBe(250);
    expect(newest!.maxTemperatureK).toBe(400);
    expect(Date.parse(newest!.createdAt)).toBeGreaterThanOrEqual(Date.parse(second!.createdAt));
  });

  it('keeps to the limit and leaves deleted sweeps out', async () => {
    const res = await get('?limit=2');
    expect(res.status).toBe(200);
    expect(res.body.items.map((s: { id: number }) => s.id)).toEqual([sweeps[3]!.id, sweeps[2]!.id]);
    const all = await get('?limit=50');
    expect(all.body.items.map((s: { id: number }) => s.id)).not.toContain(deleted.id);
  });

  it('is not read as a sweep id (the route is mounted before /sweeps/:id)', async () => {
    const res = await get('');
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(4);
  });

  it('gives technicians only the sweeps of wafers assigned to them', async () => {
    const none = await get('', 'technician');
    expect(none.status).toBe(200);
    expect(none.body.items).toEqual([]);
    await assign(assignedWaferId, ctx.users.technician.id, ctx.users.manager.id);
    const mine = await get('', 'technician');
    expect(mine.body.items.map((s: { originalName: string }) => s.originalName)).toEqual([
      'a02-2.csv',
      'a02-1.csv',
    ]);
  });

  it('refuses a bad limit or an unknown parameter by field, and needs a session', async () => {
    for (const query of ['?limit=0', '?limit=51', '?limit=2.5', '?limit=many']) {
      const res = await get(query);
      expect(res.status, query).toBe(400);
      expect(res.body.error.details[0].field).toBe('query.limit');
    }
    const extra = await get('?since=yesterday');
    expect(extra.status).toBe(400);
    expect(extra.body.error.details[0].field).toBe('query.since');
    const anonymous = await request(ctx.app).get('/api/sweeps/recent');
    expect(anonymous.status).toBe(401);
  });
});
