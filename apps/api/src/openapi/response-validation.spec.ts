import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { fourPointCsv } from '../testing/sweep-files';
import { documentProblems } from './testing/document-validator';

let ctx: TestContext;
const ids = { lot: 0, wafer: 0, sweep: 0, fit: 0 };

/** Calls the API as the engineer and checks the answer against the document. */
async function checked(method: 'GET' | 'POST' | 'PATCH', url: string, path: string, body?: object) {
  const base = request(ctx.app);
  const call =
    method === 'GET' ? base.get(url) : method === 'POST' ? base.post(url) : base.patch(url);
  const res = await call.set(ctx.auth('engineer')).send(body);
  const where = `${method} ${url} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
  expect(documentProblems(method, path, res.status, res.body), where).toEqual([]);
  return res;
}

beforeAll(async () => {
  ctx = await createTestContext();
  const lot = await checked('POST', '/api/lots', '/lots', {
    code: 'OAS-1',
    material: 'Si',
    dopant: 'B',
    dopantType: 'p',
    thicknessCm: 0.05,
    specMinOhmCm: 1,
    specMaxOhmCm: 20,
  });
  ids.lot = lot.body.id;
  const wafer = await checked('POST', `/api/lots/${ids.lot}/wafers`, '/lots/{id}/wafers', {
    number: 'W1',
  });
  ids.wafer = wafer.body.id;
  const upload = await request(ctx.app)
    .post(`/api/wafers/${ids.wafer}/sweeps`)
    .set(ctx.auth('engineer'))
    .field('method', 'four-point')
    .field('spacingCm', '0.1')
    .attach('file', fourPointCsv(120, 'openapi'), 'oas.csv');
  expect(upload.status).toBe(201);
  expect(documentProblems('POST', '/wafers/{id}/sweeps', 201, upload.body)).toEqual([]);
  ids.sweep = upload.body.id;
});
afterAll(async () => ctx?.close());

describe('real answers match the OpenAPI document (ajv, JSON Schema 2020-12)', () => {
  it('lots and wafers, with null fields and an unset enum', async () => {
    // a metal lot: dopantType null exercises a nullable enum
    const metal = await checked('POST', '/api/lots', '/lots', { code: 'OAS-W', material: 'W' });
    expect(metal.body.dopantType).toBeNull();
    await checked('GET', '/api/lots', '/lots');
    await checked('GET', `/api/lots/${ids.lot}`, '/lots/{id}');
    await checked('PATCH', `/api/lots/${ids.lot}`, '/lots/{id}', { notes: 'openapi check' });
    await checked('GET', '/api/wafers?pageSize=5', '/wafers');
    await checked('GET', `/api/wafers/${ids.wafer}`, '/wafers/{id}');
    await checked('GET', `/api/lots/${ids.lot}/wafers`, '/lots/{id}/wafers');
  });

  it('sweeps: the list and the sweep with its points', async () => {
    await checked('GET', `/api/wafers/${ids.wafer}/sweeps`, '/wafers/{id}/sweeps');
    const sweep = await checked('GET', `/api/sweeps/${ids.sweep}`, '/sweeps/{id}');
    expect(sweep.body.points).toHaveLength(120);
    await checked('GET', '/api/sweeps/recent', '/sweeps/recent');
  });

  it('analysis: the sweep analysis, dopant, lot summary, comparison, model and materials', async () => {
    await checked('GET', `/api/sweeps/${ids.sweep}/analysis`, '/sweeps/{id}/analysis');
    const dopant = await request(ctx.app)
      .get(`/api/wafers/${ids.wafer}/dopant`)
      .set(ctx.auth('engineer'));
    expect(documentProblems('GET', '/wafers/{id}/dopant', dopant.status, dopant.body)).toEqual([]);
    await checked('GET', `/api/lots/${ids.lot}/summary`, '/lots/{id}/summary');
    await checked('GET', `/api/compare?sweeps=${ids.sweep}`, '/compare');
    await checked('POST', '/api/model/curve', '/model/curve', {
      material: 'Si',
      doping: { donorDensity: 0, acceptorDensity: 1e15 },
      fromK: 100,
      toK: 500,
      steps: 5,
    });
    await checked('POST', '/api/model/curve', '/model/curve', {
      material: 'Cu',
      fromK: 100,
      toK: 500,
      steps: 5,
    });
    await checked('GET', '/api/materials', '/materials');
  });

  it('fits: preview, store, list, read', async () => {
    const body = { kind: 'tcr', referenceK: 300, minK: 250, maxK: 500 };
    await checked(
      'POST',
      `/api/sweeps/${ids.sweep}/fits/preview`,
      '/sweeps/{id}/fits/preview',
      body,
    );
    const fit = await checked('POST', `/api/sweeps/${ids.sweep}/fits`, '/sweeps/{id}/fits', body);
    expect(fit.status, JSON.stringify(fit.body)).toBe(201);
    await checked('GET', `/api/sweeps/${ids.sweep}/fits`, '/sweeps/{id}/fits');
    await checked('GET', `/api/fits/${fit.body.id}`, '/fits/{id}');
    await checked('GET', '/api/fits/recent', '/fits/recent');
  });

  it('errors answer the documented error shape', async () => {
    const missing = await checked('GET', '/api/lots/999999', '/lots/{id}');
    expect(missing.status).toBe(404);
    const bad = await checked('POST', '/api/lots', '/lots', { code: '', material: 'Xx' });
    expect(bad.status).toBe(400);
  });

  it('the validator itself refuses an answer that breaks the document', () => {
    const lot = { id: 1, code: 'X', material: 'Unobtainium' };
    expect(documentProblems('GET', '/lots/{id}', 200, lot).length).toBeGreaterThan(0);
  });
});

describe('serving the document', () => {
  it('answers GET /api/openapi.json without sign-in, as OpenAPI 3.1', async () => {
    const res = await request(ctx.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    expect(res.body.components.securitySchemes.stationToken.scheme).toBe('bearer');
  });

  it('serves the reference page at /api/docs/ under the app CSP (no inline script)', async () => {
    const redirect = await request(ctx.app).get('/api/docs');
    expect(redirect.status).toBe(301);
    expect(redirect.headers.location).toBe('/api/docs/');
    const page = await request(ctx.app).get('/api/docs/');
    expect(page.status).toBe(200);
    expect(page.headers['content-security-policy']).toContain("script-src 'self'");
    expect(page.text).not.toMatch(/<script(?![^>]*\bsrc=)/);
    const init = await request(ctx.app).get('/api/docs/swagger-ui-init.js');
    expect(init.status).toBe(200);
    expect(init.text).toContain('/api/openapi.json');
  });
});
