import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '@rhotrace/physics';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { Fit } from './fit.model';

let ctx: TestContext;
let sweepId: number;

beforeAll(async () => {
  ctx = await createTestContext();
  const { wafers } = await makeLot({ material: 'Si' });
  const points = synthesize(
    range(320, 620, 41),
    (t) => 2e-3 * Math.exp(0.25 / (BOLTZMANN_EV_PER_K * t)),
    { noise: 0.004, seed: 7 },
  );
  sweepId = (await makeSweep(wafers[0]!.id, ctx.users.engineer.id, points)).id;
});
afterAll(async () => ctx.close());

const stored = async () => ({
  fits: await Fit.count({ paranoid: false }),
  events: await AuditEvent.count({ where: { entity: 'fit' } }),
});

describe('fit windows and cancelled saves', () => {
  it('says when a window reaching past the readings was clipped to them', async () => {
    const res = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits/preview`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'arrhenius', minK: 96.41, maxK: 573.1, regime: 'intrinsic' });
    expect(res.status).toBe(200);
    expect(res.body.windowMinK).toBe(320);
    expect(res.body.windowMaxK).toBeLessThanOrEqual(573.1);
    expect(res.body.warnings.join(' ')).toContain(
      'The window asked for (96.41–573.1 K) reaches past the readings; it was fitted and is ' +
        'stored as 320.00–',
    );
    const inside = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits/preview`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'arrhenius', minK: 350, maxK: 500, regime: 'intrinsic' });
    expect(inside.body.warnings.join(' ')).not.toContain('reaches past the readings');
  });

  it('stores nothing when the client closes the connection before the answer', async () => {
    const server = ctx.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const { port } = server.address() as AddressInfo;
    const before = await stored();
    const payload = JSON.stringify({ kind: 'arrhenius', minK: 350, maxK: 600 });
    await new Promise<void>((resolve) => {
      const req = httpRequest({
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: `/api/sweeps/${sweepId}/fits`,
        headers: {
          ...ctx.auth('physicist'),
          'content-type': 'application/json',
          'content-length': Buffer.byteLength(payload),
        },
      });
      req.on('error', () => resolve()); // the socket we close ourselves
      // The whole request is sent, then the person cancels: the connection closes.
      req.end(payload, () => req.destroy());
      req.on('close', () => resolve());
    });
    // Let the server finish whatever it was doing with the request.
    await new Promise((resolve) => setTimeout(resolve, 500));
    await new Promise((resolve) => server.close(resolve));
    expect(await stored()).toEqual(before);

    // The same request left to finish is stored once.
    const saved = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'arrhenius', minK: 350, maxK: 600 });
    expect(saved.status).toBe(201);
    expect((await stored()).fits).toBe(before.fits + 1);
  });
});
