import type {
  CompareResponse,
  FitDto,
  LotSummaryResponse,
  SweepAnalysisResponse,
  SweepDto,
  SweepPreviewResponse,
} from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  HALL_TRUTH,
  hallSweepCsv,
  truthElectronsCm3,
  truthMobility,
} from '../testing/hall-sweep-file';
import { documentProblems } from '../openapi/testing/document-validator';
import { renderReportPdf } from '../reports/report-pdf';
import { hallSummaryLine } from '../reports/report-hall';
import { waferLines } from '../reports/lot-report-pdf';
import { reportData } from '../reports/report.service';
import { Wafer } from '../wafers/wafer.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Sweep } from './sweep.model';
import { makeWafer } from './sweep-test-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

let serial = 0;
const upload = async (text: string, fields: Record<string, string> = {}, thickness = true) => {
  serial += 1;
  const wafer = await makeWafer(thickness ? { thicknessCm: HALL_TRUTH.thicknessCm } : {});
  let req = request(ctx.app).post(`/api/wafers/${wafer.id}/sweeps`).set(ctx.auth('engineer'));
  for (const [k, v] of Object.entries({ method: 'hall', ...fields })) req = req.field(k, v);
  return req.attach('file', Buffer.from(`# hall ${serial}\n${text}`), `hall-${serial}.csv`);
};
const sweepOf = async (id: number) =>
  (await request(ctx.app).get(`/api/sweeps/${id}`).set(ctx.auth('physicist'))).body as SweepDto;
const storedSweeps = () => Sweep.count();

describe('Hall import', () => {
  it('detects the Hall columns and suggests the hall method', async () => {
    const wafer = await makeWafer({ thicknessCm: HALL_TRUTH.thicknessCm });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps/preview`)
      .set(ctx.auth('engineer'))
      .attach('file', Buffer.from(hallSweepCsv({ temperaturesK: [300, 310] })), 'h.csv');
    const pv = res.body as SweepPreviewResponse;
    expect(pv.suggestedMethod).toBe('hall');
    expect(pv.columns.map((c) => `${c.meaning}:${c.unit}`)).toEqual([
      'temperature:K',
      'resistance:ohm',
      'resistance-b:ohm',
      'current:uA',
      'magnetic-field:mT',
      'hall-voltage-pp:mV',
      'hall-voltage-pn:mV',
      'hall-voltage-np:mV',
      'hall-voltage-nn:mV',
    ]);
  });

  it('gives the same points from the four reversals as from one corrected column', async () => {
    const a = await upload(hallSweepCsv({ layout: 'reversals' }));
    const b = await upload(hallSweepCsv({ layout: 'corrected' }));
    expect(a.status, JSON.stringify(a.body)).toBe(201);
    expect(b.status, JSON.stringify(b.body)).toBe(201);
    const [pa, pb] = [(await sweepOf(a.body.id)).points, (await sweepOf(b.body.id)).points];
    expect(pa).toHaveLength(78);
    expect(pb).toHaveLength(78);
    pa.forEach((p, i) => {
      const q = pb[i]!;
      expect(p.resistivityOhmCm).toBe(q.resistivityOhmCm);
      for (const key of ['hallCoefficientCm3PerC', 'carrierDensityCm3', 'hallMobilityCm2PerVs']) {
        const x = p.quantities![key] as number;
        expect(Math.abs(x / (q.quantities![key] as number) - 1)).toBeLessThan(1e-8);
      }
      expect(p.quantities!.carrierType).toBe('n');
    });
    // The file's n at 300 K within its 1 % noise of the neutrality value (computed in the file).
    const at300 = pa.filter((p) => Math.abs(p.temperatureK - 300) < 0.1);
    for (const p of at300) {
      expect(p.quantities!.carrierDensityCm3! / truthElectronsCm3(300)).toBeCloseTo(1, 1);
      expect(p.quantities!.sheetCarrierDensityCm2).toBeCloseTo(
        p.quantities!.carrierDensityCm3! * HALL_TRUTH.thicknessCm,
        -6,
      );
    }
    expect((await sweepOf(a.body.id)).parseReport.hall).toEqual({
      hallFactor: 1,
      hallFactorName: 'degenerate',
      mixedConduction: false,
      hallVoltageFrom: 'reversals',
    });
  });

  it('divides the densities by a named Hall factor and records it', async () => {
    const csv = hallSweepCsv({ temperaturesK: [300, 310, 320], layout: 'corrected' });
    const plain = await upload(csv);
    const phonon = await upload(csv, { hallFactor: 'acoustic-phonon' });
    expect(phonon.status, JSON.stringify(phonon.body)).toBe(201);
    const [p, q] = [
      (await sweepOf(plain.body.id)).points[0]!,
      (await sweepOf(phonon.body.id)).points[0]!,
    ];
    // r_H = 3 pi / 8 for acoustic phonons (Blakemore 1962).
    expect(q.quantities!.carrierDensityCm3! / p.quantities!.carrierDensityCm3!).toBeCloseTo(
      (3 * Math.PI) / 8,
      12,
    );
    expect((await sweepOf(phonon.body.id)).parseReport.hall!.hallFactorName).toBe(
      'acoustic-phonon',
    );
  });

  it('keeps every point of a sweep whose carrier type changes sign, and says so', async () => {
    const text = [
      'T (K),R_A (ohm),R_B (ohm),I (mA),B (T),V_H (mV)',
      '300,10,10,1,0.5,-1.0',
      '350,9,9,1,0.5,-0.2',
      '400,8,8,1,0.5,0.3',
    ].join('\n');
    const res = await upload(text);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.pointCount).toBe(3);
    expect(res.body.warnings.join(' ')).toMatch(
      /carrier type changes sign.*n-type: 2 point.*p-type: 1 point/,
    );
    const sweep = await sweepOf(res.body.id);
    expect(sweep.points.map((p) => p.quantities!.carrierType)).toEqual(['n', 'n', 'p']);
    expect(sweep.parseReport.hall!.mixedConduction).toBe(true);
  });
});

describe('Hall analysis of one leg', () => {
  it('keeps the Hall quantities of the picked leg (a multi-leg sweep had none)', async () => {
    // Bug: picking one leg rebuilt its points from T and rho only, so `hall` disappeared.
    const up = Array.from({ length: 8 }, (_, k) => 250 + 10 * k);
    const res = await upload(
      hallSweepCsv({ temperaturesK: [...up, ...up.slice(0, -1).reverse()] }),
    );
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const get = (query: string) =>
      request(ctx.app)
        .get(`/api/sweeps/${res.body.id}/analysis${query}`)
        .set(ctx.auth('physicist'));
    const first = (await get('')).body as SweepAnalysisResponse;
    expect(first.legs!.map((l) => l.direction)).toEqual(['up', 'down']);
    expect(first.leg).toBe(1);
    expect(first.hall!.steps).toHaveLength(8);
    expect(((await get('?leg=2')).body as SweepAnalysisResponse).hall!.steps).toHaveLength(7);
  });
});

describe('Hall import refuses bad input and stores nothing', () => {
  const head = 'T (K),R_A (ohm),R_B (ohm),I (mA),B (T),V_H (mV)';
  const cases: Array<[string, string, Record<string, string>, number, RegExp]> = [
    [
      'a field of zero',
      `${head}\n300,10,10,1,0.5,-1\n310,10,10,1,0,-1`,
      {},
      422,
      /row 4, column B \(T\): .*above zero/,
    ],
    [
      'a non-finite voltage',
      `${head}\n300,10,10,1,0.5,NaN`,
      {},
      422,
      /row 3, column V_H \(mV\): .*not a number/,
    ],
    [
      'a zero Hall voltage',
      `${head}\n300,10,10,1,0.5,0`,
      {},
      422,
      /row 3, column V_H \(mV\): .*other than 0/,
    ],
    [
      'a missing current cell',
      `${head}\n300,10,10,,0.5,-1`,
      {},
      422,
      /row 3, column I \(mA\): .*missing/,
    ],
    [
      'no current column',
      'T (K),R_A (ohm),R_B (ohm),B (T),V_H (mV)\n300,10,10,0.5,-1',
      {},
      400,
      /needs the sample current/,
    ],
    [
      'three reversals of four',
      'T (K),R_A (ohm),R_B (ohm),I (mA),B (T),V(+B+I) (mV),V(+B-I) (mV),V(-B+I) (mV)\n300,10,10,1,0.5,1,2,3',
      {},
      400,
      /missing hall-voltage-nn/,
    ],
    [
      'no field column',
      'T (K),R_A (ohm),R_B (ohm),I (mA),V_H (mV)\n300,10,10,1,-1',
      {},
      400,
      /magnetic-field/,
    ],
    [
      'an unknown Hall factor',
      `${head}\n300,10,10,1,0.5,-1`,
      { hallFactor: 'strong' },
      400,
      /hallFactor/,
    ],
  ];
  for (const [what, text, fields, status, message] of cases) {
    it(`refuses ${what}`, async () => {
      const before = await storedSweeps();
      const res = await upload(text, fields);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      const details = res.body.error.details as Array<{ field: string; problem: string }>;
      expect(details.map((d) => `${d.field}: ${d.problem}`).join('; ')).toMatch(message);
      expect(await storedSweeps()).toBe(before);
    });
  }

  it('refuses a missing thickness and a Hall factor on another method', async () => {
    const text = `${head}\n300,10,10,1,0.5,-1`;
    const noThickness = await upload(text, {}, false);
    expect(noThickness.status).toBe(400);
    expect(JSON.stringify(noThickness.body.error)).toMatch(/thickness/i);
    const vdp = await upload(text, { method: 'van-der-pauw', hallFactor: '1.2' });
    expect(vdp.status).toBe(400);
    expect(vdp.body.error.details[0].field).toBe('body.hallFactor');
  });
});

describe('Hall fits', () => {
  let sweepId: number;
  beforeAll(async () => {
    const res = await upload(hallSweepCsv());
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    sweepId = res.body.id as number;
  });
  const fit = (body: Record<string, unknown>) =>
    request(ctx.app).post(`/api/sweeps/${sweepId}/fits`).set(ctx.auth('physicist')).send(body);

  it('fits N_D, N_A and E_d of the synthetic sweep back with intervals', async () => {
    const res = await fit({
      kind: 'carrier-density',
      initial: { donorDensity: 3e15, acceptorDensity: 3e13, donorLevel: 0.06 },
      free: ['donorDensity', 'acceptorDensity', 'donorLevel'],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const f = res.body as FitDto;
    expect(f.converged).toBe(true);
    expect(Math.abs(f.parameters.donorDensity! / HALL_TRUTH.donorDensityCm3 - 1)).toBeLessThan(
      0.05,
    );
    expect(Math.abs(f.parameters.donorLevel! - HALL_TRUTH.donorLevelEv)).toBeLessThan(0.003);
    expect(
      Math.abs(f.parameters.acceptorDensity! / HALL_TRUTH.acceptorDensityCm3 - 1),
    ).toBeLessThan(0.2);
    const [lo, hi] = f.confidenceIntervals.donorDensity!;
    expect(lo).toBeLessThan(HALL_TRUTH.donorDensityCm3);
    expect(hi).toBeGreaterThan(HALL_TRUTH.donorDensityCm3);
    const ratio = f.interpretation!.compensationRatio!;
    expect(ratio.value).toBeCloseTo(f.parameters.acceptorDensity! / f.parameters.donorDensity!, 12);
    expect(ratio.confidenceInterval95![0]).toBeLessThan(0.1);
    expect(ratio.confidenceInterval95![1]).toBeGreaterThan(0.1);
    expect(f.interpretation!.property).toBe('dopant-level');
    // The stored version names the whole model (it was cut at 32 characters before).
    expect(f.modelVersion).toMatch(/^physics@[\d.]+\+Si:[\w-]+:constant-level$/);
    const stored = await request(ctx.app).get(`/api/fits/${f.id}`).set(ctx.auth('physicist'));
    expect(stored.body.modelVersion).toBe(f.modelVersion);
    expect(f.inputs).toMatchObject({
      kind: 'carrier-density',
      free: ['donorDensity', 'acceptorDensity', 'donorLevel'],
    });
    // Readings flagged as a resistivity jump (deep freeze-out steps) are left out and listed.
    expect(f.residuals).toHaveLength(78 - f.excludedSequences.length);
  });

  it('adds n(T), mu_H(T), the carrier type and the freeze-out window to the analysis', async () => {
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweepId}/analysis`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    const hall = (res.body as SweepAnalysisResponse).hall!;
    expect(hall.steps).toHaveLength(39);
    expect(hall.carrierType).toBe('n');
    expect(hall.hallFactor).toBe(1);
    expect(hall.carrierDensityAt300KCm3! / truthElectronsCm3(300)).toBeCloseTo(1, 1);
    expect(hall.carrierDensityAt300KUncertaintyCm3).toBeGreaterThan(0);
    // Freeze-out ends where the neutrality n (computed in the file) falls below half of
    // N_D - N_A; one 10 K step either way for the noise.
    const grid = Array.from({ length: 39 }, (_, k) => 20 + 10 * k);
    const half = 0.5 * (HALL_TRUTH.donorDensityCm3 - HALL_TRUTH.acceptorDensityCm3);
    const lastFrozen = grid.filter((t) => truthElectronsCm3(t) < half).pop()!;
    expect(hall.freezeOutWindow!.minK).toBeCloseTo(20, 1);
    expect(Math.abs(hall.freezeOutWindow!.maxK - lastFrozen)).toBeLessThanOrEqual(10.1);
  });

  it('carries n and mu_H at 300 K into compare, the lot summary and the CSV exports', async () => {
    const get = (url: string) => request(ctx.app).get(url).set(ctx.auth('physicist'));
    const compare = (await get(`/api/compare?sweeps=${sweepId}`)).body as CompareResponse;
    const h = compare.curves[0]!.hall!;
    expect(h.carrierType).toBe('n');
    expect(h.carrierDensityAt300KCm3! / truthElectronsCm3(300)).toBeCloseTo(1, 1);
    expect(h.hallMobilityAt300KCm2PerVs! / truthMobility(300)).toBeCloseTo(1, 1);
    // Two readings a step: the scatter gives each value a standard uncertainty (type A).
    expect(h.carrierDensityAt300KUncertaintyCm3! / h.carrierDensityAt300KCm3!).toBeGreaterThan(0);
    expect(h.hallMobilityAt300KUncertaintyCm2PerVs! / h.hallMobilityAt300KCm2PerVs!).toBeLessThan(
      0.1,
    );
    const wafer = await Wafer.findByPk((await Sweep.findByPk(sweepId))!.waferId);
    const summary = (await get(`/api/lots/${wafer!.lotId}/summary`)).body as LotSummaryResponse;
    expect(summary.wafers[0]!.hall!.sweepId).toBe(sweepId);
    expect(summary.wafers[0]!.hall!.carrierDensityAt300KCm3).toBe(h.carrierDensityAt300KCm3);
    const lotCsv = (await get(`/api/lots/${wafer!.lotId}/summary.csv`)).text;
    expect(lotCsv.split('\r\n')[0]).toMatch(/hall_carrier_density_300k_cm3,hall_mobility_300k/);
    expect(lotCsv.split('\r\n')[1]).toContain(String(h.carrierDensityAt300KCm3));
    // The uncertainties and the assumed Hall factor travel with the values.
    const header = lotCsv.split('\r\n')[0]!.split(',');
    const row = lotCsv.split('\r\n')[1]!.split(',');
    const cell = (name: string) => row[header.indexOf(name)];
    expect(cell('hall_carrier_density_300k_u_k1_cm3')).toBe(
      String(h.carrierDensityAt300KUncertaintyCm3),
    );
    expect(cell('hall_mobility_300k_u_k1_cm2_per_vs')).toBe(
      String(h.hallMobilityAt300KUncertaintyCm2PerVs),
    );
    expect(cell('hall_factor')).toBe('1');
    // The lot PDF's wafer line carries the same values, uncertainties and assumed factor.
    const [line] = waferLines(summary).filter((l) => l.includes(`sweep ${sweepId},`));
    expect(line).toMatch(/Hall at 300 K \(sweep \d+, n-type, r_H 1\.00\): carrier density \S+/);
    expect(line).toMatch(/Hall mobility \S+ ± \S+ cm²\/\(V·s\), ± is the standard uncertainty/);
    const pointsCsv = (await get(`/api/sweeps/${sweepId}/points.csv`)).text.split('\r\n');
    expect(pointsCsv[0]).toContain(
      'flags,hall_coefficient_cm3_per_c,carrier_density_cm3,sheet_carrier_density_cm2,' +
        'hall_mobility_cm2_per_vs,carrier_type,magnetic_field_t,hall_voltage_v,raw T (K)',
    );
    expect(pointsCsv[1]!.split(',')[13]).toBe('n');
  });

  it('prints the Hall plots, fits and the magnet caution in the PDF report', async () => {
    const u = ctx.users.physicist;
    const data = await reportData(
      { id: u.id, email: u.email, name: u.name, role: u.role },
      sweepId,
    );
    expect(data.hall!.steps).toHaveLength(39);
    expect(data.cautions[0]).toMatch(/Strong magnet.*pacemakers.*steel.*cards/);
    const pages = (pdf: Buffer) => pdf.toString('latin1').match(/\/Type \/Page[^s]/g)?.length ?? 0;
    const withHall = await renderReportPdf(data);
    const without = await renderReportPdf({ ...data, hall: null });
    expect(pages(withHall)).toBe(pages(without) + 1);
    // The values at 300 K are printed with their standard uncertainties and what they leave out.
    const line = hallSummaryLine(data.hall!);
    expect(line).toMatch(/carrier density \S+( × 10\S+)? ± \S+/);
    expect(line).toMatch(/Hall mobility \S+ ± \S+ cm²\/\(V·s\)/);
    expect(line).toContain('k = 1');
    const single = { ...data.hall!, carrierDensityAt300KUncertaintyCm3: null };
    expect(hallSummaryLine(single)).toContain('no scatter to give an uncertainty');
  });

  it('answers as the OpenAPI document says (Hall fields included)', async () => {
    const get = async (url: string, path: string) => {
      const res = await request(ctx.app).get(url).set(ctx.auth('physicist'));
      expect(documentProblems('GET', path, res.status, res.body), url).toEqual([]);
    };
    const wafer = await Wafer.findByPk((await Sweep.findByPk(sweepId))!.waferId);
    await get(`/api/sweeps/${sweepId}`, '/sweeps/{id}');
    await get(`/api/sweeps/${sweepId}/analysis`, '/sweeps/{id}/analysis');
    await get(`/api/sweeps/${sweepId}/fits`, '/sweeps/{id}/fits');
    await get(`/api/compare?sweeps=${sweepId}`, '/compare');
    await get(`/api/lots/${wafer!.lotId}/summary`, '/lots/{id}/summary');
    const numbered = await upload(hallSweepCsv({ temperaturesK: [300, 310, 320] }), {
      hallFactor: '1.1',
    });
    await get(`/api/sweeps/${numbered.body.id}`, '/sweeps/{id}');
  });

  it('fits the mobility exponent in the lattice range within 0.05 of the truth', async () => {
    const res = await fit({ kind: 'hall-mobility', minK: 150, maxK: 400 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const f = res.body as FitDto;
    // The file's weak impurity term bends the slope by under 0.01 in this window.
    expect(Math.abs(f.parameters.exponent! - HALL_TRUTH.latticeExponent)).toBeLessThan(0.05);
    expect(f.confidenceIntervals.exponent).not.toBeNull();
    expect(f.interpretation!.scattering).toBe('acoustic-and-optical-phonon');
    expect(f.windowMinK).toBe(150);
  });

  it('refuses a Hall fit on a sweep without Hall quantities (422) and a bad free list (400)', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const vdp = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'van-der-pauw')
      .attach(
        'file',
        Buffer.from('T (K),R_A (ohm),R_B (ohm)\n300,1,1\n310,1.1,1.1\n320,1.2,1.2\n'),
        'v.csv',
      );
    const res = await request(ctx.app)
      .post(`/api/sweeps/${vdp.body.id}/fits`)
      .set(ctx.auth('physicist'))
      .send({ kind: 'hall-mobility' });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/needs a Hall sweep/);
    const bad = await fit({
      kind: 'carrier-density',
      initial: { donorDensity: 1e15, acceptorDensity: 0 },
      free: ['mobilityScale'],
    });
    expect(bad.status).toBe(400);
  });
});
