/**
 * Turning readings into points, method by method, against the textbook formulas:
 * - four-point probe, thin-sheet factor pi/ln 2 = 4.5324 (F. M. Smits, Bell Syst. Tech. J. 37,
 *   711 (1958));
 * - van der Pauw with R_A = R_B: R_s = pi R / ln 2 (L. J. van der Pauw, Philips Res. Rep. 13, 1
 *   (1958));
 * - bar: rho = (V/I) w t / L, and rho = R_s t (definitions of resistivity and sheet resistance).
 */
import { describe, expect, it } from 'vitest';
import type { RowProblem, SweepGeometry, SweepMethod } from '@rhotrace/api-types';
import { HttpError } from '../../errors';
import type { ResolvedColumn } from '../parse';
import type { Reading } from './import-types';
import { pointMaker } from './to-point';

const THIN_SHEET = Math.PI / Math.LN2;

const reading = (values: Partial<Reading>): Reading => ({
  record: 0,
  row: 2,
  temperatureK: 300,
  polarity: 0,
  voltageV: null,
  currentA: null,
  resistanceOhm: null,
  resistanceBOhm: null,
  sheetResistanceOhmSq: null,
  resistivityOhmCm: null,
  ...values,
});

const voltageColumn = { index: 1, header: 'V (mV)', meaning: 'voltage' } as ResolvedColumn;

function maker(method: SweepMethod, geometry: Omit<SweepGeometry, 'sources'>) {
  const problems: RowProblem[] = [];
  const make = pointMaker(method, { sources: {}, ...geometry }, [voltageColumn], problems);
  return { make, problems };
}

describe('turn a row into a point', () => {
  it('four-point: R_s = (pi/ln 2) V/I; rho = R_s t F(t/s)', () => {
    const { make } = maker('four-point', { spacingCm: 0.1, thicknessCm: 0.05 });
    const p = make({ forward: reading({ voltageV: 0.01, currentA: 0.001 }), flag: null })!;
    expect(p.sheetResistanceOhmSq).toBeCloseTo(THIN_SHEET * 10, 9);
    // Smits (1958) tabulates the thickness correction at t/s = 0.5 as about 0.997 (from memory).
    expect(p.resistivityOhmCm / (p.sheetResistanceOhmSq! * 0.05)).toBeCloseTo(0.997, 3);
    expect(p).toMatchObject({ sourceRows: [2], recordIndexes: [0], flags: [] });
  });

  it('averages a forward/reverse pair: V = (V+ - V-)/2 cancels a thermal EMF', () => {
    // common practice, no source: the EMF adds to both readings, the reversal cancels it
    const { make } = maker('four-point', { spacingCm: 0.1, thicknessCm: 0.05 });
    const emf = 0.0007;
    const p = make({
      forward: reading({
        row: 2,
        polarity: 1,
        voltageV: 0.01 + emf,
        currentA: 0.001,
        temperatureK: 300,
      }),
      reverse: reading({
        row: 3,
        record: 1,
        polarity: -1,
        voltageV: -0.01 + emf,
        currentA: -0.001,
        temperatureK: 301,
      }),
      flag: 'polarity-averaged',
    })!;
    expect(p.voltageV).toBeCloseTo(0.01, 12);
    expect(p.currentA).toBeCloseTo(0.001, 12);
    expect(p.sheetResistanceOhmSq).toBeCloseTo(THIN_SHEET * 10, 9);
    expect(p).toMatchObject({ sourceRows: [2, 3], recordIndexes: [0, 1], temperatureK: 300.5 });
    // an EMF of 0.7 mV on 10 mV makes the readings 14 % apart: flagged, kept averaged
    expect(p.flags).toEqual(['polarity-averaged', 'polarity-asymmetry']);
    expect(p.reasons?.['polarity-asymmetry']).toMatch(/differ by 14\.0 %/);
  });

  it('flags forward and reverse readings 5 % apart, not 1 % apart', () => {
    const { make } = maker('four-point', { spacingCm: 0.1, thicknessCm: 0.05 });
    const pair = (reverseV: number) =>
      make({
        forward: reading({ row: 2, polarity: 1, voltageV: 0.01, currentA: 0.001 }),
        reverse: reading({ row: 3, record: 1, polarity: -1, voltageV: reverseV, currentA: -0.001 }),
        flag: 'polarity-averaged',
      })!;
    expect(pair(-0.0095).flags).toContain('polarity-asymmetry');
    expect(pair(-0.0099).flags).not.toContain('polarity-asymmetry');
  });

  it('van der Pauw, symmetric sample: R_s = pi R / ln 2, rho = R_s t', () => {
    const { make } = maker('van-der-pauw', { thicknessCm: 0.05 });
    const p = make({ forward: reading({ resistanceOhm: 10, resistanceBOhm: 10 }), flag: null })!;
    expect(p.sheetResistanceOhmSq).toBeCloseTo(THIN_SHEET * 10, 9);
    expect(p.resistivityOhmCm).toBeCloseTo(THIN_SHEET * 10 * 0.05, 9);
  });

  it('bar, sheet resistance and resistivity files', () => {
    const bar = maker('bar', { barLengthCm: 1, barWidthCm: 0.1, thicknessCm: 0.05 }).make;
    expect(
      bar({ forward: reading({ voltageV: 0.01, currentA: 0.001 }), flag: null })!.resistivityOhmCm,
    ).toBeCloseTo((10 * 0.1 * 0.05) / 1, 12);
    const sheet = maker('sheet-resistance', { thicknessCm: 0.05 }).make;
    expect(sheet({ forward: reading({ sheetResistanceOhmSq: 100 }), flag: null })).toMatchObject({
      sheetResistanceOhmSq: 100,
      resistivityOhmCm: 5,
    });
    const rho = maker('resistivity', {}).make;
    expect(
      rho({ forward: reading({ resistivityOhmCm: 12.5 }), flag: null })!.resistivityOhmCm,
    ).toBe(12.5);
  });

  it('a diameter under three probe spacings refuses the whole upload as a 400 on geometry', () => {
    const { make } = maker('four-point', { spacingCm: 0.1, thicknessCm: 0.05, diameterCm: 0.2 });
    let error: unknown;
    try {
      make({ forward: reading({ voltageV: 0.01, currentA: 0.001 }), flag: null });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(HttpError);
    expect(error).toMatchObject({
      status: 400,
      message: 'The geometry does not fit the method',
      details: [
        {
          field: 'geometry',
          problem:
            'requires diameterCm of at least 3 probe spacings (0.30000000000000004 cm), got 0.2',
        },
      ],
    });
  });

  it('V and I of opposite signs, or an impossible ratio, are problems of that row', () => {
    const fp = maker('four-point', { spacingCm: 0.1, thicknessCm: 0.05 });
    expect(
      fp.make({ forward: reading({ voltageV: -0.01, currentA: 0.001 }), flag: null }),
    ).toBeNull();
    expect(fp.problems).toEqual([
      expect.objectContaining({
        row: 2,
        column: 'V (mV)',
        problem:
          'voltage and current have opposite signs (a negative resistance); check the wiring or the polarity column',
      }),
    ]);
    const vdp = maker('van-der-pauw', { thicknessCm: 0.05 });
    expect(
      vdp.make({ forward: reading({ resistanceOhm: 1e13, resistanceBOhm: 1 }), flag: null }),
    ).toBeNull();
    expect(vdp.problems[0]!.problem).toBe(
      'the resistivity cannot be computed: requires resistanceAOhm / resistanceBOhm between 1e-12 and 1e12, got 10000000000000',
    );
  });
});
