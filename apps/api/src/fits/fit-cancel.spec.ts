import express, { type Request, type Response } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '@rhotrace/physics';
import { AuditEvent } from '../audit/audit-event.model';
import { createLogger } from '../logger';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { Fit } from './fit.model';
import { fitsController } from './fit.controller';
import { createFit } from './fit.service';

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

  it('stores nothing when the person cancels before the fit is stored', async () => {
    // The controller aborts this signal when the client's connection closes before the answer
    // (fit.controller.ts); here the abort lands while the fit is being computed, every time,
    // instead of racing a socket close against a fast machine.
    const before = await stored();
    const u = ctx.users.physicist;
    const cancel = new AbortController();
    const pending = createFit(
      ctx.sequelize,
      { id: u.id, email: u.email, name: u.name, role: u.role },
      sweepId,
      { kind: 'arrhenius', minK: 350, maxK: 600 },
      { id: u.id, requestId: null },
      cancel.signal,
    );
    cancel.abort();
    await expect(pending).rejects.toMatchObject({ status: 409 });
    expect(await stored()).toEqual(before);

    // The same request left to finish is stored once.
    const saved = await request(ctx.app)
      .post(`/api/sweeps/${sweepId}/fits`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'arrhenius', minK: 350, maxK: 600 });
    expect(saved.status).toBe(201);
    expect((await stored()).fits).toBe(before.fits + 1);
  });

  it('the controller cancels the save when the connection closes before the answer', async () => {
    // Express's own request and response prototypes, without a socket: the response emits
    // 'close' at once, as Node does when the client goes away, while the fit is computed.
    const before = await stored();
    const u = ctx.users.physicist;
    const req: Request = Object.assign(Object.create(express.request) as Request, {
      params: { id: String(sweepId) },
      body: { kind: 'arrhenius', minK: 350, maxK: 600 },
      user: { id: u.id, email: u.email, name: u.name, role: u.role },
    });
    const res = Object.create(express.response) as Response;
    const controller = fitsController({
      config: ctx.config,
      sequelize: ctx.sequelize,
      mailer: ctx.mailer,
      logger: createLogger('silent'),
    });
    const pending = controller.create(req, res);
    res.emit('close');
    await expect(pending).rejects.toMatchObject({ status: 409 });
    expect(await stored()).toEqual(before);
  });
});
