import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { Assignment } from '../assignments/assignment.model';
import { AuditEvent } from '../audit/audit-event.model';
import { Sweep } from '../sweeps/sweep.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Lot } from './lot.model';

/** Text that breaks naive SQL, HTML and JSON handling, plus scripts beyond Latin-1. */
const NASTY = [
  `Robert'); DROP TABLE lots;-- "x" \\ %_ <script>alert(1)</script>`,
  'Ωmega-lot 試料 ✓ 🧪 ẞ Ø ‍👩‍🔬 ',
  '${7*7} {{7*7}} \u0000-free but \t tabbed\nnewline',
];

/** The first `n` UTF-16 units of `text`, never splitting a surrogate pair. */
const cut = (text: string, n: number): string => {
  let out = '';
  for (const ch of text) {
    if (out.length + ch.length > n) break;
    out += ch;
  }
  return out;
};

const validLot = (code: string) => ({
  code,
  material: 'Si',
  dopant: 'B',
  dopantType: 'p',
  orientation: '(100)',
  diameterCm: 10,
  thicknessCm: 0.0525,
  supplier: 'Example Crystal Works',
  receivedOn: '2025-03-14',
  specMinOhmCm: 1,
  specMaxOhmCm: 20,
  notes: 'Invented demo lot',
});

describe('lots and wafers', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  const post = (path: string, body: unknown, role: 'admin' | 'engineer' = 'engineer') =>
    request(ctx.app)
      .post(path)
      .set(ctx.auth(role))
      .send(body as object);

  it('creates a lot (201 with id), reads it with waferCount, and writes the audit event', async () => {
    const res = await post('/api/lots', validLot('LOT-A1'));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ...validLot('LOT-A1'), waferCount: 0 });
    expect(res.body.id).toBeGreaterThan(0);
    const read = await request(ctx.app).get(`/api/lots/${res.body.id}`).set(ctx.auth('physicist'));
    expect(read.status).toBe(200);
    expect(read.body).toEqual(res.body);
    const events = await AuditEvent.findAll({
      where: { entity: 'lot', entityId: String(res.body.id) },
    });
    expect(events).toHaveLength(1);
    expect(events[0]!.actorId).toBe(ctx.users.engineer.id);
    expect(events[0]!.requestId).toBe(res.headers['x-request-id']);
    expect(events[0]!.after).toMatchObject({ code: 'LOT-A1' });
  });

  it('answers a duplicate lot code with 409', async () => {
    expect((await post('/api/lots', validLot('LOT-DUP'))).status).toBe(201);
    const again = await post('/api/lots', validLot('LOT-DUP'));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('conflict');
  });

  it.each([
    ['missing code', { material: 'Si' }, 'body.code'],
    ['missing material', { code: 'X1' }, 'body.material'],
    ['unknown material', { code: 'X2', material: 'Unobtainium' }, 'body.material'],
    ['wrong-typed diameter', { code: 'X3', material: 'Si', diameterCm: '10' }, 'body.diameterCm'],
    ['diameter out of range', { code: 'X4', material: 'Si', diameterCm: 51 }, 'body.diameterCm'],
    ['thickness zero', { code: 'X5', material: 'Si', thicknessCm: 0 }, 'body.thicknessCm'],
    ['thickness above 1 cm', { code: 'X6', material: 'Si', thicknessCm: 2 }, 'body.thicknessCm'],
    ['negative spec', { code: 'X7', material: 'Si', specMinOhmCm: -1 }, 'body.specMinOhmCm'],
    [
      'reversed spec',
      { code: 'X8', material: 'Si', specMinOhmCm: 5, specMaxOhmCm: 1 },
      'body.specMinOhmCm',
    ],
    [
      'impossible date',
      { code: 'X9', material: 'Si', receivedOn: '2025-02-30' },
      'body.receivedOn',
    ],
    ['not a date', { code: 'X10', material: 'Si', receivedOn: 'yesterday' }, 'body.receivedOn'],
    ['bad dopant type', { code: 'X11', material: 'Si', dopantType: 'x' }, 'body.dopantType'],
    ['bad dopant symbol', { code: 'X12', material: 'Si', dopant: 'boron' }, 'body.dopant'],
    ['oversized code', { code: 'C'.repeat(65), material: 'Si' }, 'body.code'],
    [
      'oversized supplier',
      { code: 'X13', material: 'Si', supplier: 's'.repeat(201) },
      'body.supplier',
    ],
    ['oversized notes', { code: 'X14', material: 'Si', notes: 'n'.repeat(5001) }, 'body.notes'],
    ['blank code', { code: '   ', material: 'Si' }, 'body.code'],
    [
      'dopant type on a metal film',
      { code: 'X15', material: 'W', dopantType: 'n' },
      'body.dopantType',
    ],
    ['unknown field', { code: 'X16', material: 'Si', colour: 'blue' }, 'body.colour'],
  ])('refuses a lot with %s (400 naming the field)', async (_label, body, field) => {
    const res = await post('/api/lots', body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('refuses non-finite numbers and a body that is not an object', async () => {
    const raw = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('engineer'))
      .set('Content-Type', 'application/json')
      .send('{"code":"NF","material":"Si","diameterCm":1e999}');
    expect(raw.status).toBe(400);
    expect((await post('/api/lots', [1, 2])).status).toBe(400);
  });

  it('stores and returns injection strings and Unicode verbatim in every text field', async () => {
    for (const [i, text] of NASTY.entries()) {
      const lot = {
        ...validLot(`${cut(text, 50)}${i}`),
        orientation: cut(text, 16),
        supplier: text,
        notes: text,
      };
      const res = await post('/api/lots', lot);
      expect(res.status).toBe(201);
      const read = await request(ctx.app).get(`/api/lots/${res.body.id}`).set(ctx.auth('admin'));
      expect(read.body).toMatchObject(lot);
      const wafer = await post(`/api/lots/${res.body.id}/wafers`, {
        number: cut(text, 32),
        notes: text,
      });
      expect(wafer.status).toBe(201);
      const w = await request(ctx.app).get(`/api/wafers/${wafer.body.id}`).set(ctx.auth('admin'));
      expect(w.body).toMatchObject({ number: cut(text, 32), notes: text, lotCode: lot.code });
      const found = await request(ctx.app)
        .get('/api/lots')
        .query({ q: cut(text, 12) })
        .set(ctx.auth('admin'));
      expect(found.body.items.map((l: { id: number }) => l.id)).toContain(res.body.id);
    }
    expect(await Lot.count()).toBeGreaterThan(0); // the table is still there
    const broken = await post('/api/lots', {
      code: 'BROKEN',
      material: 'Si',
      notes: 'half \uD83E',
    });
    expect(broken.status).toBe(400);
    expect(broken.body.error.details[0]).toEqual({
      field: 'body.notes',
      problem: 'must be valid Unicode text',
    });
  });

  it('lists lots paginated, filtered and sorted, with bad parameters a 400', async () => {
    for (const code of ['LIST-3', 'LIST-1', 'LIST-2']) {
      await post('/api/lots', { code, material: 'GaAs', dopant: 'Si', dopantType: 'n' });
    }
    const res = await request(ctx.app)
      .get('/api/lots')
      .query({ material: 'GaAs', sort: '-code', pageSize: 2, page: 1 })
      .set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(res.body.items.map((l: { code: string }) => l.code)).toEqual(['LIST-3', 'LIST-2']);
    const page2 = await request(ctx.app)
      .get('/api/lots')
      .query({ material: 'GaAs', sort: '-code', pageSize: 2, page: 2 })
      .set(ctx.auth('manager'));
    expect(page2.body.items.map((l: { code: string }) => l.code)).toEqual(['LIST-1']);
    expect(page2.body.total).toBe(3);
    const beyond = await request(ctx.app)
      .get('/api/lots')
      .query({ material: 'GaAs', pageSize: 2, page: 5 })
      .set(ctx.auth('manager'));
    expect(beyond.body).toMatchObject({ items: [], total: 3, page: 5 });
    const none = await request(ctx.app)
      .get('/api/lots')
      .query({ q: 'no-such-lot-anywhere' })
      .set(ctx.auth('manager'));
    expect(none.body).toMatchObject({ items: [], total: 0 });
    const n = await request(ctx.app)
      .get('/api/lots')
      .query({ dopantType: 'n' })
      .set(ctx.auth('manager'));
    expect(n.body.items.every((l: { dopantType: string }) => l.dopantType === 'n')).toBe(true);
    for (const query of [
      { sort: 'passwordHash' },
      { pageSize: 201 },
      { page: 0 },
      { colour: 'red' },
    ]) {
      const bad = await request(ctx.app).get('/api/lots').query(query).set(ctx.auth('manager'));
      expect(bad.status, JSON.stringify(query)).toBe(400);
    }
    expect((await request(ctx.app).get('/api/lots/abc').set(ctx.auth('admin'))).status).toBe(400);
    expect((await request(ctx.app).get('/api/lots/999999').set(ctx.auth('admin'))).status).toBe(
      404,
    );
  });

  it('patches a lot, keeping specMin ≤ specMax against stored values', async () => {
    const lot = (await post('/api/lots', validLot('LOT-PATCH'))).body;
    const ok = await request(ctx.app)
      .patch(`/api/lots/${lot.id}`)
      .set(ctx.auth('manager'))
      .send({ supplier: 'Other Supplier Ltd.', specMaxOhmCm: 30 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({
      supplier: 'Other Supplier Ltd.',
      specMaxOhmCm: 30,
      specMinOhmCm: 1,
    });
    const bad = await request(ctx.app)
      .patch(`/api/lots/${lot.id}`)
      .set(ctx.auth('manager'))
      .send({ specMinOhmCm: 40 });
    expect(bad.status).toBe(400);
    const audit = await request(ctx.app)
      .get('/api/audit')
      .query({ entity: 'lot', id: lot.id })
      .set(ctx.auth('manager'));
    expect(audit.status).toBe(200);
    const update = audit.body.items.find((e: { action: string }) => e.action === 'update');
    expect(update.before.supplier).toBe('Example Crystal Works');
    expect(update.after.supplier).toBe('Other Supplier Ltd.');
    expect(update.actorEmail).toBe('manager@test.rhotrace.example');
  });

  it('validates wafers and refuses a duplicate number in the lot', async () => {
    const lot = (await post('/api/lots', validLot('LOT-W'))).body;
    const path = `/api/lots/${lot.id}/wafers`;
    expect((await post(path, { number: 1, thicknessCm: 0.05 })).status).toBe(201);
    expect((await post(path, { number: '1' })).status).toBe(409);
    for (const [body, field] of [
      [{}, 'body.number'],
      [{ number: {} }, 'body.number'],
      [{ number: 'x'.repeat(33) }, 'body.number'],
      [{ number: '2', thicknessCm: -0.1 }, 'body.thicknessCm'],
      [{ number: '2', state: 'lost' }, 'body.state'],
      [{ number: '2', notes: 'n'.repeat(5001) }, 'body.notes'],
      [{ number: '2', lotId: 5 }, 'body.lotId'],
    ] as const) {
      const res = await post(path, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
    }
    expect((await post('/api/lots/999999/wafers', { number: '1' })).status).toBe(404);
    const listed = await request(ctx.app).get(path).set(ctx.auth('physicist'));
    expect(listed.body).toMatchObject({ total: 1, items: [{ number: '1', lotCode: 'LOT-W' }] });
    expect(
      (await request(ctx.app).get(`/api/lots/${lot.id}`).set(ctx.auth('admin'))).body.waferCount,
    ).toBe(1);
  });

  it('shows technicians only their assigned wafers and those lots; 404 elsewhere', async () => {
    const mine = (await post('/api/lots', validLot('LOT-TECH-MINE'))).body;
    const other = (await post('/api/lots', validLot('LOT-TECH-OTHER'))).body;
    const w1 = (await post(`/api/lots/${mine.id}/wafers`, { number: 'T1' })).body;
    const w2 = (await post(`/api/lots/${mine.id}/wafers`, { number: 'T2' })).body;
    const w3 = (await post(`/api/lots/${other.id}/wafers`, { number: 'T3' })).body;
    const { user, header } = await ctx.addUser('technician');
    await Assignment.create({
      waferId: w1.id,
      assigneeId: user.id,
      assignedById: ctx.users.manager.id,
      task: 'Measure R(T) from 80 K to 400 K',
      dueDate: '2030-01-01',
      notes: null,
    });
    const wafers = await request(ctx.app).get('/api/wafers').set(header);
    expect(wafers.body.items.map((w: { id: number }) => w.id)).toEqual([w1.id]);
    expect(wafers.body.total).toBe(1);
    const lots = await request(ctx.app).get('/api/lots').set(header);
    expect(lots.body.items).toEqual([expect.objectContaining({ id: mine.id, waferCount: 1 })]);
    // everyone else sees every wafer that is not deleted
    expect(
      (await request(ctx.app).delete(`/api/wafers/${w2.id}`).set(ctx.auth('admin'))).status,
    ).toBe(204);
    const all = await request(ctx.app)
      .get('/api/lots')
      .query({ q: 'LOT-TECH' })
      .set(ctx.auth('manager'));
    expect(
      all.body.items.map((l: { code: string; waferCount: number }) => [l.code, l.waferCount]),
    ).toEqual([
      ['LOT-TECH-MINE', 1],
      ['LOT-TECH-OTHER', 1],
    ]);
    expect(all.body.total).toBe(2);
    expect((await request(ctx.app).get(`/api/wafers/${w1.id}`).set(header)).status).toBe(200);
    expect((await request(ctx.app).get(`/api/wafers/${w2.id}`).set(header)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/wafers/${w3.id}`).set(header)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/lots/${other.id}`).set(header)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/lots/${other.id}/wafers`).set(header)).status).toBe(
      404,
    );
    const inLot = await request(ctx.app).get(`/api/lots/${mine.id}/wafers`).set(header);
    expect(inLot.body.items.map((w: { id: number }) => w.id)).toEqual([w1.id]);
  });

  it('refuses to delete a lot with measured wafers (409) and soft-deletes one without', async () => {
    const measured = (await post('/api/lots', validLot('LOT-MEASURED'))).body;
    const wafer = (await post(`/api/lots/${measured.id}/wafers`, { number: 'M1' })).body;
    await Sweep.create({
      waferId: wafer.id,
      stationId: null,
      method: 'four-point',
      geometry: {},
      uploadedById: ctx.users.engineer.id,
      originalName: 'sweep.csv',
      sizeBytes: 10,
      sha256: 'a'.repeat(64),
      storageKind: 'db',
      storageKey: 'k',
      columnMapping: {},
      metadata: null,
      parseReport: {},
      pointCount: 0,
      minTemperatureK: null,
      maxTemperatureK: null,
      deletedById: null,
    });
    const refused = await request(ctx.app)
      .delete(`/api/lots/${measured.id}`)
      .set(ctx.auth('admin'));
    expect(refused.status).toBe(409);
    expect(
      (await request(ctx.app).delete(`/api/wafers/${wafer.id}`).set(ctx.auth('admin'))).status,
    ).toBe(409);

    const spare = (await post('/api/lots', validLot('LOT-SPARE'))).body;
    const sw = (await post(`/api/lots/${spare.id}/wafers`, { number: 'S1' })).body;
    const gone = await request(ctx.app).delete(`/api/lots/${spare.id}`).set(ctx.auth('engineer'));
    expect(gone.status).toBe(204);
    expect(
      (await request(ctx.app).get(`/api/lots/${spare.id}`).set(ctx.auth('admin'))).status,
    ).toBe(404);
    expect((await request(ctx.app).get(`/api/wafers/${sw.id}`).set(ctx.auth('admin'))).status).toBe(
      404,
    );
    const kept = await Lot.findByPk(spare.id, { paranoid: false });
    expect(kept?.deletedAt).toBeInstanceOf(Date);
    const trail = await AuditEvent.findAll({ where: { action: 'delete' } });
    expect(trail.map((e) => `${e.entity}:${e.entityId}`)).toEqual(
      expect.arrayContaining([`lot:${spare.id}`, `wafer:${sw.id}`]),
    );
  });

  it('rolls back the change when its audit event cannot be written', async () => {
    const spy = vi.spyOn(AuditEvent, 'create').mockRejectedValueOnce(new Error('disk full'));
    const before = await AuditEvent.count();
    const res = await post('/api/lots', validLot('LOT-ROLLBACK'));
    spy.mockRestore();
    expect(res.status).toBe(500);
    expect(res.body.error.message).not.toContain('disk full');
    expect(await Lot.count({ where: { code: 'LOT-ROLLBACK' }, paranoid: false })).toBe(0);
    expect(await AuditEvent.count()).toBe(before);

    const lot = (await post('/api/lots', validLot('LOT-ROLLBACK-2'))).body;
    const spy2 = vi.spyOn(AuditEvent, 'create').mockRejectedValueOnce(new Error('disk full'));
    const patch = await request(ctx.app)
      .patch(`/api/lots/${lot.id}`)
      .set(ctx.auth('admin'))
      .send({ supplier: 'Never stored' });
    spy2.mockRestore();
    expect(patch.status).toBe(500);
    expect((await Lot.findByPk(lot.id))?.supplier).toBe('Example Crystal Works');
  });
});
