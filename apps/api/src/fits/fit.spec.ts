import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  BOLTZMANN_EV_PER_K,
  blochGruneisen,
  metalResistivity,
  resistivity,
} from '@rhotrace/physics';
import { linearRegression } from 'simple-statistics';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { Fit } from './fit.model';

let ctx: TestContext;
let arrheniusSweepId: number;
let arrheniusPoints: Array<{ temperatureK: number; resistivityOhmCm: number }>;

const EA_TRUE = 0.3; // eV
beforeAll(async () => {
  ctx = await createTestContext();
  const { wafers } = await makeLot({ material: 'Si' });
  // rho = 1e-3 exp(Ea / kT), 0.5 % noise: a purely activated synthetic sample
  arrheniusPoints = synthesize(
    range(300, 600, 61),
    (t) => 1e-3 * Math.exp(EA_TRUE / (BOLTZMANN_EV_PER_K * t)),
    {
      noise: 0.005,
      seed: 11,
    },
  );
  arrheniusSweepId = (await makeSweep(wafers[0]!.id, ctx.users.engineer.id, arrheniusPoints)).id;
});
afterAll(async () => ctx.close());

const post = (
  sweepId: number,
  body: unknown,
  role: 'admin' | 'engineer' | 'physicist' | 'manager' | 'technician' = 'engineer',
) =>
  request(ctx.app)
    .post(`/api/sweeps/${sweepId}/fits`)
    .set(ctx.auth(role))
    .send(body as object);

describe('Arrhenius fit', () => {
  it('recovers the activation energy and equals an independent least-squares fit to 1e-9', async () => {
    const res = await post(arrheniusSweepId, {
      kind: 'arrhenius',
      minK: 350,
      maxK: 550,
      regime: 'intrinsic',
    });
    expect(res.status).toBe(201);
    const fit = res.body;
    const window = arrheniusPoints.filter((p) => p.temperatureK >= 350 && p.temperatureK <= 550);
    expect(fit.goodness.count).toBe(window.length);
    // Independent reference: simple-statistics linearRegression of ln(rho) on 1/(kT).
    const ref = linearRegression(
      window.map((p) => [1 / (BOLTZMANN_EV_PER_K * p.temperatureK), Math.log(p.resistivityOhmCm)]),
    );
    expect(Math.abs(fit.parameters.activationEnergyEv / ref.m - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fit.parameters.intercept / ref.b - 1)).toBeLessThan(1e-9);
    // Known parameter back within the 95 % interval and 2 %.
    const [lo, hi] = fit.confidenceIntervals.activationEnergyEv;
    expect(lo).toBeLessThan(EA_TRUE);
    expect(hi).toBeGreaterThan(EA_TRUE);
    expect(Math.abs(fit.parameters.activationEnergyEv / EA_TRUE - 1)).toBeLessThan(0.02);
    expect(fit.goodness.rSquared).toBeGreaterThan(0.999);
    expect(fit.residuals).toHaveLength(window.length);
    expect(fit.reading).toMatch(/band gap/);
    expect(fit.converged).toBe(true);
    expect(fit.inputs).toMatchObject({
      minK: 350,
      maxK: 550,
      quantity: 'resistivity',
      prefactorExponent: 0,
      regime: 'intrinsic',
    });
    expect(fit.modelVersion).toMatch(/^physics@\d+\.\d+\.\d+\+arrhenius$/);
    expect(fit.createdBy).toEqual({ id: ctx.users.engineer.id, name: ctx.users.engineer.name });
  });

  it('fits conductivity with a T^1.5 prefactor as ln(sigma T^-1.5) = a - Ea/kT (simple-statistics reference)', async () => {
    const res = await post(arrheniusSweepId, {
      kind: 'arrhenius',
      minK: 300,
      maxK: 600,
      quantity: 'conductivity',
      prefactorExponent: 1.5,
      regime: 'freeze-out',
    });
    expect(res.status).toBe(201);
    const ref = linearRegression(
      arrheniusPoints.map((p) => [
        1 / (BOLTZMANN_EV_PER_K * p.temperatureK),
        Math.log((1 / p.resistivityOhmCm) * p.temperatureK ** -1.5),
      ]),
    );
    expect(Math.abs(res.body.parameters.activationEnergyEv / -ref.m - 1)).toBeLessThan(1e-9);
    expect(res.body.reading).toMatch(/ionization energy/);
  });

  it.each([
    [{ kind: 'arrhenius', minK: 300, maxK: 305 }, /holds 2 points; a fit needs at least 3/],
    [{ kind: 'arrhenius', minK: 500, maxK: 400 }, /reversed/],
    [{ kind: 'arrhenius', minK: 0, maxK: 400 }, /positive/],
    [{ kind: 'arrhenius', minK: -50, maxK: 400 }, /positive/],
    [{ kind: 'arrhenius', minK: 300 }, /required/],
    [{ kind: 'fourier', minK: 300, maxK: 400 }, /arrhenius, model, tcr, bloch-gruneisen/],
    [
      { kind: 'model', initial: { donorDensity: 1e15, acceptorDensity: 0 }, free: [] },
      /at least one/,
    ],
  ])('answers 400 saying why for %j', async (body, message) => {
    const res = await post(arrheniusSweepId, body);
    expect(res.status).toBe(400);
    const text = `${res.body.error.message} ${JSON.stringify(res.body.error.details ?? [])}`;
    expect(text).toMatch(message);
  });
});

describe('full-model fit', () => {
  it('recovers donor density within 3 % and level within 3 meV (physics issue tolerances)', async () => {
    const doping = { donorDensity: 2e15, acceptorDensity: 0, donorLevel: 0.045 };
    const { wafers } = await makeLot({ material: 'Si', dopant: 'P' });
    const points = synthesize(range(25, 320, 60), (t) => resistivity('Si', doping, t), {
      noise: 0.005,
      seed: 5,
    });
    const sweep = await makeSweep(wafers[0]!.id, ctx.users.physicist.id, points);
    const res = await post(
      sweep.id,
      {
        kind: 'model',
        initial: { donorDensity: 1.4e15, acceptorDensity: 0, donorLevel: 0.035 },
        free: ['donorDensity', 'donorLevel'],
      },
      'physicist',
    );
    expect(res.status).toBe(201);
    expect(res.body.converged).toBe(true);
    expect(Math.abs(res.body.parameters.donorDensity / 2e15 - 1)).toBeLessThan(0.03);
    expect(Math.abs(res.body.parameters.donorLevel - 0.045)).toBeLessThan(0.003);
    expect(res.body.standardErrors.donorDensity).toBeGreaterThan(0);
    expect(res.body.confidenceIntervals.donorLevel[0]).toBeLessThan(res.body.parameters.donorLevel);
    expect(res.body.goodness.residualRms).toBeLessThan(0.01);
    expect(res.body.inputs).toMatchObject({ material: 'Si', free: ['donorDensity', 'donorLevel'] });
  });

  it('stores a fit that does not converge, with converged false and the reason (still 201)', async () => {
    const { wafers } = await makeLot({ material: 'Si' });
    // 5 ohm cm with a 30 % ripple: no doping explains it, five free parameters wander
    const points = range(25, 320, 60).map((t) => ({
      temperatureK: t,
      resistivityOhmCm: 5 * (1 + 0.3 * Math.sin(t)),
    }));
    const sweep = await makeSweep(wafers[0]!.id, ctx.users.admin.id, points);
    const res = await post(
      sweep.id,
      {
        kind: 'model',
        initial: { donorDensity: 1e15, acceptorDensity: 1e14 },
        free: ['donorDensity', 'acceptorDensity', 'donorLevel', 'acceptorLevel', 'mobilityScale'],
      },
      'admin',
    );
    expect(res.status).toBe(201);
    expect(res.body.converged).toBe(false);
    expect(res.body.reason).toMatch(/\w+/);
    expect(res.body.reading).toMatch(/did not converge/);
    expect((await Fit.findByPk(res.body.id))!.converged).toBe(false);
    // the answer to the POST is exactly what reading the stored fit gives
    const stored = await request(ctx.app).get(`/api/fits/${res.body.id}`).set(ctx.auth('admin'));
    expect(stored.body).toEqual(res.body);
  });
});

describe('metal fits', () => {
  it('linear TCR recovers alpha of the copper reference within 2 %', async () => {
    const { wafers } = await makeLot({ material: 'Cu', dopant: null, dopantType: null });
    const points = synthesize(range(200, 400, 41), (t) => metalResistivity('Cu', t), {
      noise: 0.001,
      seed: 3,
    });
    const sweep = await makeSweep(wafers[0]!.id, ctx.users.engineer.id, points);
    const res = await post(sweep.id, { kind: 'tcr' });
    expect(res.status).toBe(201);
    const stored = await request(ctx.app).get(`/api/fits/${res.body.id}`).set(ctx.auth('engineer'));
    expect(stored.body).toEqual(res.body);
    expect(res.body.inputs.referenceK).toBe(293.15);
    expect(Math.abs(res.body.parameters.alphaPerK / 0.0039 - 1)).toBeLessThan(0.02);
    expect(
      Math.abs(res.body.parameters.referenceResistivityOhmCm / metalResistivity('Cu', 293.15) - 1),
    ).toBeLessThan(0.005);
    const [lo, hi] = res.body.confidenceIntervals.alphaPerK;
    expect(lo).toBeLessThan(res.body.parameters.alphaPerK);
    expect(hi).toBeGreaterThan(res.body.parameters.alphaPerK);
  });

  it('Bloch–Grüneisen recovers residual, coupling and Debye temperature within 3 %', async () => {
    const truth = { residualOhmCm: 2e-7, couplingOhmCm: 7e-6, debyeK: 343 };
    const { wafers } = await makeLot({ material: 'Cu', dopant: null, dopantType: null });
    const points = synthesize(range(20, 400, 60), (t) => blochGruneisen(t, truth), {
      noise: 0.005,
      seed: 9,
    });
    const sweep = await makeSweep(wafers[0]!.id, ctx.users.engineer.id, points);
    const res = await post(sweep.id, { kind: 'bloch-gruneisen' });
    expect(res.status).toBe(201);
    const stored = await request(ctx.app).get(`/api/fits/${res.body.id}`).set(ctx.auth('engineer'));
    expect(stored.body).toEqual(res.body);
    expect(res.body.converged).toBe(true);
    for (const key of ['residualOhmCm', 'couplingOhmCm', 'debyeK'] as const) {
      expect(Math.abs(res.body.parameters[key] / truth[key] - 1)).toBeLessThan(0.03);
    }
  });
});

describe('reading, listing and deleting fits', () => {
  it('lists, gets, re-runs from stored inputs, soft-deletes with audit events', async () => {
    const created = await post(
      arrheniusSweepId,
      { kind: 'arrhenius', minK: 400, maxK: 600 },
      'physicist',
    );
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const rerun = await post(arrheniusSweepId, created.body.inputs, 'physicist');
    expect(rerun.status).toBe(201);
    expect(rerun.body.parameters).toEqual(created.body.parameters);

    const list = await request(ctx.app)
      .get(`/api/sweeps/${arrheniusSweepId}/fits`)
      .set(ctx.auth('technician'));
    expect(list.status).toBe(404); // the technician is not assigned to this wafer
    const list2 = await request(ctx.app)
      .get(`/api/sweeps/${arrheniusSweepId}/fits`)
      .set(ctx.auth('manager'));
    expect(list2.body.map((f: { id: number }) => f.id)).toContain(id);
    const one = await request(ctx.app).get(`/api/fits/${id}`).set(ctx.auth('manager'));
    expect(one.body).toEqual(created.body);

    expect(
      (await request(ctx.app).delete(`/api/fits/${id}`).set(ctx.auth('engineer'))).status,
    ).toBe(403);
    expect(
      (await request(ctx.app).delete(`/api/fits/${id}`).set(ctx.auth('physicist'))).status,
    ).toBe(204);
    expect((await request(ctx.app).get(`/api/fits/${id}`).set(ctx.auth('manager'))).status).toBe(
      404,
    );
    expect(await Fit.findByPk(id, { paranoid: false })).not.toBeNull();
    const events = await AuditEvent.findAll({
      where: { entity: 'fit', entityId: String(id) },
      order: [['id', 'ASC']],
    });
    expect(events.map((e) => e.action)).toEqual(['create', 'delete']);
    expect(events[1]!.actorId).toBe(ctx.users.physicist.id);
  });

  it('exports fits as CSV, one row per parameter', async () => {
    const res = await request(ctx.app)
      .get(`/api/sweeps/${arrheniusSweepId}/fits.csv`)
      .set(ctx.auth('admin'));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toMatch(
      /^fit_id,sweep_id,kind,window_min_k,window_max_k,parameter,value,standard_error/,
    );
    expect(lines.some((l) => /,activationEnergyEv,/.test(l))).toBe(true);
  });
});
