import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listMaterials, metalResistivity, modelCurve, regimeBoundaries } from '@rhotrace/physics';
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
  it('draws the library reference (metalResistivity) inside 100-1000 K and null outside', async () => {
    const res = await request(ctx.app)
      .post('/api/model/curve')
      .set(ctx.auth('engineer'))
      .send({ material: 'Cu', fromK: 50, toK: 1050, steps: 11 });
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('metal');
    expect(res.body.boundaries).toBeNull();
    expect(res.body.points[0]).toEqual({ temperatureK: 50, resistivityOhmCm: null });
    expect(res.body.points[10].resistivityOhmCm).toBeNull();
    expect(res.body.points[3]).toEqual({
      temperatureK: 350,
      resistivityOhmCm: metalResistivity('Cu', 350),
    });
    // Common practice: a metal's resistivity rises with temperature.
    expect(res.body.points[5].resistivityOhmCm).toBeGreaterThan(
      res.body.points[3].resistivityOhmCm,
    );
  });
});
