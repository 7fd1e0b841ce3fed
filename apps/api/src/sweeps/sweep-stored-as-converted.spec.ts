import type { PointFlag } from '@rhotrace/api-types';
import { seededNormal, seededRandom } from '@rhotrace/physics';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lot } from '../lots/lot.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { SweepRows } from './import/check-rows';
import { markPoints } from './import/flag';
import type { ConvertedPoint } from './import/import-types';
import { planImport } from './import/plan-import';
import { openTable } from './import/read-table';
import { rawJson } from './import/store/sweep-store';
import { IMPORT_SLICE_ROWS } from './sweep-import.service';
import { makeWafer } from './sweep-test-helpers';

// The store writes points while the file is still being converted and rewrites the late flags
// of those already written. What it stores must be what converting the whole file, flagging it
// and writing every point once stores: that pipeline is run here in memory, stage by stage,
// and compared column by column with the stored rows.

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

/**
 * An invented ramp up, down and up again in dwell steps of 20 readings 1 K apart (about 12,000
 * rows, more than one slice), with faults placed on purpose: spikes (outliers, one a jump),
 * a thermometer dip (a reversal), a step still drifting (unsettled) and a step read at two
 * currents where the higher one reads high (self-heating).
 */
function faultyRamp(): string {
  const normal = seededNormal(seededRandom(20));
  const temps: number[] = [];
  for (let t = 300; t <= 500; t++) temps.push(t);
  for (let t = 499; t >= 300; t--) temps.push(t);
  for (let t = 301; t <= 500; t++) temps.push(t);
  const lines = ['T (K),I (mA),V (mV)'];
  temps.forEach((stepK, k) => {
    for (let r = 0; r < 20; r++) {
      const row = k * 20 + r;
      let t = stepK + 0.02 * normal();
      let currentMa = 1;
      let factor = 1 + 0.002 * normal();
      if (row === 31 || row === 5_013 || row === 11_007) factor *= 1.1;
      if (row === 7_777) factor *= 20;
      if (row === 2_405) t -= 2;
      if (k === 40) factor *= 1 + 0.001 * r;
      if (k === 333 && r % 2 === 1) {
        currentMa = 3;
        factor *= 1.03;
      }
      const voltageMv = 10 * currentMa * (t / 300) ** 1.5 * factor;
      lines.push(`${t.toFixed(3)},${currentMa},${voltageMv.toPrecision(7)}`);
    }
  });
  return `${lines.join('\n')}\n`;
}

/** The columns the import writes, as the database gives them back. */
interface StoredPoint {
  sequence: number;
  source_row: number;
  temperature_k: number;
  current_a: number | null;
  voltage_v: number | null;
  resistance_ohm: number | null;
  sheet_resistance_ohm_sq: number | null;
  resistivity_ohm_cm: number;
  raw: unknown;
  flags: string;
  quantities: unknown;
  leg: number;
}

const parseJson = (v: unknown) => (typeof v === 'string' ? (JSON.parse(v) as unknown) : v);

describe('a sweep stored while it is converted', () => {
  it('stores the points, flags and legs that converting, flagging and storing it whole gives', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const file = Buffer.from(faultyRamp());
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', file, 'faulty-ramp.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);

    // the pipeline before: every point converted, then the whole sweep flagged, then stored
    const opened = openTable(file, IMPORT_SLICE_ROWS);
    const lot = (await Lot.findByPk(wafer.lotId))!;
    const plan = await planImport(
      opened.parsed,
      { method: 'four-point', geometry: { spacingCm: 0.1 } },
      { wafer, lot },
    );
    const rows = new SweepRows(opened, plan, 'four-point', IMPORT_SLICE_ROWS);
    const points: ConvertedPoint[] = [];
    for (const slice of rows.points()) for (const p of slice) points.push(p);
    const summary = rows.finish();
    markPoints(points, summary);
    const rawOf = rawJson(opened.parsed);
    const expected = points.map((p, i) => ({
      sequence: i + 1,
      source_row: p.sourceRows[0],
      temperature_k: p.temperatureK,
      current_a: p.currentA,
      voltage_v: p.voltageV,
      resistance_ohm: p.resistanceOhm,
      sheet_resistance_ohm_sq: p.sheetResistanceOhmSq,
      resistivity_ohm_cm: p.resistivityOhmCm,
      raw: JSON.parse(rawOf(p)) as unknown,
      flags: p.flags.join(','),
      quantities: p.quantities ?? null,
      leg: p.leg ?? 1,
    }));

    // the file holds what the comparison is about: three legs, late flags early in the sweep
    expect(summary.legs.map((l) => l.direction)).toEqual(['up', 'down', 'up']);
    const flagsOf = (flag: PointFlag) =>
      points.flatMap((p, i) => (p.flags.includes(flag) ? [i] : []));
    for (const flag of [
      'outlier',
      'jump',
      'temperature-reversal',
      'unsettled',
      'self-heating',
    ] as const) {
      expect(flagsOf(flag).length, flag).toBeGreaterThan(0);
    }
    expect(flagsOf('outlier')[0]).toBeLessThan(100);

    const stored = await ctx.sequelize.query<StoredPoint>(
      'SELECT sequence, source_row, temperature_k, current_a, voltage_v, resistance_ohm, ' +
        'sheet_resistance_ohm_sq, resistivity_ohm_cm, raw, flags, quantities, leg ' +
        'FROM sweep_points WHERE sweep_id = ? ORDER BY sequence',
      { replacements: [res.body.id], type: QueryTypes.SELECT },
    );
    expect(stored).toHaveLength(expected.length);
    const actual = stored.map((s) => ({
      ...s,
      raw: parseJson(s.raw),
      quantities: parseJson(s.quantities),
    }));
    // compared point by point, so a difference names its sequence
    for (let i = 0; i < expected.length; i++)
      expect(actual[i], `point ${i + 1}`).toEqual(expected[i]);
    expect(res.body.pointCount).toBe(expected.length);
    expect(res.body.warnings).toEqual(summary.warnings);
  });
});
