import type { Role } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { assignToTechnician, makeWafer } from './sweep-test-helpers';

/** Sweep import: the status each role gets (technicians see only their assigned wafers). */
const MATRIX: Array<{ action: string; expected: Record<Role, number> }> = [
  {
    action: 'upload to an unassigned wafer',
    expected: { admin: 201, manager: 201, engineer: 201, physicist: 201, technician: 404 },
  },
  {
    action: 'upload to an assigned wafer',
    expected: { admin: 201, manager: 201, engineer: 201, physicist: 201, technician: 201 },
  },
  {
    action: 'preview on an unassigned wafer',
    expected: { admin: 200, manager: 200, engineer: 200, physicist: 200, technician: 404 },
  },
  {
    action: 'read a sweep of an unassigned wafer',
    expected: { admin: 200, manager: 200, engineer: 200, physicist: 200, technician: 404 },
  },
  {
    action: 'read a sweep of an assigned wafer',
    expected: { admin: 200, manager: 200, engineer: 200, physicist: 200, technician: 200 },
  },
  {
    action: "delete someone else's sweep",
    expected: { admin: 204, manager: 204, engineer: 403, physicist: 403, technician: 403 },
  },
  {
    action: 'delete an own upload',
    expected: { admin: 204, manager: 204, engineer: 204, physicist: 204, technician: 403 },
  },
];
const ROLES: Role[] = ['admin', 'manager', 'engineer', 'physicist', 'technician'];

let ctx: TestContext;
let openWaferId: number;
let assignedWaferId: number;
let rowCounter = 0;

beforeAll(async () => {
  ctx = await createTestContext();
  openWaferId = (await makeWafer({ thicknessCm: 0.05 })).id;
  assignedWaferId = (await makeWafer({ thicknessCm: 0.05 })).id;
  await assignToTechnician(ctx, assignedWaferId);
});
afterAll(async () => {
  await ctx.close();
});

/** A file no other test uploads (so no duplicate answers get in the way). */
function uniqueFile(): Buffer {
  rowCounter += 1;
  return Buffer.from(`T (K),I (mA),V (mV)\n${300 + rowCounter / 1000},1,10\n`);
}

function upload(role: Role, waferId: number) {
  return request(ctx.app)
    .post(`/api/wafers/${waferId}/sweeps`)
    .set(ctx.auth(role))
    .field('method', 'four-point')
    .field('spacingCm', '0.1')
    .attach('file', uniqueFile(), 'perm.csv');
}

async function sweepBy(role: Role, waferId: number): Promise<number> {
  const res = await upload(role, waferId);
  expect(res.status).toBe(201);
  return res.body.id as number;
}

async function attempt(action: string, role: Role): Promise<number> {
  switch (action) {
    case 'upload to an unassigned wafer':
      return (await upload(role, openWaferId)).status;
    case 'upload to an assigned wafer':
      return (await upload(role, assignedWaferId)).status;
    case 'preview on an unassigned wafer':
      return (
        await request(ctx.app)
          .post(`/api/wafers/${openWaferId}/sweeps/preview`)
          .set(ctx.auth(role))
          .attach('file', uniqueFile(), 'p.csv')
      ).status;
    case 'read a sweep of an unassigned wafer': {
      const id = await sweepBy('engineer', openWaferId);
      const one = await request(ctx.app).get(`/api/sweeps/${id}`).set(ctx.auth(role));
      const list = await request(ctx.app)
        .get(`/api/wafers/${openWaferId}/sweeps`)
        .set(ctx.auth(role));
      const csv = await request(ctx.app).get(`/api/sweeps/${id}/points.csv`).set(ctx.auth(role));
      const raw = await request(ctx.app).get(`/api/sweeps/${id}/raw`).set(ctx.auth(role));
      expect(new Set([one.status, list.status, csv.status, raw.status]).size).toBe(1);
      return one.status;
    }
    case 'read a sweep of an assigned wafer': {
      const id = await sweepBy('engineer', assignedWaferId);
      return (await request(ctx.app).get(`/api/sweeps/${id}`).set(ctx.auth(role))).status;
    }
    case "delete someone else's sweep": {
      const { header } = await ctx.addUser('engineer');
      const res = await request(ctx.app)
        .post(`/api/wafers/${assignedWaferId}/sweeps`)
        .set(header)
        .field('method', 'four-point')
        .field('spacingCm', '0.1')
        .attach('file', uniqueFile(), 'other.csv');
      return (await request(ctx.app).delete(`/api/sweeps/${res.body.id}`).set(ctx.auth(role)))
        .status;
    }
    case 'delete an own upload': {
      const id = await sweepBy(role, assignedWaferId);
      return (await request(ctx.app).delete(`/api/sweeps/${id}`).set(ctx.auth(role))).status;
    }
    default:
      throw new Error(`no attempt for ${action}`);
  }
}

describe('sweep import permissions', () => {
  for (const { action, expected } of MATRIX) {
    for (const role of ROLES) {
      it(`${role}: ${action} → ${expected[role]}`, async () => {
        expect(await attempt(action, role)).toBe(expected[role]);
      });
    }
  }

  it('requires sign-in', async () => {
    const res = await request(ctx.app)
      .post(`/api/wafers/${openWaferId}/sweeps`)
      .attach('file', uniqueFile(), 'x.csv');
    expect(res.status).toBe(401);
  });

  it('a deleted sweep is gone from reads, audited, and kept in the table', async () => {
    const id = await sweepBy('physicist', openWaferId);
    expect(
      (await request(ctx.app).delete(`/api/sweeps/${id}`).set(ctx.auth('physicist'))).status,
    ).toBe(204);
    expect((await request(ctx.app).get(`/api/sweeps/${id}`).set(ctx.auth('admin'))).status).toBe(
      404,
    );
    const list = await request(ctx.app)
      .get(`/api/wafers/${openWaferId}/sweeps`)
      .set(ctx.auth('admin'));
    expect(list.body.map((s: { id: number }) => s.id)).not.toContain(id);
    const [rows] = await ctx.sequelize.query(
      `SELECT deleted_by_id AS d FROM sweeps WHERE id = ${id} AND deleted_at IS NOT NULL`,
    );
    expect(rows).toEqual([{ d: ctx.users.physicist.id }]);
    const [audit] = await ctx.sequelize.query(
      `SELECT action FROM audit_events WHERE entity = 'sweep' AND entity_id = '${id}' ORDER BY id`,
    );
    expect(audit).toEqual([{ action: 'create' }, { action: 'delete' }]);
  });
});
