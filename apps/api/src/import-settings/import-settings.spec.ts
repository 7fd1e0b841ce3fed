import type { ImportSettingsDto, SweepPreviewResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model';
import { makeStation, makeWafer } from '../sweeps/sweep-test-helpers';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

/** A station export whose headers say nothing the import recognises. */
const fileOf = (first: number) => `A;B;C\n${first};1,20;1\n${first + 10};1,25;1\n`;

async function preview(waferId: number, file: string, fields: Record<string, unknown> = {}) {
  let req = request(ctx.app)
    .post(`/api/wafers/${waferId}/sweeps/preview`)
    .set(ctx.auth('engineer'));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  const res = await req.attach('file', Buffer.from(file), 'export.csv');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as SweepPreviewResponse;
}

const save = (body: object, role: 'engineer' | 'technician' = 'engineer') =>
  request(ctx.app).put('/api/import-settings').set(ctx.auth(role)).send(body);

describe('saved import settings', () => {
  it('are offered for the next file of the same shape from the same station only', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const other = await makeStation({ probeSpacingCm: 0.1 });
    const first = await preview(wafer.id, fileOf(300), { stationId: station.id });
    expect(first.savedSettings).toBeNull();
    expect(first.shape).toMatch(/^[0-9a-f]{64}$/);
    expect(first.shapeLabel).toBe('3 semicolon-separated columns: A, B, C');
    expect(first.blocking.length).toBeGreaterThan(0);

    const settings = {
      stationId: station.id,
      shape: first.shape,
      shapeLabel: first.shapeLabel,
      method: 'four-point',
      columns: [
        { index: 0, meaning: 'temperature', unit: 'K' },
        { index: 1, meaning: 'voltage', unit: 'mV' },
        { index: 2, meaning: 'current', unit: 'mA' },
      ],
      geometry: { thicknessCm: 0.0525 },
      layout: { decimalMark: ',' },
    };
    const saved = await save(settings);
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body).toMatchObject({
      ...settings,
      stationName: station.name,
      savedById: ctx.users.engineer.id,
    });

    // the next export of that station, other readings, same header
    const next = await preview(wafer.id, fileOf(400), { stationId: station.id });
    expect(next.shape).toBe(first.shape);
    expect(next.savedSettings).toEqual(saved.body);
    // applied, they make the file storable
    const applied = await preview(wafer.id, fileOf(400), {
      stationId: station.id,
      method: 'four-point',
      columns: JSON.stringify(settings.columns),
      thicknessCm: 0.0525,
      decimalMark: ',',
    });
    expect(applied.blocking).toEqual([]);
    expect(applied.pointCount).toBe(2);

    expect(
      (await preview(wafer.id, fileOf(400), { stationId: other.id })).savedSettings,
    ).toBeNull();
    const otherShape = 'A;B;D\n300;1,20;1\n310;1,25;1\n';
    expect(
      (await preview(wafer.id, otherShape, { stationId: station.id })).savedSettings,
    ).toBeNull();
  });

  it('saved again replace the earlier ones, audited; deleting them stops the offer', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const { shape } = await preview(wafer.id, fileOf(300), { stationId: station.id });
    const base = { stationId: station.id, shape, columns: [], geometry: {}, layout: {} };
    const a = await save({ ...base, method: 'four-point' });
    const b = await save({ ...base, method: 'resistivity' }, 'technician');
    expect(b.status).toBe(200);
    expect(b.body.id).toBe(a.body.id);
    const list = await request(ctx.app)
      .get(`/api/import-settings?stationId=${station.id}`)
      .set(ctx.auth('engineer'));
    expect((list.body as ImportSettingsDto[]).map((s) => s.method)).toEqual(['resistivity']);
    const events = await AuditEvent.findAll({
      where: { entity: 'import-settings', entityId: String(a.body.id) },
      order: [['id', 'ASC']],
    });
    expect(events.map((e) => e.action)).toEqual(['create', 'update']);

    const denied = await request(ctx.app)
      .delete(`/api/import-settings/${a.body.id}`)
      .set(ctx.auth('technician'));
    expect(denied.status).toBe(403);
    const gone = await request(ctx.app)
      .delete(`/api/import-settings/${a.body.id}`)
      .set(ctx.auth('engineer'));
    expect(gone.status).toBe(204);
    expect(
      (await preview(wafer.id, fileOf(300), { stationId: station.id })).savedSettings,
    ).toBeNull();
  });

  it("keep a Hall file's factor and a map's site fields, each for its own kind of file", async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const { shape } = await preview(wafer.id, fileOf(300), { stationId: station.id });
    const base = { stationId: station.id, shape, columns: [], geometry: {}, layout: {} };
    const hall = await save({ ...base, method: 'hall', hallFactor: 'ionized-impurity' });
    expect(hall.status, JSON.stringify(hall.body)).toBe(200);
    expect(hall.body).toMatchObject({ hallFactor: 'ionized-impurity', map: null });
    const next = await preview(wafer.id, fileOf(300), { stationId: station.id });
    expect(next.savedSettings).toMatchObject({ method: 'hall', hallFactor: 'ionized-impurity' });

    const map = { sitePattern: 'ring-25', edgeExclusionMm: 5 };
    const mapped = await save({ ...base, method: 'four-point', hallFactor: 1.2, map });
    // a Hall factor belongs to Hall files only: a four-point setting does not keep it
    expect(mapped.body).toMatchObject({ hallFactor: null, map });
    const numbered = await save({ ...base, method: 'hall', hallFactor: 1.18 });
    expect(numbered.body).toMatchObject({ hallFactor: 1.18, map: null });

    const refused = await save({
      ...base,
      method: 'hall',
      hallFactor: 7,
      map: { sitePattern: 'spiral', edgeExclusionMm: -1 },
    });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual([
      'body.hallFactor',
      'body.map.edgeExclusionMm',
      'body.map.sitePattern',
    ]);
  });

  it('refuse a shape that is not a preview key and a station that does not exist', async () => {
    const bad = await save({
      stationId: 999999,
      shape: 'abc',
      method: 'bar',
      columns: [],
      geometry: {},
      layout: {},
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(['body.shape']);
    const noStation = await save({
      stationId: 999999,
      shape: 'a'.repeat(64),
      method: 'bar',
      columns: [],
      geometry: {},
      layout: {},
    });
    expect(noStation.status).toBe(400);
    expect(noStation.body.error.details[0].field).toBe('body.stationId');
  });
});
