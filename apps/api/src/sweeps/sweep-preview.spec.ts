/**
 * The preview runs the store's checks: each file the store would refuse is marked blocking in
 * the preview, with the same problem, and what the store would warn about is shown first.
 */
import type { RowProblem, SweepPreviewResponse } from '@rhotrace/api-types';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lot } from '../lots/lot.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeStation, makeWafer } from './sweep-test-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const VI = 'T (K),V (mV),I (mA)\n300,1.20,1\n310,1.25,1\n320,1.31,1\n';

/** Posts `file` with `fields` to the preview or the store. */
function send(path: 'preview' | 'store', waferId: number, file: string, fields = {}) {
  const url = `/api/wafers/${waferId}/sweeps${path === 'preview' ? '/preview' : ''}`;
  let req = request(ctx.app).post(url).set(ctx.auth('engineer'));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  return req.attach('file', Buffer.from(file), 'sweep.csv');
}

/** The preview's blocking problems, then the store's answer, for one file and one choice. */
async function both(waferId: number, file: string, fields: Record<string, unknown>) {
  const chosen = { method: 'four-point', ...fields };
  const preview = await send('preview', waferId, file, chosen);
  expect(preview.status, JSON.stringify(preview.body)).toBe(200);
  const store = await send('store', waferId, file, chosen);
  return { preview: preview.body as SweepPreviewResponse, store };
}

const words = (problems: Array<Pick<RowProblem, 'problem'>>) => problems.map((p) => p.problem);

describe('the preview blocks what the store refuses, in the same words', () => {
  it('text in a number column', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const file = VI.replace('1.25', 'n/a');
    const { preview, store } = await both(wafer.id, file, { stationId: station.id });
    expect(preview.blocking).toEqual([
      expect.objectContaining({ row: 3, column: 'V (mV)', problem: '"n/a" is not a number' }),
    ]);
    expect(preview.pointCount).toBeNull();
    expect(store.status).toBe(422);
    expect(words(store.body.error.details)).toEqual(words(preview.blocking));
  });

  it('no temperature column', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const file = 'V (mV),I (mA)\n1.20,1\n1.25,1\n';
    const { preview, store } = await both(wafer.id, file, { stationId: station.id });
    expect(words(preview.blocking)).toContain(
      'a four-point sweep needs a temperature column; none was found or mapped',
    );
    expect(store.status).toBe(400);
    expect(words(store.body.error.details)).toEqual(words(preview.blocking));
  });

  it('a station or geometry the method needs is missing, until it is given', async () => {
    const wafer = await makeWafer();
    const { preview, store } = await both(wafer.id, VI, {});
    expect(preview.blocking.map((p) => p.field)).toEqual(['thicknessCm', 'spacingCm']);
    expect(store.status).toBe(400);
    expect(words(store.body.error.details)).toEqual(words(preview.blocking));

    // corrected in place: the same file with the missing values passes both
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const fixed = { stationId: station.id, thicknessCm: 0.05 };
    const again = await both(wafer.id, VI, fixed);
    expect(again.preview.blocking).toEqual([]);
    expect(again.preview.pointCount).toBe(3);
    expect(again.preview.stationId).toBe(station.id);
    expect(again.preview.geometry?.sources).toEqual({
      thicknessCm: 'request',
      spacingCm: 'station',
    });
    expect(again.store.status).toBe(201);
    expect(again.store.body.pointCount).toBe(again.preview.pointCount);
    // and once stored, the preview says so instead of "ready"
    const after = await send('preview', wafer.id, VI, fixed);
    expect(words(after.body.blocking)[0]).toMatch(/already uploaded to this wafer as sweep/);
  });

  it('a method the columns cannot serve', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const preview = await send('preview', wafer.id, VI, { method: 'van-der-pauw' });
    expect(preview.body.method).toBe('van-der-pauw');
    expect(words(preview.body.blocking)).toEqual([
      'a van-der-pauw sweep needs a resistance column; none was found or mapped',
      'a van-der-pauw sweep needs a resistance-b column; none was found or mapped',
    ]);
    const store = await send('store', wafer.id, VI, { method: 'van-der-pauw' });
    expect(store.status).toBe(400);
    expect(words(store.body.error.details)).toEqual(words(preview.body.blocking));
  });

  it('a map site outside the wafer, naming its row and column', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 15 });
    const file = 'x (mm),y (mm),T (K),rho (ohm cm)\n0,0,296,10\n60,60,296,12\n';
    const { preview, store } = await both(wafer.id, file, { method: 'resistivity' });
    expect(preview.blocking).toEqual([
      expect.objectContaining({
        row: 3,
        column: 'x (mm)',
        problem: expect.stringMatching(/outside the wafer \(radius 75 mm\)/),
      }),
    ]);
    expect(preview.pointCount).toBeNull();
    expect(store.status).toBe(422);
    expect(words(store.body.error.details)).toEqual(words(preview.blocking));
  });

  it('numbered map sites without their pattern, until it is given', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 10 });
    const file = 'site,T (K),rho (ohm cm)\n1,296,10\n5,296,11\n';
    const { preview, store } = await both(wafer.id, file, { method: 'resistivity' });
    expect(preview.blocking.map((p) => p.field)).toEqual(['sitePattern']);
    expect(store.status).toBe(400);
    expect(words(store.body.error.details)).toEqual(words(preview.blocking));

    const chosen = { method: 'resistivity', sitePattern: 'centre-5', edgeExclusionMm: 3 };
    const again = await both(wafer.id, file, chosen);
    expect(again.preview.blocking).toEqual([]);
    expect(again.preview.pointCount).toBe(2);
    expect(again.store.status, JSON.stringify(again.store.body)).toBe(201);
    const map = await request(ctx.app)
      .get(`/api/sweeps/${again.store.body.id}/map`)
      .set(ctx.auth('engineer'));
    expect(map.body.map).toEqual(
      expect.objectContaining({ diameterMm: 100, edgeExclusionMm: 3, pattern: 'centre-5' }),
    );
  });

  it('a reading at or below 0 K', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const file = VI.replace('310,', '-5,');
    const { preview, store } = await both(wafer.id, file, { stationId: station.id });
    expect(preview.blocking).toEqual([
      expect.objectContaining({
        row: 3,
        column: 'T (K)',
        problem: 'the temperature is at or below 0 K (-5 K)',
      }),
    ]);
    expect(store.status).toBe(422);
  });
});

describe('the station range', () => {
  it('warns before storing (and in the stored report) about points outside it, and stores them', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({
      probeSpacingCm: 0.1,
      minTemperatureK: 290,
      maxTemperatureK: 720,
    });
    const file = VI.replace('300,', '80,').replace('310,', '85,');
    const { preview, store } = await both(wafer.id, file, { stationId: station.id });
    const warning =
      `2 point(s) at 80 K to 85 K lie outside the 290 K to 720 K that station ` +
      `"${station.name}" spans (rows 2, 3): check that the right station is chosen`;
    expect(preview.blocking).toEqual([]);
    expect(preview.warnings).toContain(warning);
    expect(store.status).toBe(201);
    expect(store.body.warnings).toContain(warning);
    expect(store.body.pointCount).toBe(3);
  });
});

describe("the file's metadata lines", () => {
  const withHeader = (sample: string) => `Sample: ${sample}\nThickness: 380 um\n${VI}`;

  it('fill a value the records lack, and say so', async () => {
    const wafer = await makeWafer();
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const preview = await send('preview', wafer.id, withHeader(wafer.number), {
      stationId: station.id,
    });
    expect(preview.body.blocking).toEqual([]);
    expect(preview.body.geometry.thicknessCm).toBeCloseTo(0.038, 12);
    expect(preview.body.geometry.sources.thicknessCm).toBe('file');
    expect(preview.body.metadataFindings).toEqual([
      expect.objectContaining({ key: 'thicknessCm', agreement: 'fills', fileText: '380 µm' }),
    ]);
  });

  it('that disagree with the records are shown before storing, and the user chooses', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.0525 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const file = withHeader('DEMO-W99');
    const preview = await send('preview', wafer.id, file, { stationId: station.id });
    expect(preview.body.blocking).toEqual([]);
    expect(preview.body.geometry.thicknessCm).toBe(0.0525);
    const [sample, thickness] = preview.body
      .metadataFindings as SweepPreviewResponse['metadataFindings'];
    expect(sample).toMatchObject({
      key: 'sampleName',
      agreement: 'disagrees',
      fileText: 'DEMO-W99',
    });
    expect(thickness).toMatchObject({
      key: 'thicknessCm',
      agreement: 'disagrees',
      fileText: '380 µm',
      recordText: '525 µm on the wafer',
      field: 'thicknessCm',
      using: 'record',
    });

    // the user takes the file's value: the preview and the store convert with it
    const chosen = { stationId: station.id, thicknessCm: thickness!.fileValue };
    const again = await send('preview', wafer.id, file, chosen);
    expect(again.body.geometry.thicknessCm).toBeCloseTo(0.038, 12);
    expect(again.body.metadataFindings[1].using).toBe('file');
    const stored = await send('store', wafer.id, file, { method: 'four-point', ...chosen });
    expect(stored.status).toBe(201);
    const lot = await Lot.findByPk(wafer.lotId);
    expect(stored.body.warnings).toEqual([
      `the file names sample "DEMO-W99" but was stored on wafer ${wafer.number} of lot ${lot!.code}`,
      "the file's header gives thickness 380 µm, the record 525 µm on the wafer; the file's value was used",
    ]);
  });
});

describe('the separator and decimal mark', () => {
  const SEMI = 'T (K);R (ohm)\n300;1,25\n310;1,31\n';

  it('are detected, and a corrected one is what the preview and the store read with', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1 });
    const chosen = { method: 'four-point', stationId: station.id };
    const detected = await send('preview', wafer.id, SEMI, chosen);
    expect([detected.body.delimiter, detected.body.decimalMark]).toEqual([';', ',']);
    expect(detected.body.pointCount).toBe(2);

    const point = await send('preview', wafer.id, SEMI, { ...chosen, decimalMark: '.' });
    expect(point.body.decimalMark).toBe('.');
    expect(point.body.blocking[0]).toMatchObject({ row: 2, problem: '"1,25" is not a number' });
    const refused = await send('store', wafer.id, SEMI, { ...chosen, decimalMark: '.' });
    expect(refused.status).toBe(422);

    const both = await send('preview', wafer.id, SEMI, { delimiter: ',', decimalMark: ',' });
    expect(both.status).toBe(400);
    expect(both.body.error.message).toMatch(/cannot separate both/);
  });
});

describe('a station past its calibration interval', () => {
  it('is marked on the stations list and warned about before and at storing', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const station = await makeStation({ probeSpacingCm: 0.1, calibratedOn: '2020-01-15' });
    const listed = await request(ctx.app)
      .get(`/api/stations/${station.id}`)
      .set(ctx.auth('technician'));
    expect(listed.body).toMatchObject({ calibrationDueOn: '2021-01-15', calibrationOverdue: true });
    const { preview, store } = await both(wafer.id, VI, { stationId: station.id });
    const warning =
      `station "${station.name}" was last calibrated on 2020-01-15; the lab's 12-month ` +
      'interval ended on 2021-01-15: treat its readings with care';
    expect(preview.blocking).toEqual([]);
    expect(preview.warnings).toContain(warning);
    expect(store.status).toBe(201);
    expect(store.body.warnings).toContain(warning);
  });
});
