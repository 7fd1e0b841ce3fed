import type { PointFlag, SweepParseReport } from '@rhotrace/api-types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seeder } from '../db/migrator';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Sweep, SweepPoint } from './sweep.model';

// Issue 15, done when: the fault finders flag nothing on the demo's sweeps, all invented clean
// (seeded noise of 0.2-0.5 % on rho, one reading per temperature). The map's sites near the edge
// carry `edge-exclusion`, which says where a site is, not that it is doubtful.
const FAULTS: readonly PointFlag[] = [
  'jump',
  'temperature-reversal',
  'outlier',
  'polarity-asymmetry',
  'self-heating',
  'unsettled',
  'contact-fault',
];

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
  await seeder(ctx.sequelize).up();
});
afterAll(async () => {
  await ctx.close();
});

describe('the seeded demo', () => {
  it('stores every demo sweep without a fault flag, finding or warning', async () => {
    const sweeps = await Sweep.findAll({ order: [['id', 'ASC']] });
    expect(sweeps).toHaveLength(6);
    for (const sweep of sweeps) {
      const points = await SweepPoint.findAll({ where: { sweepId: sweep.id }, raw: true });
      const flags = points.flatMap((p) => (p.flags ? String(p.flags).split(',') : []));
      const faults = flags.filter((f) => FAULTS.includes(f as PointFlag));
      const report = sweep.parseReport as SweepParseReport;
      expect(faults, sweep.originalName).toEqual([]);
      expect(report.findings ?? [], sweep.originalName).toEqual([]);
      expect(report.flaggedPoints, sweep.originalName).toBe(0);
      // no warning at all: neither a fault finder's nor a reading outside the station's range
      expect(report.warnings, sweep.originalName).toEqual([]);
      expect(new Set(points.map((p) => p.leg)), sweep.originalName).toEqual(new Set([1]));
    }
  });
});
