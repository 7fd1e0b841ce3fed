import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fourPointCsv } from '../testing/sweep-files';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeWafer } from './sweep-test-helpers';
import { getSweep } from './sweep.service';

describe('reading a sweep twice (points kept in memory after the first read)', () => {
  let ctx: TestContext;
  let sweepId: number;
  beforeAll(async () => {
    ctx = await createTestContext();
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', fourPointCsv(300), 'cache.csv');
    expect(res.status).toBe(201);
    sweepId = res.body.id;
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('answers the second read with exactly the stored points, without reading them again', async () => {
    const first = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('physicist'));
    expect(first.status).toBe(200);
    expect(first.body.points).toHaveLength(300);
    // Points are immutable once committed; prove the second answer does not come from the table.
    await ctx.sequelize.query(
      'UPDATE sweep_points SET resistivity_ohm_cm = -1 WHERE sweep_id = ?',
      {
        replacements: [sweepId],
      },
    );
    const second = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('physicist'));
    expect(second.body).toEqual(first.body);
    // the answer is spliced from cached JSON text: it must be exactly the DTO serialised whole
    const physicist = { ...ctx.users.physicist.get({ plain: true }), requestId: null };
    const dto = await getSweep(sweepId, physicist);
    expect(second.text).toBe(JSON.stringify(dto));
    expect(second.headers['content-type']).toMatch(/^application\/json; charset=utf-8/);
    expect(second.headers['content-encoding']).toBe('gzip');
    expect(second.headers['vary']).toMatch(/Accept-Encoding/);
    expect(dto.uploadedByName).toBe(ctx.users.engineer.name);
    const plain = await request(ctx.app)
      .get(`/api/sweeps/${sweepId}`)
      .set(ctx.auth('physicist'))
      .set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(JSON.stringify(dto));
    expect(plain.headers['etag']).toBe(second.headers['etag']);
  });

  it('answers a revalidation with 304, and a renamed uploader with a new body and tag', async () => {
    const first = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('manager'));
    const etag = first.headers['etag'] as string;
    expect(etag).toMatch(/^W\/"sweep-\d+-300-/);
    const again = await request(ctx.app)
      .get(`/api/sweeps/${sweepId}`)
      .set(ctx.auth('manager'))
      .set('If-None-Match', etag);
    expect(again.status).toBe(304);
    const renamed = await request(ctx.app)
      .patch(`/api/users/${ctx.users.engineer.id}`)
      .set(ctx.auth('admin'))
      .send({ name: 'Renamed Engineer' });
    expect(renamed.status).toBe(200);
    const after = await request(ctx.app)
      .get(`/api/sweeps/${sweepId}`)
      .set(ctx.auth('manager'))
      .set('If-None-Match', etag);
    expect(after.status).toBe(200);
    expect(after.headers['etag']).not.toBe(etag);
    expect(after.body.uploadedByName).toBe('Renamed Engineer');
    expect(after.body.points).toEqual(first.body.points);
  });

  it('does not mistake another sweep under the same id (as after a restore) for the cached one', async () => {
    const before = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('manager'));
    expect(before.body.points[0].resistivityOhmCm).not.toBe(42);
    // what a restore of an older backup followed by a new upload can leave: same id, new sweep
    await ctx.sequelize.query("UPDATE sweeps SET sha256 = REPEAT('f', 64) WHERE id = ?", {
      replacements: [sweepId],
    });
    await ctx.sequelize.query(
      'UPDATE sweep_points SET resistivity_ohm_cm = 42 WHERE sweep_id = ?',
      { replacements: [sweepId] },
    );
    const after = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('manager'));
    expect(after.body.sha256).toBe('f'.repeat(64));
    expect(after.body.points.map((p: { resistivityOhmCm: number }) => p.resistivityOhmCm)).toEqual(
      Array(300).fill(42),
    );
  });

  it('still hides the sweep from a technician who is not assigned, and forgets it once deleted', async () => {
    const hidden = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('technician'));
    expect(hidden.status).toBe(404);
    const del = await request(ctx.app).delete(`/api/sweeps/${sweepId}`).set(ctx.auth('engineer'));
    expect(del.status).toBe(204);
    const gone = await request(ctx.app).get(`/api/sweeps/${sweepId}`).set(ctx.auth('physicist'));
    expect(gone.status).toBe(404);
  });
});
