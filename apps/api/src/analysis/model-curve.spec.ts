import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  listMaterials,
  metalBlochGruneisen,
  metalResistivity,
  modelCurve,
  modelCurveWarnings,
  regimeBoundaries,
} from '@rhotrace/physics';
import { createTestContext, type TestContext } from '../testing/test-context';
import { temperatureGrid } from './model.service';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

const body = {
  material: 'Si',
  doping: { donorDensity: 1e15, acceptorDensity: 1e13, donor: 'P' },
  fromK: 20,
  toK: 800,
  steps: 157,
};

describe('POST /api/model/curve', () => {
  it('equals modelCurve() and regimeBoundaries() called directly on the same inputs', async () => {
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('technician'))
      .send(body);
    expect(res.status).toBe(200);
    const temps = temperatureGrid(20, 800, 157);
    expect(temps[0]).toBe(20);
    expect(temps[156]).toBe(800);
    expect(res.body.kind).toBe('semiconductor');
    expect(res.body.points).toEqual(modelCurve('Si', body.doping as never, temps));
    expect(res.body.boundaries).toEqual(regimeBoundaries('Si', body.doping as never));
    expect(res.body.modelVersion).toMatch(/^physics@\d+\.\d+\.\d+\+Si:/);
    expect(res.body.warnings).toEqual(modelCurveWarnings('Si', body.doping as never, temps));
  });

  it('scales both mobilities by a fitted mobility scale, so ρ divides by it, and refuses 0', async () => {
    const scaled = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('physicist'))
      .send({ ...body, mobilityScale: 0.5 });
    expect(scaled.status).toBe(200);
    const plain = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('physicist'))
      .send(body);
    // sigma = q (n mu_n + p mu_p): halving both mobilities doubles rho (common practice, no source).
    const i = 100;
    expect(
      scaled.body.points[i].resistivityOhmCm / plain.body.points[i].resistivityOhmCm,
    ).toBeCloseTo(2, 9);
    const zero = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('physicist'))
      .send({ ...body, mobilityScale: 0 });
    expect(zero.status).toBe(400);
    expect(JSON.stringify(zero.body)).toContain('mobilityScale');
  });

  it('warns when the Arora mobility leaves its 200-500 K range and near degeneracy', async () => {
    // Issue 13, defect 10: Arora, Hauser & Roulston 1982 fitted about 200-500 K; 20-800 K
    // extrapolates. The library's near-degeneracy flag (Fermi level within 3 kT of a band
    // edge) reaches the answer for 1e20 cm^-3.
    const wide = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send(body);
    expect(wide.body.warnings).toHaveLength(1);
    expect(wide.body.warnings[0]).toMatch(/Arora.*200–500 K/);
    const inside = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({ ...body, fromK: 250, toK: 450, steps: 5 });
    expect(inside.body.warnings).toEqual([]);
    const heavy = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({
        ...body,
        doping: { donorDensity: 1e20, acceptorDensity: 0 },
        fromK: 250,
        toK: 450,
        steps: 5,
      });
    expect(heavy.body.warnings.join(' ')).toMatch(/near-degenerate/);
  });

  it('takes 2 and 2000 steps (the inclusive limits)', async () => {
    for (const steps of [2, 2000]) {
      const res = await request(ctx.app)
        .post('/api/model/curve')
        .set(ctx.auth('physicist'))
        .send({ ...body, steps });
      expect(res.status).toBe(200);
      expect(res.body.points).toHaveLength(steps);
    }
  });

  it.each([
    [{ steps: 1 }, 'body.steps'],
    [{ steps: 2001 }, 'body.steps'],
    [{ steps: 10.5 }, 'body.steps'],
    [{ fromK: 0 }, 'body.fromK'],
    [{ toK: 1500.5 }, 'body.toK'],
    [{ fromK: 300, toK: 300 }, 'body.toK'],
    [{ fromK: 400, toK: 300 }, 'body.toK'],
    [{ material: 'Unobtainium' }, 'body.material'],
    [{ doping: { donorDensity: -1, acceptorDensity: 0 } }, 'body.doping.donorDensity'],
    [{ doping: undefined }, 'body.doping'],
  ])('answers 400 naming the field for %j', async (patch, field) => {
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({ ...body, ...patch });
    expect(res.status).toBe(400);
    const fields = (res.body.error.details as Array<{ field: string }>).map((d) => d.field);
    expect(fields).toContain(field);
  });

  it('turns a physics library refusal (a donor unknown in GaAs) into a 400, not a 500', async () => {
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({
        ...body,
        material: 'GaAs',
        doping: { donorDensity: 1e16, acceptorDensity: 0, donor: 'Xx' },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/donor/);
  });

  it('needs a sign-in', async () => {
    expect((await request(ctx.app).post('/api/model/curve').send(body)).status).toBe(401);
  });
});

describe('GET /api/materials', () => {
  it('is the physics library catalogue: semiconductors and metals with their sources', async () => {
    const res = await request(ctx.app).get('/api/materials').set(ctx.auth('technician'));
    expect(res.status).toBe(200);
    const { modelVersion, ...catalogue } = res.body;
    expect(modelVersion).toMatch(/^physics@/);
    expect(catalogue).toEqual(JSON.parse(JSON.stringify(listMaterials())));
    const si = res.body.semiconductors.find((m: { id: string }) => m.id === 'Si');
    expect(si.bandGap.source.label).toMatch(/Thurmond/);
    expect(si.donors.map((d: { name: string }) => d.name)).toContain('P');
    expect(res.body.metals.map((m: { id: string }) => m.id).sort()).toEqual([
      'Al',
      'Au',
      'Cu',
      'Ni',
      'Pt',
      'W',
    ]);
  });
});

describe('POST /api/model/curve for a metal film', () => {
  it('follows Bloch–Grüneisen over 20-1000 K and the linear reference over 200-600 K only', async () => {
    // Issue 13, defect 9: the linear reference was drawn over 100-1000 K though it is fair only
    // over 200-600 K (Cu at 100 K 19 % off).
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({ material: 'Cu', fromK: 10, toK: 1050, steps: 105 });
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('metal');
    expect(res.body.boundaries).toBeNull();
    const at = (t: number) =>
      res.body.points.find((p: { temperatureK: number }) => Math.abs(p.temperatureK - t) < 1e-9);
    expect(at(10)).toEqual({
      temperatureK: 10,
      resistivityOhmCm: null,
      linearReferenceOhmCm: null,
    });
    expect(at(100)).toEqual({
      temperatureK: 100,
      resistivityOhmCm: metalBlochGruneisen('Cu', 100),
      linearReferenceOhmCm: null,
    });
    expect(at(300)).toEqual({
      temperatureK: 300,
      resistivityOhmCm: metalBlochGruneisen('Cu', 300),
      linearReferenceOhmCm: metalResistivity('Cu', 300),
    });
    expect(at(700).linearReferenceOhmCm).toBeNull();
    expect(at(1050).resistivityOhmCm).toBeNull();
    // Matula 1979 (J. Phys. Chem. Ref. Data 8, 1147; from memory): Cu 1.725 µΩ cm at 300 K.
    expect(Math.abs(at(300).resistivityOhmCm / 1.725e-6 - 1)).toBeLessThan(0.01);
    expect(res.body.reference.model).toBe('bloch-gruneisen');
    expect(res.body.warnings).toEqual(['The Copper model curve covers 20–1000 K only.']);
  });

  it('says where Bloch–Grüneisen cannot follow a transition metal', async () => {
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({ material: 'Ni', fromK: 100, toK: 500, steps: 5 });
    expect(res.status).toBe(200);
    expect(res.body.warnings).toHaveLength(1);
    // 1 ppm/K = 10⁻⁶ 1/K: the tabulated 0.006 1/K is 6000 ppm/K.
    expect(res.body.warnings[0]).toMatch(/Nickel \(0\.006 1\/K, 6000 ppm\/K, at 20 °C/);
  });
});
