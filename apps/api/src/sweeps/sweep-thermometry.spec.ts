import type { SweepDto, SweepPreviewResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeWafer } from './sweep-test-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const station = (name: string, extra: object) => ({
  name,
  probeSpacingCm: 0.1,
  minTemperatureK: 4,
  maxTemperatureK: 500,
  ...extra,
});
const postStation = (body: object) =>
  request(ctx.app).post('/api/stations').set(ctx.auth('engineer')).send(body);

async function upload(text: string, fields: Record<string, string> = {}) {
  const wafer = await makeWafer({ thicknessCm: 0.05 });
  let req = request(ctx.app)
    .post(`/api/wafers/${wafer.id}/sweeps`)
    .set(ctx.auth('engineer'))
    .field('method', 'four-point')
    .field('spacingCm', '0.1');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  const res = await req.attach('file', Buffer.from(text), 'tc.csv');
  return { res, wafer };
}

const TC_FILE = [
  '# thermocouple: K',
  '# cold junction: 23.0 °C',
  'TC (mV),I (mA),V (mV)',
  '1.000,1,10.0',
  '2.000,1,10.2',
  '3.000,1,10.4',
].join('\n');

describe('thermometers in the import', () => {
  it('converts a K thermocouple in mV with the cold junction from a metadata line', async () => {
    // NIST Monograph 175 K table: 1.000 mV against a 23 °C junction is E = 1.919 mV, 47.48 °C
    // (worked from the reference functions, as in the physics tests).
    const { res, wafer } = await upload(TC_FILE);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const sweep = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer'))
    ).body as SweepDto;
    expect(Math.abs(sweep.points[0]!.temperatureK - (47.48 + 273.15))).toBeLessThan(0.02);
    expect(sweep.parseReport.temperature?.description).toMatch(
      /^type K thermocouple \(file\).*cold junction at 23\.00 °C \(file metadata\)/,
    );
    // the preview checks the store's choices, so it names the conversion the store used
    const preview = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps/preview`)
      .set(ctx.auth('engineer'))
      .field('spacingCm', '0.1')
      .attach('file', Buffer.from(TC_FILE), 'tc.csv');
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    expect((preview.body as SweepPreviewResponse).temperature?.kind).toBe('thermocouple');
  });

  it('takes the cold junction from a reference-junction column, row by row', async () => {
    const text =
      '# thermocouple: K\nTC (mV),CJC (°C),I (mA),V (mV)\n1.000,23.0,1,10\n1.000,0,1,10\n';
    const { res } = await upload(text);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const sweep = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer'))
    ).body as SweepDto;
    // 1.000 mV against 0 °C is 24.98 °C (NIST K table, from memory: 25 °C is 1.000 mV)
    expect(Math.abs(sweep.points[1]!.temperatureK - 298.15)).toBeLessThan(0.05);
    expect(Math.abs(sweep.points[0]!.temperatureK - 320.63)).toBeLessThan(0.02);
  });

  it('refuses a thermocouple column with no cold junction, naming what to add', async () => {
    const { res } = await upload('# thermocouple: K\nTC (mV),I (mA),V (mV)\n1,1,10\n2,1,11\n');
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].problem).toMatch(/cold junction: 23\.4 °C/);
  });

  it('the preview names a missing cold junction as blocking, in the words the store uses', async () => {
    const text = '# thermocouple: K\nTC (mV),I (mA),V (mV)\n1,1,10\n2,1,11\n';
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps/preview`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', Buffer.from(text), 'tc.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const preview = res.body as SweepPreviewResponse;
    expect(preview.temperature).toBeNull();
    expect(preview.pointCount).toBeNull();
    const blocking = preview.blocking.filter((b) => b.field === 'temperature');
    expect(blocking).toHaveLength(1);
    expect(blocking[0]!.problem).toMatch(/cold junction: 23\.4 °C/);
    expect(preview.temperatureNote).toBe(blocking[0]!.problem);
  });

  it("converts through a station's calibration table (a diode in volts)", async () => {
    // A linear table, so the expected temperatures are exact.
    const created = await postStation(
      station(`Diode bench ${process.pid}`, {
        thermometer: 'table',
        sensor: {
          kind: 'table',
          points: [
            { reading: 1.1, temperatureK: 20 },
            { reading: 1.0, temperatureK: 100 },
            { reading: 0.5, temperatureK: 500 },
          ],
        },
      }),
    );
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ thermometer: 'table', rtdR0Ohm: null });
    const { res } = await upload('Sensor (V),I (mA),V (mV)\n1.05,1,10\n0.75,1,11\n', {
      stationId: String(created.body.id),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const sweep = (
      await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer'))
    ).body as SweepDto;
    expect(sweep.points.map((p) => p.temperatureK)).toEqual([
      expect.closeTo(60, 0),
      expect.closeTo(300, 0),
    ]);
    expect(sweep.parseReport.temperature?.kind).toBe('table');
  });

  it('keeps the older station fields and the sensor in step', async () => {
    const rtd = await postStation(
      station(`Pt1000 bench ${process.pid}`, { thermometer: 'platinum-rtd', rtdR0Ohm: 1000 }),
    );
    expect(rtd.body.sensor).toEqual({ kind: 'platinum-rtd', r0Ohm: 1000 });
    const tc = await postStation(
      station(`TC bench ${process.pid}`, {
        thermometer: 'thermocouple',
        sensor: { kind: 'thermocouple', type: 'T', referenceJunctionK: 273.15 },
      }),
    );
    expect(tc.body).toMatchObject({ thermometer: 'thermocouple', rtdR0Ohm: null });
    const clash = await postStation(
      station(`Clash ${process.pid}`, {
        thermometer: 'platinum-rtd',
        sensor: { kind: 'thermocouple', type: 'K' },
      }),
    );
    expect(clash.status).toBe(400);
    expect(clash.body.error.details[0].field).toBe('body.thermometer');
  });
});
