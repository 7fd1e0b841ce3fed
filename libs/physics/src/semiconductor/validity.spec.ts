import { describe, expect, it } from 'vitest';
import type { Doping } from './dopants';
import { carrierDensities } from './neutrality';
import { modelCurveWarnings } from './validity';

const n = (donorDensity: number): Doping => ({ donorDensity, acceptorDensity: 0, donor: 'P' });

describe('modelCurveWarnings (issue 13, defect 10)', () => {
  it('is silent inside the Arora range for light doping', () => {
    expect(modelCurveWarnings('Si', n(1e15), [200, 300, 500])).toEqual([]);
  });

  it('names the Arora fitted range when the curve leaves it', () => {
    // Arora, Hauser & Roulston 1982: fitted about 200-500 K.
    const w = modelCurveWarnings('Si', n(1e15), [20, 300, 800]);
    expect(w).toHaveLength(1);
    expect(w[0]).toMatch(/Arora.*200–500 K.*20 K to 800 K \(2 of 3/);
  });

  it('warns of near-degenerate doping where the library flags it', () => {
    // The flag of carrierDensities (Fermi level within 3 kT of a band edge) reaches the warning.
    expect(carrierDensities('Si', n(1e20), 300).nearDegenerate).toBe(true);
    const w = modelCurveWarnings('Si', n(1e20), [250, 300]);
    expect(w.some((s) => /250 K to 300 K.*near-degenerate/.test(s))).toBe(true);
  });

  it('warns where the level is merging with the band and the curve is cold', () => {
    // 1e18 P in Si lies between the merge onset (1.07e17) and the merge density (3.4e18):
    // the merged share stands in for impurity-band conduction (carrierDensities docs).
    const cold = modelCurveWarnings('Si', n(1e18), [20, 300]);
    expect(cold.some((s) => /merges with the band/.test(s))).toBe(true);
    expect(modelCurveWarnings('Si', n(1e18), [250, 300])).toEqual([]);
    expect(modelCurveWarnings('Si', n(1e16), [20]).some((s) => /merges/.test(s))).toBe(false);
  });

  it('warns for the 300 K Caughey–Thomas sets away from 300 K', () => {
    expect(modelCurveWarnings('GaAs', { donorDensity: 1e15, acceptorDensity: 0 }, [300])).toEqual(
      [],
    );
    const w = modelCurveWarnings('GaAs', { donorDensity: 1e15, acceptorDensity: 0 }, [77, 300]);
    expect(w[0]).toMatch(/Caughey–Thomas.*77 K/);
  });

  it('rejects bad input naming the function', () => {
    expect(() => modelCurveWarnings('Si', n(-1), [300])).toThrow(/`modelCurveWarnings`/);
    expect(() => modelCurveWarnings('Si', n(1e15), [0])).toThrow(/temperaturesK\[0\]/);
  });
});
