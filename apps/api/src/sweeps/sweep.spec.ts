import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { SweepDto, SweepPreviewResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeStation, makeWafer } from './sweep-test-helpers';

const SEED = fileURLToPath(new URL('../../../../seed-data/sweeps/', import.meta.url));

interface ExpectedPoint {
  row: number;
  sequence: number;
  temperatureK: number;
  resistivityOhmCm: number;
  sheetResistanceOhmSq: number;
  currentA?: number;
  voltageV?: number;
  resistanceOhm?: number;
  flags: string[];
}
interface Sidecar {
  file: string;
  method: string;
  setup: {
    wafer: { thicknessCm?: number };
    lot: { diameterCm?: number };
    station: {
      probeSpacingCm: number;
      thermometer: 'thermocouple' | 'platinum-rtd';
      rtdR0Ohm?: number;
    } | null;
  };
  expect: {
    pointCount: number;
    points: ExpectedPoint[];
    relativeTolerance: number;
    delimiter: string;
    decimalMark: string;
  };
}

const sidecars = readdirSync(SEED)
  .filter((f) => f.endsWith('.expected.json'))
  .map((f) => JSON.parse(readFileSync(SEED + f, 'utf8')) as Sidecar);

function close(actual: number | null, expected: number, tolerance: number): void {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(Math.abs(expected) * tolerance + 1e-12);
}

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const upload = (
  waferId: number,
  file: Buffer,
  name: string,
  fields: Record<string, string> = {},
  role = 'engineer' as const,
) => {
  let req = request(ctx.app).post(`/api/wafers/${waferId}/sweeps`).set(ctx.auth(role));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', file, name);
};

// Expected values come from seed-data/sweeps/expected-values.py, which recomputes them from the
// published formulas (Valdes 1954 / Smits 1958 four-point probe, van der Pauw 1958, IEC 60751)
// without the TypeScript physics library.
describe('each example export end to end', () => {
  for (const sc of sidecars) {
    it(`${sc.file}: preview, store and read back match the sidecar`, async () => {
      const bytes = readFileSync(SEED + sc.file);
      const wafer = await makeWafer({
        thicknessCm: sc.setup.wafer.thicknessCm,
        diameterCm: sc.setup.lot.diameterCm,
      });
      const station = sc.setup.station ? await makeStation(sc.setup.station) : null;

      const preview = await request(ctx.app)
        .post(`/api/wafers/${wafer.id}/sweeps/preview`)
        .set(ctx.auth('engineer'))
        .attach('file', bytes, sc.file);
      expect(preview.status).toBe(200);
      const pv = preview.body as SweepPreviewResponse;
      expect(pv.delimiter).toBe(sc.expect.delimiter);
      expect(pv.decimalMark).toBe(sc.expect.decimalMark);
      expect(pv.suggestedMethod).toBe(sc.method);
      expect(pv.problems).toEqual([]);
      expect(pv.rows.length).toBe(Math.min(20, pv.rowCount));

      const res = await upload(wafer.id, bytes, sc.file, {
        method: sc.method,
        ...(station ? { stationId: String(station.id) } : {}),
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.pointCount).toBe(sc.expect.pointCount);

      const got = await request(ctx.app)
        .get(`/api/sweeps/${res.body.id}`)
        .set(ctx.auth('physicist'));
      expect(got.status).toBe(200);
      const sweep = got.body as SweepDto;
      expect(sweep.points).toHaveLength(sc.expect.pointCount);
      const tol = sc.expect.relativeTolerance;
      for (const e of sc.expect.points) {
        const p = sweep.points.find((x) => x.sourceRow === e.row);
        expect(p, `point from row ${e.row}`).toBeDefined();
        expect(p!.sequence).toBe(e.sequence);
        close(p!.temperatureK, e.temperatureK, 1e-9);
        close(p!.resistivityOhmCm, e.resistivityOhmCm, tol);
        close(p!.sheetResistanceOhmSq, e.sheetResistanceOhmSq, tol);
        if (e.currentA !== undefined) close(p!.currentA, e.currentA, 1e-9);
        if (e.voltageV !== undefined) close(p!.voltageV, e.voltageV, 1e-9);
        if (e.resistanceOhm !== undefined) close(p!.resistanceOhm, e.resistanceOhm, 1e-9);
        expect(p!.flags).toEqual(e.flags);
        expect(p!.raw[0]!.row).toBe(e.row);
      }
    });
  }
});

describe('geometry and mapping', () => {
  const file = Buffer.from('T (K),I (mA),V (mV)\n300,1,10\n310,1,11\n');

  it('takes request geometry over the records and says where each value came from', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await upload(wafer.id, file, 'a.csv', {
      method: 'four-point',
      spacingCm: '0.1',
      thicknessCm: '0.02',
    });
    expect(res.status).toBe(201);
    const sweep = (await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('admin')))
      .body as SweepDto;
    expect(sweep.geometry).toMatchObject({
      thicknessCm: 0.02,
      spacingCm: 0.1,
      sources: { thicknessCm: 'request', spacingCm: 'request' },
    });
    // Thin sheet: rho = (pi/ln2) (V/I) t F, with F(0.2) from Valdes 1954 within 1e-3 of 1.
    expect(sweep.points[0]!.resistivityOhmCm / (4.53236 * 10 * 0.02)).toBeCloseTo(1, 2);
  });

  it('answers 400 naming the missing spacing and thickness', async () => {
    const wafer = await makeWafer();
    const res = await upload(wafer.id, file, 'b.csv', { method: 'four-point' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual([
      'spacingCm',
      'thicknessCm',
    ]);
  });

  it('answers 400 when temperatures are RTD ohms and no R0 is known', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const rtd = Buffer.from('RTD (ohm),V (mV),I (mA)\n110,1,1\n');
    const res = await upload(wafer.id, rtd, 'rtd.csv', { method: 'four-point', spacingCm: '0.1' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ field: 'rtdR0Ohm' });
    expect(res.body.error.details[0].problem).toMatch(/RTD ohms.*R0/);
  });

  it('uses a column mapping sent as JSON', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const odd = Buffer.from('a,b,c\n300,10,1\n320,12,1\n');
    const columns = JSON.stringify([
      { index: 0, meaning: 'temperature', unit: 'K' },
      { index: 1, meaning: 'voltage', unit: 'mV' },
      { index: 2, meaning: 'current', unit: 'mA' },
    ]);
    const res = await upload(wafer.id, odd, 'odd.csv', {
      method: 'four-point',
      spacingCm: '0.1',
      columns,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const bad = await upload(wafer.id, odd, 'odd2.csv', {
      method: 'four-point',
      columns: '[{"index":0',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('body.columns');
  });

  it('answers 400 for an unknown method and a missing file', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await upload(wafer.id, file, 'c.csv', { method: 'seebeck' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].field).toBe('body.method');
    const none = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'bar');
    expect(none.status).toBe(400);
    expect(none.body.error.details[0].field).toBe('file');
  });
});

describe('errors a technician can act on', () => {
  let waferId: number;
  const fields = { method: 'four-point', spacingCm: '0.1' };
  beforeAll(async () => {
    waferId = (await makeWafer({ thicknessCm: 0.05 })).id;
  });
  const refused = async (text: string | Buffer, status: number) => {
    const res = await upload(
      waferId,
      Buffer.isBuffer(text) ? text : Buffer.from(text),
      'x.csv',
      fields,
    );
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    return res.body.error as {
      message: string;
      details: Array<{ row: number | null; column: string | null; problem: string }>;
    };
  };

  it('an empty file is 400', async () => {
    expect((await refused('', 400)).message).toMatch(/empty/);
  });
  it('a binary file is 400', async () => {
    expect(
      (await refused(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 13]), 400)).message,
    ).toMatch(/not a text export/);
  });
  it('a file without rows of numbers is 422', async () => {
    expect((await refused('Dear lab,\nplease find the data attached.\n', 422)).message).toMatch(
      /No rows of numbers/,
    );
  });
  it('an unreadable cell is 422 naming its file line and column', async () => {
    const e = await refused('# export\nT (K),I (mA),V (mV)\n300,1,10\n310,1,n/a\n320,1,12\n', 422);
    expect(e.details).toEqual([
      expect.objectContaining({ row: 4, column: 'V (mV)', problem: '"n/a" is not a number' }),
    ]);
  });
  it('a temperature at or below 0 K is refused', async () => {
    const e = await refused('T (°C),I (mA),V (mV)\n20,1,10\n-280,1,10\n', 422);
    expect(e.details[0]).toMatchObject({ row: 3, column: 'T (°C)' });
    const k = await refused('T (K),I (mA),V (mV)\n0,1,10\n', 422);
    expect(k.details[0]!.problem).toMatch(/0 K/);
  });
  it('zero and negative currents are refused', async () => {
    const e = await refused('T (K),I (mA),V (mV)\n300,0,10\n310,-1,-10\n', 422);
    expect(e.details.map((d) => d.row)).toEqual([2, 3]);
    expect(e.details[1]!.problem).toMatch(/negative/);
  });
  it('a missing required column is 400', async () => {
    const e = await refused('T (K),time (s)\n300,1\n', 400);
    expect(e.details[0]!.problem).toMatch(/voltage or resistance/);
  });
  it('a missing value in a required column is refused', async () => {
    const e = await refused('T (K),I (mA),V (mV)\n300,1,\n', 422);
    expect(e.details[0]).toMatchObject({
      row: 2,
      column: 'V (mV)',
      problem: 'the value is missing',
    });
  });
  it('nothing was stored by any refused upload', async () => {
    const list = await request(ctx.app).get(`/api/wafers/${waferId}/sweeps`).set(ctx.auth('admin'));
    expect(list.body).toEqual([]);
  });
});

describe('suspicious values are stored with flags and warnings', () => {
  it('flags a jump and a temperature reversal', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const text = 'T (K),I (mA),V (mV)\n300,1,10\n310,1,11\n305,1,11.5\n320,1,150\n330,1,13\n';
    const res = await upload(wafer.id, Buffer.from(text), 's.csv', {
      method: 'four-point',
      spacingCm: '0.1',
    });
    expect(res.status).toBe(201);
    expect(res.body.warnings.join(' ')).toMatch(/more than 10 times/);
    expect(res.body.warnings.join(' ')).toMatch(/against the ramp/);
    const sweep = (await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('admin')))
      .body as SweepDto;
    // five points are too few for the Hampel bound's sweep-wide scatter: the jump alone flags
    expect(sweep.points.map((p) => p.flags)).toEqual([
      [],
      [],
      ['temperature-reversal'],
      ['jump'],
      ['jump'],
    ]);
    expect(sweep.points.map((p) => p.leg)).toEqual([1, 1, 1, 1, 1]);
    expect(sweep.parseReport.flaggedPoints).toBe(3);
    expect(sweep.parseReport.findings!.map((f) => [f.sequence, f.flag])).toEqual([
      [3, 'temperature-reversal'],
      [4, 'jump'],
      [5, 'jump'],
    ]);
    const list = await request(ctx.app)
      .get(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('admin'));
    expect(list.body[0].flaggedPoints).toBe(3);
  });
});

describe('reads', () => {
  let id: number;
  let waferId: number;
  beforeAll(async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    waferId = wafer.id;
    const a = await upload(
      waferId,
      Buffer.from('T (K),I (mA),V (mV),note\n300,1,10,=HYPERLINK("x")\n310,1,-11,-3\n'),
      'first.csv',
      {
        method: 'four-point',
        spacingCm: '0.1',
      },
    );
    expect(a.status).toBe(422); // V/I opposite signs on row 3
    expect(a.body.error.details[0]).toMatchObject({ row: 3 });
    const b = await upload(
      waferId,
      Buffer.from('T (K),I (mA),V (mV),note\n300,1,10,=HYPERLINK("x")\n310,1,11,-3\n'),
      'first.csv',
      {
        method: 'four-point',
        spacingCm: '0.1',
      },
    );
    id = b.body.id;
    await upload(waferId, Buffer.from('T (K),I (mA),V (mV)\n300,1,20\n'), 'second.csv', {
      method: 'four-point',
      spacingCm: '0.1',
    });
  });

  it('lists the wafer sweeps newest first without points', async () => {
    const res = await request(ctx.app)
      .get(`/api/wafers/${waferId}/sweeps`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    expect(res.body.map((s: { originalName: string }) => s.originalName)).toEqual([
      'second.csv',
      'first.csv',
    ]);
    expect(res.body[0].points).toBeUndefined();
    expect(res.body[1]).toMatchObject({
      pointCount: 2,
      method: 'four-point',
      uploadedByName: 'Test engineer',
    });
  });

  it('exports points as CSV with formula text neutralised and negative numbers left alone', async () => {
    const res = await request(ctx.app)
      .get(`/api/sweeps/${id}/points.csv`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'sequence,source_row,temperature_k,current_a,voltage_v,resistance_ohm,sheet_resistance_ohm_sq,resistivity_ohm_cm,flags,raw T (K),raw I (mA),raw V (mV),raw note',
    );
    expect(lines[1]).toContain(`"'=HYPERLINK(""x"")"`);
    expect(lines[2]!.endsWith(',-3')).toBe(true);
  });

  it('answers 400 for a malformed id and 404 for an unknown sweep', async () => {
    expect((await request(ctx.app).get('/api/sweeps/abc').set(ctx.auth('admin'))).status).toBe(400);
    expect((await request(ctx.app).get('/api/sweeps/999999').set(ctx.auth('admin'))).status).toBe(
      404,
    );
  });
});
