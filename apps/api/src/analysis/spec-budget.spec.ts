import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bissellLowerBound } from '@rhotrace/physics';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Lot } from '../lots/lot.model';
import { Wafer } from '../wafers/wafer.model';
import { makeLot, makeSweep, range, synthesize } from './testing/fixtures';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

const flat = (v: number) => () => v;
const around23C = range(291, 301, 11);

interface Line {
  source: string;
  standardUncertaintyOhmCm: number;
  relative: number;
  note: string;
}

describe('tolerances on lots and stations', () => {
  it('stores a lot thickness tolerance and a station spacing and thermometer tolerance', async () => {
    const lot = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('engineer'))
      .send({
        code: `TOL-${Date.now()}`,
        material: 'Si',
        thicknessCm: 0.05,
        thicknessToleranceCm: 0.0025,
      });
    expect(lot.status).toBe(201);
    expect(lot.body.thicknessToleranceCm).toBe(0.0025);
    const bad = await request(ctx.app)
      .patch(`/api/lots/${lot.body.id}`)
      .set(ctx.auth('engineer'))
      .send({ thicknessToleranceCm: -1 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/thicknessToleranceCm/);
    const wider = await request(ctx.app)
      .patch(`/api/lots/${lot.body.id}`)
      .set(ctx.auth('engineer'))
      .send({ thicknessCm: 0.002, thicknessToleranceCm: 0.002 });
    expect(wider.status).toBe(400);
    expect(JSON.stringify(wider.body)).toMatch(/must be smaller than thicknessCm/);

    const station = await request(ctx.app)
      .post('/api/stations')
      .set(ctx.auth('engineer'))
      .send({
        name: `Bench tol ${Date.now()}`,
        probeSpacingCm: 0.1,
        thermometer: 'thermocouple',
        minTemperatureK: 77,
        maxTemperatureK: 450,
        probeSpacingToleranceCm: 0.001,
        temperatureToleranceK: 0.2,
      });
    expect(station.status).toBe(201);
    expect(station.body).toMatchObject({
      probeSpacingToleranceCm: 0.001,
      temperatureToleranceK: 0.2,
    });
  });
});

describe('the 23 °C value with its budget through the API', () => {
  it('reads the station and lot tolerances into the budget of the sweep analysis', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 5, specMaxOhmCm: 20 });
    await Lot.update({ thicknessToleranceCm: 0.0025 }, { where: { id: lot.id } });
    const station = await request(ctx.app)
      .post('/api/stations')
      .set(ctx.auth('engineer'))
      .send({
        name: `Bench budget ${Date.now()}`,
        probeSpacingCm: 0.1,
        thermometer: 'thermocouple',
        minTemperatureK: 77,
        maxTemperatureK: 450,
        temperatureToleranceK: 0.5,
      });
    // rho = 10 exp(0.0074 (T - 296.15)), four readings of 0.2 % scatter per step.
    const sweep = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize([291.15, 301.15, 306.15], (t) => 10 * Math.exp(0.0074 * (t - 296.15)), {
        noise: 0.002,
        repeats: 4,
      }),
    );
    await sweep.update({ stationId: station.body.id });
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    const spec = res.body.spec;
    expect(spec).toMatchObject({
      method: 'interpolated',
      verdict: 'pass',
      inSpec: true,
      coverageFactor: 2,
    });
    const lines = spec.uncertaintyBudget as Line[];
    const by = (s: string) => lines.find((l) => l.source === s)!;
    // Stated thermometer tolerance 0.5 K: u = 0.5 / sqrt(3) (GUM 4.3.7) times the 0.74 %/K slope
    // (the noisy steps give the slope to about 0.1 %/K, hence the loose check).
    expect(by('temperature-sensor').relative / (0.5 / Math.sqrt(3))).toBeCloseTo(0.0074, 3);
    expect(by('temperature-sensor').note).toMatch(/stated for station/);
    // The station states no spacing tolerance: listed, not invented.
    expect(by('probe-spacing')).toMatchObject({ standardUncertaintyOhmCm: 0 });
    expect(by('probe-spacing').note).toMatch(/^Not assessed/);
    // Thickness +/-25 µm on 500 µm: 5 % / sqrt(3) = 2.89 %, times a sensitivity just below 1.
    expect(by('thickness').relative).toBeGreaterThan(0.028);
    expect(by('thickness').relative).toBeLessThan(0.0289);
    // Said in the units the lab wrote them in (1 cm = 10⁴ µm, SI), not as 0.00250 cm on 0.0500 cm.
    expect(by('thickness').note).toMatch(/^±25\.0 µm on 500 µm; sensitivity 0\.9\d\d /);
    const rss = Math.hypot(...lines.map((l) => l.standardUncertaintyOhmCm));
    expect(spec.uncertaintyOhmCm).toBeCloseTo(2 * rss, 12);
  });

  it('turns a wafer within its uncertainty of a limit into indeterminate, and counts verdicts', async () => {
    // Seven wafers at 9.0 ... 12.0 ohm cm and one at 14.95, a hair under USL 15: its expanded
    // uncertainty (at least the thermometer's, here 0.5 % x 2) straddles the limit.
    const values = [9, 9.5, 10, 10.5, 11, 11.5, 12, 14.95];
    const { lot, wafers } = await makeLot(
      { specMinOhmCm: 8, specMaxOhmCm: 15 },
      values.map((_, i) => `W${i + 1}`),
    );
    const slope = (v: number) => (t: number) => v * Math.exp(0.0074 * (t - 296.15));
    for (let i = 0; i < values.length; i += 1) {
      await makeSweep(
        wafers[i]!.id,
        ctx.users.engineer.id,
        synthesize(around23C, slope(values[i]!)),
      );
    }
    const res = await request(ctx.app).get(`/api/lots/${lot.id}/summary`).set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    const edge = res.body.wafers.find((w: { number: string }) => w.number === 'W8');
    expect(edge.resistivityAt23COhmCm).toBeCloseTo(14.95, 6);
    expect(edge.uncertaintyOhmCm).toBeGreaterThan(0.05);
    expect(edge).toMatchObject({ verdict: 'indeterminate', pass: false });
    const st = res.body.statistics;
    expect(st).toMatchObject({ passCount: 7, failCount: 0, indeterminateCount: 1, cpk: null });
    expect(st.cpkReason).toMatch(/within-wafer repeatability/);
    // Hand computation (Ppk, overall s): mean and s of the eight values; Ppk = min(15 - m, m - 8) / 3s.
    const m = values.reduce((a, b) => a + b, 0) / values.length;
    const s = Math.sqrt(values.reduce((a, v) => a + (v - m) ** 2, 0) / (values.length - 1));
    const ppk = Math.min(15 - m, m - 8) / (3 * s);
    expect(st.ppk).toBeCloseTo(ppk, 6);
    expect(st.ppkLower95).toBeCloseTo(bissellLowerBound(ppk, 8), 6);
    expect(st.note).toMatch(/Only 8 wafers with a value at 23 °C \(fewer than 25\)/);

    const dopant = await request(ctx.app)
      .get(`/api/wafers/${wafers[7]!.id}/dopant`)
      .set(ctx.auth('engineer'));
    expect(dopant.status).toBe(200);
    expect(dopant.body).toMatchObject({
      verdict: 'indeterminate',
      inSpec: false,
      coverageFactor: 2,
    });
    expect(dopant.body.uncertaintyBudget.length).toBeGreaterThanOrEqual(4);

    const csv = await request(ctx.app)
      .get(`/api/lots/${lot.id}/summary.csv`)
      .set(ctx.auth('manager'));
    expect(csv.text).toMatch(/,indeterminate,/);
    expect(csv.text).toMatch(/statistics,Ppk,/);
  });

  it('corrects a wafer with one step near 23 °C by the lot model, and refuses one 20 K away', async () => {
    const { lot, wafers } = await makeLot({ material: 'Cu', dopant: null, dopantType: null }, [
      'M1',
      'M2',
    ]);
    await Wafer.update({ thicknessCm: 1e-4 }, { where: { lotId: lot.id } });
    // A copper film read once at 301.15 K; the linear reference (alpha 0.0039 /K at 20 °C)
    // scales it to 23 °C: ratio (1 + 0.0039 * 3) / (1 + 0.0039 * 8).
    await makeSweep(wafers[0]!.id, ctx.users.engineer.id, synthesize([301.15], flat(2e-6)));
    await makeSweep(wafers[1]!.id, ctx.users.engineer.id, synthesize([316.2, 330], flat(2e-6)));
    const ok = await request(ctx.app).get(`/api/lots/${lot.id}/summary`).set(ctx.auth('manager'));
    const [m1, m2] = ok.body.wafers;
    expect(m1.method).toBe('corrected');
    expect(m1.resistivityAt23COhmCm / 2e-6).toBeCloseTo((1 + 0.0039 * 3) / (1 + 0.0039 * 8), 9);
    expect(m2.resistivityAt23COhmCm).toBeNull();
    expect(m2.reason).toMatch(/at most 15 K/);
  });
});
