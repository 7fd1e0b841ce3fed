import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { IMPORT_SLICE_ROWS } from './sweep-import.service';
import { makeWafer } from './sweep-test-helpers';

/**
 * The import converts and stores a file slice by slice (IMPORT_SLICE_ROWS records at a time).
 * A file of two slices and a bit must come out exactly as the rules say whatever the slicing:
 * a forward/reverse pair split by the slice boundary is still one point, flags that need the
 * previous point or the whole ramp are right on both sides, and a bad row in a later slice,
 * found after earlier slices were written, still leaves nothing stored.
 */
const PAIRS = IMPORT_SLICE_ROWS; // 1 lone reading + 2 × PAIRS rows: the pair at 9,999/10,000 straddles
const HEADER_LINES = 2; // a comment line, then the header

function pairFile(options: { badRecord?: number; shortRecords?: number[] } = {}): Buffer {
  const lines = [
    `# slice test ${process.pid}-${Date.now()}`,
    'temperature_K,current_A,voltage_V,polarity',
  ];
  const reading = (t: number, sign: 1 | -1, scale = 1) =>
    `${t.toFixed(3)},${(sign * 1e-3).toExponential(3)},${(sign * 0.0123 * scale).toExponential(5)},${sign > 0 ? '+' : '-'}`;
  lines.push(reading(80, 1)); // record 0: a forward reading whose neighbour is forward too
  for (let k = 0; k < PAIRS; k++) {
    // point k+1 is the pair of records 2k+1 and 2k+2
    let t = 80 + 0.01 * (k + 1);
    if (k === 3000 || k === 7000) t -= 1; // against the ramp, once per slice
    const scale = k === 6000 ? 20 : 1; // a jump up and back down, in the second slice
    lines.push(reading(t, 1, scale), reading(t, -1, scale));
  }
  if (options.badRecord !== undefined) {
    lines[HEADER_LINES + options.badRecord] = '112.5,1.000e-3,OVERLOAD,+';
  }
  for (const r of options.shortRecords ?? []) lines[HEADER_LINES + r] = '112.5,1.000e-3';
  return Buffer.from(`${lines.join('\n')}\n`);
}

describe('importing a file larger than one slice', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  const upload = (waferId: number, file: Buffer) =>
    request(ctx.app)
      .post(`/api/wafers/${waferId}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', file, 'slices.csv');

  it('pairs across the slice boundary and flags on both sides as one pass would', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await upload(wafer.id, pairFile());
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.pointCount).toBe(PAIRS + 1);
    const [rows] = (await ctx.sequelize.query(
      'SELECT sequence, source_row AS sourceRow, temperature_k AS t, flags FROM sweep_points WHERE sweep_id = ? ORDER BY sequence',
      { replacements: [res.body.id] },
    )) as [Array<{ sequence: number; sourceRow: number; t: number; flags: string }>, unknown];
    expect(rows).toHaveLength(PAIRS + 1);
    expect(rows.map((r) => r.sequence)).toEqual(rows.map((_, i) => i + 1));
    const flagsAt = (sequence: number) => rows[sequence - 1]!.flags;
    expect(flagsAt(1)).toBe('unpaired-polarity');
    // the pair of records 9,999 and 10,000 (file lines 10,002 and 10,003) is point 5,001
    expect(rows[5000]).toMatchObject({
      sourceRow: 9999 + HEADER_LINES + 1,
      flags: 'polarity-averaged',
    });
    expect(rows[5000]!.t).toBeCloseTo(80 + 0.01 * 5000, 9);
    // the jump up is also a Hampel outlier; the jump back down is a return to the trend
    expect(flagsAt(6002)).toBe('polarity-averaged,jump,outlier');
    expect(flagsAt(6003)).toBe('polarity-averaged,jump');
    expect(flagsAt(3002)).toBe('polarity-averaged,temperature-reversal');
    expect(flagsAt(7002)).toBe('polarity-averaged,temperature-reversal');
    const flagged = rows.filter((r) => /jump|temperature-reversal/.test(r.flags));
    expect(flagged.map((r) => r.sequence)).toEqual([3002, 6002, 6003, 7002]);
    expect(rows.filter((r) => r.flags === 'polarity-averaged')).toHaveLength(PAIRS - 4);

    const sweep = await request(ctx.app)
      .get(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'));
    expect(sweep.body[0]).toMatchObject({
      id: res.body.id,
      pointCount: PAIRS + 1,
      minTemperatureK: 80,
    });
    expect(sweep.body[0].maxTemperatureK).toBeCloseTo(80 + 0.01 * PAIRS, 9);
    const [report] = (await ctx.sequelize.query(
      'SELECT parse_report AS report FROM sweeps WHERE id = ?',
      { replacements: [res.body.id] },
    )) as [Array<{ report: string | { flaggedPoints: number; rowCount: number } }>, unknown];
    const parseReport =
      typeof report[0]!.report === 'string' ? JSON.parse(report[0]!.report) : report[0]!.report;
    expect(parseReport).toMatchObject({ flaggedPoints: 4, rowCount: 2 * PAIRS + 1 });
    expect(res.body.warnings).toEqual([
      expect.stringMatching(
        /^1 reading\(s\) with a polarity but no opposite-polarity partner .*rows 3\)/,
      ),
      expect.stringMatching(/^2 point\(s\) differ from the previous one .*rows 12004, 12006\)/),
      expect.stringMatching(
        /^the temperature goes against the ramp at 2 point\(s\) \(rows 6004, 14004\)/,
      ),
      expect.stringMatching(/^1 point\(s\) lie outside a Hampel filter .*\(rows 12004\)/),
    ]);
  });

  it('stores nothing when a row of a later slice cannot be read', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const count = async (table: string) =>
      Number(
        (
          (await ctx.sequelize.query(`SELECT COUNT(*) AS n FROM ${table}`)) as [
            Array<{ n: number }>,
            unknown,
          ]
        )[0][0]!.n,
      );
    const before = { sweeps: await count('sweeps'), points: await count('sweep_points') };
    const res = await upload(wafer.id, pairFile({ badRecord: 15_001 }));
    expect(res.status).toBe(422);
    expect(res.body.error.details).toEqual([
      expect.objectContaining({
        row: 15_001 + HEADER_LINES + 1,
        column: 'voltage_V',
        problem: '"OVERLOAD" is not a number',
      }),
    ]);
    expect({ sweeps: await count('sweeps'), points: await count('sweep_points') }).toEqual(before);
    // rows of the wrong width, read only after the first slices were stored, are named too
    const short = await upload(wafer.id, pairFile({ shortRecords: [12_000, 19_999] }));
    expect(short.status).toBe(422);
    expect(short.body.error.message).toBe('Some rows cannot be read; nothing was stored');
    expect(short.body.error.details.map((d: { row: number }) => d.row)).toEqual([
      12_000 + HEADER_LINES + 1,
      19_999 + HEADER_LINES + 1,
    ]);
    expect({ sweeps: await count('sweeps'), points: await count('sweep_points') }).toEqual(before);
    // and the same file without the bad row goes in afterwards
    expect((await upload(wafer.id, pairFile())).status).toBe(201);
  });
});
