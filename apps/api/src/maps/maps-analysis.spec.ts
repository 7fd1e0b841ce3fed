import type {
  FitPreviewDto,
  LotMapsResponse,
  LotSummaryResponse,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lot } from '../lots/lot.model';
import { makeWafer } from '../sweeps/sweep-test-helpers';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

/** Boltzmann constant, eV/K (CODATA 2018). */
const K_B = 8.617333262e-5;

const upload = (waferId: number, csv: string, fields: Record<string, string>) => {
  let req = request(ctx.app).post(`/api/wafers/${waferId}/sweeps`).set(ctx.auth('engineer'));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.from(csv), 'map.csv');
};

/** ring-9 sites: the centre and eight at 0.8 usable radii (the documented pattern). */
const ring9Radius = (site: number) => (site === 1 ? 0 : 0.8);

describe('a map at five temperatures', () => {
  it('fits the Arrhenius law to the map mean, and to one site on request', async () => {
    // rho_i(T) = A_i exp(Ea / (k T)) with A_i rising outward: the map mean is mean(A_i) times
    // the same exponential, so its Arrhenius slope is Ea exactly (Arrhenius law, common
    // practice, no source). Ea = 0.30 eV.
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 10 });
    const ea = 0.3;
    const lines = ['T (K),site,rho (ohm cm)'];
    for (const t of [320, 340, 360, 380, 400]) {
      for (let site = 1; site <= 9; site++) {
        const a = 1e-3 * (1 + 0.05 * ring9Radius(site));
        lines.push(`${t + 0.1 * (site % 3)},${site},${a * Math.exp(ea / (K_B * t))}`);
      }
    }
    const res = await upload(wafer.id, lines.join('\n'), {
      method: 'resistivity',
      sitePattern: 'ring-9',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const map = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/map`)
      .set(ctx.auth('physicist'));
    expect(map.body.temperaturesK).toHaveLength(5);

    const fit = async (extra: Record<string, unknown>) =>
      request(ctx.app)
        .post(`/api/sweeps/${res.body.id}/fits/preview`)
        .set(ctx.auth('physicist'))
        .send({ kind: 'arrhenius', minK: 310, maxK: 410, ...extra });
    const mean = await fit({});
    expect(mean.status, JSON.stringify(mean.body)).toBe(200);
    const meanFit = mean.body as FitPreviewDto;
    // Five steps (one per temperature), not 45 readings: the map mean per step.
    expect(meanFit.stepCount).toBe(5);
    expect(meanFit.goodness.count).toBe(45);
    // The site temperatures differ by 0.1-0.2 K within a step; the step mean is 0.1 K above
    // the set point, so Ea is recovered to 1e-3 eV rather than exactly.
    expect(meanFit.parameters['activationEnergyEv']).toBeCloseTo(ea, 3);

    const centre = await fit({ site: '1' });
    expect(centre.status, JSON.stringify(centre.body)).toBe(200);
    expect((centre.body as FitPreviewDto).parameters['activationEnergyEv']).toBeCloseTo(ea, 3);

    // The analysis reads one step per temperature: nine sites at the step's mean temperature
    // (raw readings 0.1 K apart would split each into three 0.25 K steps).
    const analysis = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}/analysis`).set(ctx.auth('physicist'))
    ).body as SweepAnalysisResponse;
    expect(analysis.steps.map((s) => s.count)).toEqual([9, 9, 9, 9, 9]);
    const one = (
      await request(ctx.app)
        .get(`/api/sweeps/${res.body.id}/analysis?site=1`)
        .set(ctx.auth('physicist'))
    ).body as SweepAnalysisResponse;
    expect(one.steps).toHaveLength(5);
    expect(one.steps[0]!.resistivityOhmCm).toBeCloseTo(1e-3 * Math.exp(ea / (K_B * 320)), 9);

    const missing = await fit({ site: 'Z9' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details[0].field).toMatch(/site/);
  });
});

describe('a map wafer at 23 °C', () => {
  it('gives the site mean with its uncertainty and verdict, and the lot its uniformity', async () => {
    const first = await makeWafer({ thicknessCm: 0.05, diameterCm: 15 });
    await Lot.update({ specMinOhmCm: 8, specMaxOhmCm: 14 }, { where: { id: first.lotId } });
    const second = await Wafer.create({
      lotId: first.lotId,
      number: `${first.number}-b`,
      thicknessCm: 0.05,
      notes: null,
    });
    // Wafer 1: five sites at 23 °C, one inside the 3 mm edge exclusion (not counted).
    const one = ['x (mm),y (mm),T (degC),rho (ohm cm)'];
    const values1 = [10, 10.4, 9.8, 10.2, 10.6];
    [
      [0, 0],
      [30, 0],
      [0, 30],
      [-30, 0],
      [0, -30],
    ].forEach(([x, y], i) => one.push(`${x},${y},23,${values1[i]}`));
    one.push('73.5,0,23,30');
    const r1 = await upload(first.id, one.join('\n'), { method: 'resistivity' });
    expect(r1.status, JSON.stringify(r1.body)).toBe(201);
    const two = ['x (mm),y (mm),T (degC),rho (ohm cm)'];
    const values2 = [11, 11.2, 10.8];
    [
      [0, 0],
      [40, 0],
      [-40, 0],
    ].forEach(([x, y], i) => two.push(`${x},${y},23,${values2[i]}`));
    const r2 = await upload(second.id, two.join('\n'), { method: 'resistivity' });
    expect(r2.status).toBe(201);

    // By hand: mean 10.2, sample sd sqrt(0.4 / 4) = 0.31623, standard error 0.14142.
    const analysis = await request(ctx.app)
      .get(`/api/sweeps/${r1.body.id}/analysis`)
      .set(ctx.auth('physicist'));
    expect(analysis.status).toBe(200);
    const spec = (analysis.body as SweepAnalysisResponse).spec;
    expect(spec.resistivityAt23COhmCm).toBeCloseTo(10.2, 10);
    expect(spec.verdict).toBe('pass');
    expect(spec.uncertaintyOhmCm).not.toBeNull();
    // The combined standard uncertainty holds at least the site mean's standard error (GUM
    // 4.2.3: s / sqrt(n) of the five sites).
    expect(spec.uncertaintyOhmCm! / spec.coverageFactor!).toBeGreaterThanOrEqual(
      Math.sqrt(0.1) / Math.sqrt(5) - 1e-12,
    );
    const site = await request(ctx.app)
      .get(`/api/sweeps/${r1.body.id}/analysis?site=${encodeURIComponent('30,0')}`)
      .set(ctx.auth('physicist'));
    expect(site.status, JSON.stringify(site.body)).toBe(200);
    expect((site.body as SweepAnalysisResponse).spec.resistivityAt23COhmCm).toBeCloseTo(10.4, 10);

    const summary = (
      await request(ctx.app).get(`/api/lots/${first.lotId}/summary`).set(ctx.auth('engineer'))
    ).body as LotSummaryResponse;
    const w1 = summary.wafers.find((w) => w.waferId === first.id)!;
    const w2 = summary.wafers.find((w) => w.waferId === second.id)!;
    // Wafer 1: 100 * 0.31623 / 10.2 = 3.1003 %; wafer 2: sd 0.2 over 11 = 1.8182 %.
    expect(w1.uniformity?.stdDevPercent).toBeCloseTo((100 * Math.sqrt(0.1)) / 10.2, 9);
    expect(w1.uniformity?.siteCount).toBe(5);
    expect(w2.uniformity?.stdDevPercent).toBeCloseTo((100 * 0.2) / 11, 9);
    const spread = summary.statistics.uniformity!;
    expect(spread.count).toBe(2);
    expect(spread.maxStdDevPercent).toBeCloseTo((100 * Math.sqrt(0.1)) / 10.2, 9);
    expect(spread.minStdDevPercent).toBeCloseTo((100 * 0.2) / 11, 9);
    // Two values a and b: sample sd |a - b| / sqrt(2).
    expect(spread.stdDevOfStdDevPercent).toBeCloseTo(
      Math.abs((100 * Math.sqrt(0.1)) / 10.2 - (100 * 0.2) / 11) / Math.SQRT2,
      9,
    );

    const lotMaps = (
      await request(ctx.app).get(`/api/lots/${first.lotId}/maps`).set(ctx.auth('engineer'))
    ).body as LotMapsResponse;
    expect(lotMaps.wafers.map((w) => w.waferId)).toEqual([first.id, second.id]);
    // One scale over both wafers' counted sites (the excluded 30 ohm cm edge site is not in it).
    expect(lotMaps.scale).toEqual({ minOhmCm: 9.8, maxOhmCm: 11.2 });
  });
});
