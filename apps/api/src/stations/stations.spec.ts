import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';

const station = (name: string) => ({
  name,
  probeSpacingCm: 0.1,
  tipRadiusCm: 0.004,
  thermometer: 'platinum-rtd',
  rtdR0Ohm: 100,
  minTemperatureK: 77,
  maxTemperatureK: 450,
  calibratedOn: '2025-01-20',
  notes: 'Bench B, cryostat lid',
});

describe('/api/stations', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });
  const post = (body: object) =>
    request(ctx.app).post('/api/stations').set(ctx.auth('engineer')).send(body);

  it('registers a station (201), reads it, refuses a duplicate name (409)', async () => {
    const res = await post(station('Probe A'));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject(station('Probe A'));
    const read = await request(ctx.app)
      .get(`/api/stations/${res.body.id}`)
      .set(ctx.auth('technician'));
    expect(read.body).toEqual(res.body);
    expect((await post(station('Probe A'))).status).toBe(409);
  });

  it.each([
    ['missing name', { ...station('x'), name: undefined }, 'body.name'],
    ['missing spacing', { ...station('x1'), probeSpacingCm: undefined }, 'body.probeSpacingCm'],
    ['wrong-typed spacing', { ...station('x2'), probeSpacingCm: 'wide' }, 'body.probeSpacingCm'],
    ['zero spacing', { ...station('x3'), probeSpacingCm: 0 }, 'body.probeSpacingCm'],
    ['unknown thermometer', { ...station('x4'), thermometer: 'mercury' }, 'body.thermometer'],
    ['RTD without R0', { ...station('x5'), rtdR0Ohm: null }, 'body.rtdR0Ohm'],
    ['R0 on a thermocouple', { ...station('x6'), thermometer: 'thermocouple' }, 'body.rtdR0Ohm'],
    ['reversed range', { ...station('x7'), minTemperatureK: 500 }, 'body.minTemperatureK'],
    ['negative temperature', { ...station('x8'), minTemperatureK: -5 }, 'body.minTemperatureK'],
    ['bad date', { ...station('x9'), calibratedOn: '20-01-2025' }, 'body.calibratedOn'],
    ['oversized name', station('n'.repeat(101)), 'body.name'],
    ['oversized notes', { ...station('x10'), notes: 'n'.repeat(5001) }, 'body.notes'],
    ['unknown field', { ...station('x11'), colour: 'grey' }, 'body.colour'],
    [
      'unknown thermocouple type',
      {
        ...station('x12'),
        thermometer: 'thermocouple',
        rtdR0Ohm: null,
        sensor: { kind: 'thermocouple', type: 'Q' },
      },
      'body.sensor.type',
    ],
    [
      'a two-point table (a straight line, no calibration of a sensor curve)',
      {
        ...station('x14'),
        thermometer: 'table',
        rtdR0Ohm: null,
        sensor: {
          kind: 'table',
          points: [
            { reading: 1.1, temperatureK: 20 },
            { reading: 0.5, temperatureK: 300 },
          ],
        },
      },
      'body.sensor.points',
    ],
    [
      'a table that turns back',
      {
        ...station('x13'),
        thermometer: 'table',
        rtdR0Ohm: null,
        sensor: {
          kind: 'table',
          points: [
            { reading: 1.1, temperatureK: 20 },
            { reading: 1.0, temperatureK: 100 },
            { reading: 0.9, temperatureK: 60 },
          ],
        },
      },
      'body.sensor.points',
    ],
  ])('refuses a station with %s', async (_label, body, field) => {
    const res = await post(body);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('stores injection strings and Unicode verbatim and patches consistently', async () => {
    const name = `Ω-Stage 'x'); DROP TABLE stations;-- <b>試</b> 🧊`;
    const notes = `Robert'); DELETE FROM users;-- \\ %_ "quoted" ${'\u{1F52C}'}`;
    const res = await post({ ...station(name), notes });
    expect(res.status).toBe(201);
    const list = await request(ctx.app)
      .get('/api/stations')
      .query({ q: 'DROP TABLE' })
      .set(ctx.auth('physicist'));
    expect(list.body.items).toEqual([expect.objectContaining({ name, notes })]);
    const patch = await request(ctx.app)
      .patch(`/api/stations/${res.body.id}`)
      .set(ctx.auth('manager'))
      .send({ maxTemperatureK: 50 });
    expect(patch.status).toBe(400);
    const ok = await request(ctx.app)
      .patch(`/api/stations/${res.body.id}`)
      .set(ctx.auth('manager'))
      .send({ thermometer: 'thermocouple', rtdR0Ohm: null });
    expect(ok.body).toMatchObject({ thermometer: 'thermocouple', rtdR0Ohm: null, name });
    const del = await request(ctx.app)
      .delete(`/api/stations/${res.body.id}`)
      .set(ctx.auth('admin'));
    expect(del.status).toBe(204);
    expect(
      (await request(ctx.app).get(`/api/stations/${res.body.id}`).set(ctx.auth('admin'))).status,
    ).toBe(404);
  });
});
