import { describe, expect, it } from 'vitest';
import { demoSweeps } from '../../../../../seed-data/demo-sweeps';
import { parseSweepFile } from '../parse';
import { RowConverter } from './convert-rows';
import { SuspiciousPointFinder } from './flag';

// Issue 15: the fault finders flag nothing on the demo's clean sweeps (invented, seeded noise of
// 0.2–0.5 % on rho and 0.05 K on T, one reading per temperature).
describe('the demo sweeps are clean', () => {
  for (const demo of demoSweeps()) {
    it(`${demo.fileName}: one leg, no flag`, () => {
      const parsed = parseSweepFile(demo.file);
      const geometry = {
        sources: {},
        spacingCm: demo.spacingCm,
        thicknessCm: demo.thicknessCm,
        diameterCm: demo.diameterCm,
      };
      const rows = new RowConverter(parsed, parsed.columns, 'four-point', geometry);
      const finder = new SuspiciousPointFinder();
      const points = rows.next({ start: 0, end: parsed.table.records.length, more: false });
      finder.addAll([...points, ...rows.finish()]);
      const summary = finder.finish();
      expect(rows.problems).toEqual([]);
      expect(summary.findings).toEqual([]);
      expect(summary.warnings).toEqual([]);
      expect(summary.legs).toHaveLength(1);
    });
  }
});
