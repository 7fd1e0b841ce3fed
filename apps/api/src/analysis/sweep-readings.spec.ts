import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Sweep } from '../sweeps/sweep.model';
import { makeLot, makeSweep } from './testing/fixtures';
import { sweepReadings } from './sweep-data.service';

describe('sweep readings (kept in memory once read)', () => {
  let ctx: TestContext;
  let sweep: Sweep;
  beforeAll(async () => {
    ctx = await createTestContext();
    const { wafers } = await makeLot({ material: 'Si' });
    // out of order on purpose, with two unusable readings (zero and negative resistivity)
    sweep = await makeSweep(wafers[0]!.id, ctx.users.engineer.id, [
      { temperatureK: 300, resistivityOhmCm: 3 },
      { temperatureK: 100, resistivityOhmCm: 1 },
      { temperatureK: 250, resistivityOhmCm: 0 },
      { temperatureK: 200, resistivityOhmCm: 2 },
      { temperatureK: 400, resistivityOhmCm: -4 },
      { temperatureK: 350, resistivityOhmCm: 3.5 },
    ]);
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('gives the usable readings sorted, and windows inclusive at both ends', async () => {
    const all = await sweepReadings(sweep);
    expect(all.points.map((p) => p.temperatureK)).toEqual([100, 200, 300, 350]);
    expect(all.skipped).toBe(2);
    const window = await sweepReadings(sweep, { minK: 200, maxK: 300 });
    expect(window.points).toEqual([
      { temperatureK: 200, resistivityOhmCm: 2 },
      { temperatureK: 300, resistivityOhmCm: 3 },
    ]);
    expect(window.skipped).toBe(1); // the zero at 250 K; the negative at 400 K is outside
    expect((await sweepReadings(sweep, { minK: 360, maxK: 500 })).points).toEqual([]);
    expect((await sweepReadings(sweep, { minK: 360, maxK: 500 })).skipped).toBe(1);
    expect((await sweepReadings(sweep, { minK: 101, maxK: 199 })).points).toEqual([]);
  });

  it('answers again from memory, and reads anew for another sweep under the same id', async () => {
    await ctx.sequelize.query('UPDATE sweep_points SET resistivity_ohm_cm = 9 WHERE sweep_id = ?', {
      replacements: [sweep.id],
    });
    // points never change after their upload: the copy in memory is still the right one
    expect((await sweepReadings(sweep)).points.map((p) => p.resistivityOhmCm)).toEqual([
      1, 2, 3, 3.5,
    ]);
    // callers may change what they get without touching the cached copy
    (await sweepReadings(sweep)).points.splice(0, 4);
    expect((await sweepReadings(sweep)).points).toHaveLength(4);
    // what a restore and a new upload can leave: the same id, another file
    await sweep.update({ sha256: 'e'.repeat(64) });
    const fresh = await sweepReadings(sweep);
    expect(fresh.points.map((p) => p.resistivityOhmCm)).toEqual([9, 9, 9, 9, 9, 9]);
    expect(fresh.skipped).toBe(0);
  });
});
