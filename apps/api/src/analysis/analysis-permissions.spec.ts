import request from 'supertest';
import type { Role } from '@rhotrace/api-types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { assign, makeLot, makeSweep, range, synthesize } from './testing/fixtures';

/**
 * Route × role → status for the analysis, fit and report routes:
 * everyone reads analysis of what they may see; technicians only their assigned wafers (404
 * otherwise, so existence does not leak) and never run fits (403); deleting a fit: admin and
 * manager any, engineer and physicist their own.
 */
let ctx: TestContext;
const ids = { open: 0, assigned: 0, openWafer: 0, assignedWafer: 0, openLot: 0, assignedLot: 0 };

beforeAll(async () => {
  ctx = await createTestContext();
  const points = synthesize(range(280, 320, 41), (t) => t / 60);
  const open = await makeLot({ specMinOhmCm: 1, specMaxOhmCm: 10 });
  const mine = await makeLot({ specMinOhmCm: 1, specMaxOhmCm: 10 });
  ids.open = (await makeSweep(open.wafers[0]!.id, ctx.users.engineer.id, points)).id;
  ids.assigned = (await makeSweep(mine.wafers[0]!.id, ctx.users.engineer.id, points)).id;
  ids.openWafer = open.wafers[0]!.id;
  ids.assignedWafer = mine.wafers[0]!.id;
  ids.openLot = open.lot.id;
  ids.assignedLot = mine.lot.id;
  await assign(mine.wafers[0]!.id, ctx.users.technician.id, ctx.users.manager.id);
});
afterAll(async () => ctx.close());

type Row = [string, 'get' | 'post', (i: typeof ids) => string, unknown, Record<Role, number>];
const all = (s: number): Record<Role, number> => ({
  admin: s,
  manager: s,
  engineer: s,
  physicist: s,
  technician: s,
});
const hidden = (s: number): Record<Role, number> => ({ ...all(s), technician: 404 });
const curve = {
  material: 'Si',
  doping: { donorDensity: 1e15, acceptorDensity: 0 },
  fromK: 100,
  toK: 400,
  steps: 10,
};
const tcr = { kind: 'tcr' };

const table: Row[] = [
  ['model curve', 'post', () => '/api/model/curve', curve, all(200)],
  ['materials', 'get', () => '/api/materials', null, all(200)],
  ['analysis, unassigned', 'get', (i) => `/api/sweeps/${i.open}/analysis`, null, hidden(200)],
  ['analysis, assigned', 'get', (i) => `/api/sweeps/${i.assigned}/analysis`, null, all(200)],
  ['fit list, unassigned', 'get', (i) => `/api/sweeps/${i.open}/fits`, null, hidden(200)],
  ['fit list, assigned', 'get', (i) => `/api/sweeps/${i.assigned}/fits`, null, all(200)],
  ['fits csv, unassigned', 'get', (i) => `/api/sweeps/${i.open}/fits.csv`, null, hidden(200)],
  [
    'run fit, unassigned',
    'post',
    (i) => `/api/sweeps/${i.open}/fits`,
    tcr,
    { ...all(201), technician: 403 },
  ],
  [
    'run fit, assigned',
    'post',
    (i) => `/api/sweeps/${i.assigned}/fits`,
    tcr,
    { ...all(201), technician: 403 },
  ],
  ['dopant, unassigned', 'get', (i) => `/api/wafers/${i.openWafer}/dopant`, null, hidden(200)],
  ['dopant, assigned', 'get', (i) => `/api/wafers/${i.assignedWafer}/dopant`, null, all(200)],
  ['lot summary, unassigned', 'get', (i) => `/api/lots/${i.openLot}/summary`, null, hidden(200)],
  ['lot summary, assigned', 'get', (i) => `/api/lots/${i.assignedLot}/summary`, null, all(200)],
  ['lot csv, unassigned', 'get', (i) => `/api/lots/${i.openLot}/summary.csv`, null, hidden(200)],
  [
    'compare, unassigned',
    'get',
    (i) => `/api/compare?sweeps=${i.open},${i.assigned}`,
    null,
    hidden(200),
  ],
  ['compare, assigned', 'get', (i) => `/api/compare?sweeps=${i.assigned}`, null, all(200)],
  ['report, unassigned', 'get', (i) => `/api/sweeps/${i.open}/report`, null, hidden(200)],
  ['report, assigned', 'get', (i) => `/api/sweeps/${i.assigned}/report`, null, all(200)],
];

describe('analysis routes by role', () => {
  for (const [name, method, path, body, expected] of table) {
    for (const role of Object.keys(expected) as Role[]) {
      it(`${name}: ${role} → ${expected[role]}`, async () => {
        const req = request(ctx.app)[method](path(ids)).set(ctx.auth(role));
        const res = body ? await req.send(body as object) : await req;
        expect(res.status).toBe(expected[role]);
      });
    }
    it(`${name}: no sign-in → 401`, async () => {
      const req = request(ctx.app)[method](path(ids));
      expect((body ? await req.send(body as object) : await req).status).toBe(401);
    });
  }
});

describe('deleting a fit by role', () => {
  const fitBy = async (role: Role) => {
    const res = await request(ctx.app)
      .post(`/api/sweeps/${ids.assigned}/fits`)
      .set(ctx.auth(role))
      .send(tcr);
    expect(res.status).toBe(201);
    return res.body.id as number;
  };
  const del = (id: number, header: { Authorization: string }) =>
    request(ctx.app).delete(`/api/fits/${id}`).set(header);

  it.each([
    ['admin', 'engineer', 204],
    ['manager', 'physicist', 204],
    ['engineer', 'engineer', 204],
    ['physicist', 'physicist', 204],
    ['engineer', 'physicist', 403],
    ['physicist', 'engineer', 403],
    ['technician', 'engineer', 403],
  ] as Array<[Role, Role, number]>)(
    '%s deleting a fit saved by %s → %i',
    async (who, owner, status) => {
      const id = await fitBy(owner);
      expect((await del(id, ctx.auth(who))).status).toBe(status);
    },
  );

  it('another engineer may not delete an engineer’s fit; a technician not assigned gets 404', async () => {
    const other = await ctx.addUser('engineer');
    const id = await fitBy('engineer');
    expect((await del(id, other.header)).status).toBe(403);
    const res = await request(ctx.app)
      .post(`/api/sweeps/${ids.open}/fits`)
      .set(ctx.auth('engineer'))
      .send(tcr);
    expect((await del(res.body.id as number, ctx.auth('technician'))).status).toBe(404);
  });
});
