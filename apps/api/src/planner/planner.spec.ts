import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PlannerResponse } from '@rhotrace/api-types';
import { regimeBoundaries, siliconDopantFromResistivity } from '@rhotrace/physics';
import { CRYOGEN, DEFER_TO_LAB_RULES, HOT_CHUCK } from '../assignments/assignment-safety';
import { documentProblems } from '../openapi/testing/document-validator';
import { createTestContext, type TestContext } from '../testing/test-context';

describe('POST /api/planner', () => {
  let ctx: TestContext;
  let siWafer: number;
  let stationId: number;
  const meter = { targetVoltageV: 0.01, maxVoltageV: 0.1, maxPowerW: 1e-3 };
  const plan = (body: object, role: 'engineer' | 'technician' = 'engineer') =>
    request(ctx.app).post('/api/planner').set(ctx.auth(role)).send(body);
  const base = () => ({
    waferId: siWafer,
    stationId,
    minK: 20,
    maxK: 400,
    count: 40,
    spacing: 'inverse',
    ...meter,
  });

  beforeAll(async () => {
    ctx = await createTestContext();
    // 10 ohm cm boron-doped silicon, 500 um thick (spec 9-11 ohm cm, middle 10).
    const lot = await request(ctx.app).post('/api/lots').set(ctx.auth('manager')).send({
      code: 'PLAN-1',
      material: 'Si',
      dopant: 'B',
      dopantType: 'p',
      thicknessCm: 0.05,
      specMinOhmCm: 9,
      specMaxOhmCm: 11,
    });
    siWafer = (
      await request(ctx.app)
        .post(`/api/lots/${lot.body.id}/wafers`)
        .set(ctx.auth('manager'))
        .send({ number: 'P1' })
    ).body.id;
    stationId = (
      await request(ctx.app).post('/api/stations').set(ctx.auth('manager')).send({
        name: 'Planner cryostat',
        probeSpacingCm: 0.1,
        thermometer: 'platinum-rtd',
        rtdR0Ohm: 100,
        minTemperatureK: 10,
        maxTemperatureK: 450,
      })
    ).body.id;
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('plans a 10 ohm cm, 500 um silicon wafer over 20-400 K within the meter and power', async () => {
    const res = await plan(base());
    expect(res.status).toBe(200);
    const body = res.body as PlannerResponse;
    expect(body.steps).toHaveLength(40);
    expect(documentProblems('POST', '/planner', 200, res.body)).toEqual([]);
    for (const s of body.steps) {
      expect(s.voltageV).toBeGreaterThanOrEqual(meter.maxVoltageV / 1000);
      expect(s.voltageV).toBeLessThanOrEqual(meter.maxVoltageV);
      expect(s.powerW).toBeLessThanOrEqual(meter.maxPowerW);
      expect(s.expectedSheetResistanceOhmSq).toBeCloseTo(s.expectedResistivityOhmCm / 0.05, 6);
    }
    expect(body.currentRanges.length).toBeGreaterThan(1);
    expect(body.currentRanges.reduce((n, r) => n + r.stepCount, 0)).toBe(40);
    // Doping through ASTM F723 at 10 ohm cm (Thurber et al. 1981), freeze-out from the model.
    const acceptors = siliconDopantFromResistivity('boron', 10);
    expect(body.basis.doping!.acceptorDensity / acceptors).toBeCloseTo(1, 9);
    expect(body.basis.dopingSource).toMatch(/ASTM F723/);
    const expected = regimeBoundaries('Si', { donorDensity: 0, acceptorDensity: acceptors });
    expect(body.regimeBoundaries!.freezeOutBelowK).toBeCloseTo(expected.freezeOutBelowK!, 3);
    const frozen = body.steps
      .filter((s) => s.regime === 'freeze-out')
      .map((s) => 1 / s.temperatureK);
    expect(frozen.length).toBeGreaterThan(5);
    const gaps = frozen.slice(1).map((v, i) => frozen[i]! - v);
    for (const g of gaps) expect(g / gaps[0]!).toBeCloseTo(1, 9);
    // Room temperature near 300 K: the model's extrinsic rho is close to the 10 ohm cm spec.
    const room = body.steps.reduce((a, s) =>
      Math.abs(s.temperatureK - 296) < Math.abs(a.temperatureK - 296) ? s : a,
    );
    expect(room.expectedResistivityOhmCm).toBeGreaterThan(8);
    expect(room.expectedResistivityOhmCm).toBeLessThan(12);
    expect(body.cautions).toEqual([CRYOGEN, DEFER_TO_LAB_RULES]);
  });

  it('estimates the duration from the dwell and the ramp (worked by hand)', async () => {
    const res = await plan({
      ...base(),
      minK: 296.15,
      maxK: 316.15,
      count: 3,
      spacing: 'linear',
      dwellS: 100,
      rampKPerMin: 2,
    });
    // 0 + 10 + 10 K out, 20 K back: 40 K at 2 K/min = 1200 s, plus 3 x 100 s.
    expect(res.body.estimatedDurationS).toBeCloseTo(1500, 9);
  });

  it('adds steps around the freeze-out boundary when asked, and warns of the hot chuck', async () => {
    const plain = (await plan({ ...base(), maxK: 420, count: 10 })).body as PlannerResponse;
    const dense = (await plan({ ...base(), maxK: 420, count: 10, denseAroundTransitions: true }))
      .body as PlannerResponse;
    const b = plain.regimeBoundaries!.freezeOutBelowK!;
    expect(dense.steps.length).toBeGreaterThan(plain.steps.length);
    const near = (p: PlannerResponse) =>
      p.steps.filter((s) => Math.abs(s.temperatureK / b - 1) <= 0.1).length;
    expect(near(dense) - near(plain)).toBeGreaterThanOrEqual(3);
    expect(dense.cautions).toContain(HOT_CHUCK);
  });

  it('switches the current only where one current cannot serve', async () => {
    const res = await plan({ ...base(), minK: 280, maxK: 320, count: 5, spacing: 'linear' });
    expect(res.body.currentRanges).toHaveLength(1);
    expect(res.body.warnings).toEqual([]);
  });

  it('warns when the minimum current of the source pushes voltage and power over', async () => {
    const res = await plan({ ...base(), minK: 20, maxK: 30, count: 3, minCurrentA: 0.05 });
    expect(res.status).toBe(200);
    expect(res.body.steps.every((s: { limitedBy: string }) => s.limitedBy === 'min-current')).toBe(
      true,
    );
    expect(res.body.warnings.join(' ')).toMatch(/exceeds the meter's maximum/);
    expect(res.body.warnings.join(' ')).toMatch(/per current contact/);
  });

  it('plans from a material and doping without a wafer', async () => {
    const res = await plan({
      stationId,
      material: 'Si',
      doping: { donorDensity: 1e15, acceptorDensity: 0 },
      thicknessCm: 0.05,
      minK: 200,
      maxK: 300,
      count: 5,
      spacing: 'linear',
      method: 'van-der-pauw',
      ...meter,
    });
    expect(res.status).toBe(200);
    expect(res.body.basis.dopingSource).toBe('given with the plan');
    expect(res.body.basis.probeSpacingCm).toBeNull();
  });

  it.each([
    [{ minK: 400, maxK: 20 }, 'body.minK'],
    [{ count: 1 }, 'body.count'],
    [{ count: 501 }, 'body.count'],
    [{ minK: 5 }, 'body.minK'],
    [{ maxK: 500 }, 'body.maxK'],
    [{ maxPowerW: 0 }, 'body.maxPowerW'],
    [{ targetVoltageV: -0.01 }, 'body.targetVoltageV'],
    [{ maxVoltageV: 0 }, 'body.maxVoltageV'],
    [{ rampKPerMin: 0 }, 'body.rampKPerMin'],
    [{ targetVoltageV: 1 }, 'body.targetVoltageV'],
    [{ stationId: 999_999 }, 'body.stationId'],
    [{ waferId: 999_999 }, 'body.waferId'],
    [{ waferId: undefined }, 'body.waferId'],
    [{ spacing: 'log' }, 'body.spacing'],
    [{ diameterCm: 0.2 }, 'body.diameterCm'],
  ])('refuses %j with a 400 naming %s', async (change, field) => {
    const res = await plan({ ...base(), ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('asks for doping when the lot cannot give it', async () => {
    const lot = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('manager'))
      .send({ code: 'PLAN-2', material: 'Si', dopant: 'As', dopantType: 'n', thicknessCm: 0.05 });
    const wafer = await request(ctx.app)
      .post(`/api/lots/${lot.body.id}/wafers`)
      .set(ctx.auth('manager'))
      .send({ number: 'P2' });
    const res = await plan({ ...base(), waferId: wafer.body.id });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].field).toBe('body.doping');
  });

  it('lets planners plan and refuses technicians', async () => {
    expect((await plan(base(), 'technician')).status).toBe(403);
  });
});
