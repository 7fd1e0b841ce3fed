import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { regimeBoundaries, resistivity, siliconDopantFromResistivity } from '@rhotrace/physics';
import { createTestContext, type TestContext } from '../testing/test-context';
import { averageSteps } from './sweep-data.service';
import { makeLot, makeSweep, range, synthesize } from './testing/fixtures';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

const doping = { donorDensity: 1e15, acceptorDensity: 0 };
const siModel = (t: number) => resistivity('Si', doping, t);
const flat = (value: number) => () => value;

describe('averaging per temperature step', () => {
  it('averages readings within 0.25 K of a step and gives the sample standard deviation', () => {
    // hand case: readings 1, 2, 3 ohm cm at 300.0/300.1/300.2 K -> mean 2, s = 1; 310 K alone -> s = 0
    const steps = averageSteps([
      { temperatureK: 300, resistivityOhmCm: 1 },
      { temperatureK: 300.1, resistivityOhmCm: 2 },
      { temperatureK: 300.2, resistivityOhmCm: 3 },
      { temperatureK: 310, resistivityOhmCm: 5 },
    ]);
    expect(steps).toHaveLength(2);
    expect(steps[0]!.temperatureK).toBeCloseTo(300.1, 12);
    expect(steps[0]!.resistivityOhmCm).toBeCloseTo(2, 12);
    expect(steps[0]!.spreadOhmCm).toBeCloseTo(1, 12);
    expect(steps[0]!.count).toBe(3);
    expect(steps[1]).toEqual({ temperatureK: 310, resistivityOhmCm: 5, spreadOhmCm: 0, count: 1 });
  });
});

describe('GET /api/sweeps/:id/analysis', () => {
  it('gives steps, Arrhenius coordinates, suggested windows and the spec check', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 4, specMaxOhmCm: 6 });
    const temps = range(20, 800, 157);
    const sweep = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(temps, siModel, { noise: 0.005, seed: 7, repeats: 3 }),
    );
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    expect(res.body.sweep).toMatchObject({
      id: sweep.id,
      waferNumber: 'W01',
      lotCode: lot.code,
      pointCount: 471,
      // the geometry the readings were converted with travels with the study
      geometry: { spacingCm: 0.1, thicknessCm: 0.05, diameterCm: 10, sources: {} },
    });
    expect(res.body.steps).toHaveLength(157);
    expect(res.body.steps[0].count).toBe(3);
    const a = res.body.arrhenius[10];
    expect(a.inverseTemperaturePerKK).toBeCloseTo(1000 / res.body.steps[10].temperatureK, 12);
    expect(a.lnConductivity).toBeCloseTo(-a.lnResistivity, 12);

    // The windows should sit on the model's own regime boundaries (physics library).
    const b = regimeBoundaries('Si', doping);
    const windows = res.body.suggestedWindows as Array<{
      regime: string;
      minK: number;
      maxK: number;
      pointCount: number;
    }>;
    expect(windows.map((w) => w.regime)).toEqual(['freeze-out', 'extrinsic', 'intrinsic']);
    const [cold, mid, hot] = windows;
    expect(cold!.maxK).toBeLessThan(b.freezeOutBelowK! * 1.6);
    expect(mid!.minK).toBeLessThan(300);
    expect(mid!.maxK).toBeGreaterThan(300);
    expect(hot!.minK).toBeGreaterThan(b.intrinsicAboveK! * 0.8);
    expect(hot!.pointCount).toBeGreaterThanOrEqual(9);

    // 4.6 ohm cm at 296 K for 1e15 cm^-3 P-doped Si (model) lies inside 4..6.
    expect(res.body.spec.method).toBe('interpolated');
    expect(res.body.spec.inSpec).toBe(true);
    expect(res.body.spec.resistivityAt23COhmCm).toBeGreaterThan(4);
  });

  it('answers 404 for an unknown sweep and 400 for a malformed id', async () => {
    expect(
      (await request(ctx.app).get('/api/sweeps/999999/analysis').set(ctx.auth('admin'))).status,
    ).toBe(404);
    expect(
      (await request(ctx.app).get('/api/sweeps/abc/analysis').set(ctx.auth('admin'))).status,
    ).toBe(400);
  });
});

describe('spec check at the tolerance edges', () => {
  async function specOf(
    points: Array<{ temperatureK: number; resistivityOhmCm: number }>,
    lotFields = {},
  ) {
    const { wafers } = await makeLot({ specMinOhmCm: 10, specMaxOhmCm: 20, ...lotFields });
    const sweep = await makeSweep(wafers[0]!.id, ctx.users.admin.id, points);
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('admin'));
    expect(res.status).toBe(200);
    return res.body.spec;
  }

  it('interpolates log-linearly between steps 9.9 K apart', async () => {
    // ln rho linear between (291.2 K, 10) and (301.1 K, 40): at the midpoint 296.15 K, sqrt(10 * 40) = 20
    const spec = await specOf([
      { temperatureK: 291.2, resistivityOhmCm: 10 },
      { temperatureK: 301.1, resistivityOhmCm: 40 },
    ]);
    expect(spec.method).toBe('interpolated');
    expect(spec.resistivityAt23COhmCm).toBeCloseTo(20, 9);
    expect(spec.distanceK).toBeCloseTo(4.95, 9);
  });

  it('corrects from steps up to 15 K away and refuses a sweep farther than that', async () => {
    // rho = 12 exp(0.0074 (T - 296.15)): the correction from 301.05 K along the sweep's own slope
    // gives 12 exactly; the nearest step alone would read 12 exp(0.0074 * 4.9) = 12.44.
    const slope = (t: number) => 12 * Math.exp(0.0074 * (t - 296.15));
    const near = await specOf(synthesize([296.15 + 4.9, 296.15 + 9.9, 320], slope));
    expect(near).toMatchObject({ method: 'corrected', verdict: 'pass', inSpec: true });
    expect(near.distanceK).toBeCloseTo(4.9, 9);
    expect(near.resistivityAt23COhmCm).toBeCloseTo(12, 9);
    const far = await specOf(synthesize([296.15 + 15.1, 400], flat(12)));
    expect(far.resistivityAt23COhmCm).toBeNull();
    expect(far.inSpec).toBeNull();
    expect(far.verdict).toBeNull();
    expect(far.reason).toMatch(/does not reach 23 °C.*at most 15 K/);
  });

  it('counts the limits themselves as in spec and a hair outside as out', async () => {
    const at = (v: number) => specOf(synthesize(range(294, 298, 5), flat(v)));
    expect((await at(10)).inSpec).toBe(true);
    expect((await at(20)).inSpec).toBe(true);
    expect((await at(10 * (1 - 1e-9))).inSpec).toBe(false);
    expect((await at(20 * (1 + 1e-9))).inSpec).toBe(false);
  });
});

describe('GET /api/wafers/:id/dopant', () => {
  it('converts rho at 23 °C with ASTM F723 exactly as the physics library does', async () => {
    const { lot, wafers } = await makeLot({ dopant: 'P', specMinOhmCm: 3, specMaxOhmCm: 7 });
    await makeSweep(wafers[0]!.id, ctx.users.engineer.id, synthesize(range(280, 320, 41), siModel));
    const res = await request(ctx.app)
      .get(`/api/wafers/${wafers[0]!.id}/dopant`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    expect(res.body.dopant).toBe(lot.dopant);
    expect(res.body.method).toBe('interpolated');
    expect(res.body.dopantDensityCm3).toBe(
      siliconDopantFromResistivity('phosphorus', res.body.resistivityAt23COhmCm),
    );
    // The model sample had 1e15 cm^-3 donors; the ASTM F723 reading agrees within 15 %.
    expect(res.body.dopantDensityCm3 / 1e15).toBeGreaterThan(0.85);
    expect(res.body.dopantDensityCm3 / 1e15).toBeLessThan(1.15);
    expect(res.body.source).toMatch(/ASTM F723 \(phosphorus\)/);
    expect(res.body.inSpec).toBe(true);
  });

  it('gives a null density with the reason for a non-silicon wafer', async () => {
    const { wafers } = await makeLot({ material: 'GaAs', dopant: 'Si' });
    await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(range(290, 300, 11), flat(0.01)),
    );
    const res = await request(ctx.app)
      .get(`/api/wafers/${wafers[0]!.id}/dopant`)
      .set(ctx.auth('admin'));
    expect(res.status).toBe(200);
    expect(res.body.dopantDensityCm3).toBeNull();
    expect(res.body.reason).toMatch(/boron- and phosphorus-doped silicon only/);
  });

  it('answers 422 for arsenic, 422 without 23 °C, 404 without any sweep', async () => {
    const arsenic = await makeLot({ dopant: 'As' });
    await makeSweep(
      arsenic.wafers[0]!.id,
      ctx.users.admin.id,
      synthesize(range(290, 300, 11), flat(5)),
    );
    const r1 = await request(ctx.app)
      .get(`/api/wafers/${arsenic.wafers[0]!.id}/dopant`)
      .set(ctx.auth('admin'));
    expect(r1.status).toBe(422);
    expect(r1.body.error.message).toMatch(/boron and phosphorus|boron- and phosphorus/);

    const cold = await makeLot({ dopant: 'B' });
    await makeSweep(
      cold.wafers[0]!.id,
      ctx.users.admin.id,
      synthesize(range(50, 100, 11), flat(5)),
    );
    const r2 = await request(ctx.app)
      .get(`/api/wafers/${cold.wafers[0]!.id}/dopant`)
      .set(ctx.auth('admin'));
    expect(r2.status).toBe(422);
    expect(r2.body.error.message).toMatch(/23 °C/);

    const none = await makeLot();
    const r3 = await request(ctx.app)
      .get(`/api/wafers/${none.wafers[0]!.id}/dopant`)
      .set(ctx.auth('admin'));
    expect(r3.status).toBe(404);
  });
});
