import type { SweepAnalysisResponse } from '@rhotrace/api-types';
import { analysisOf } from '../../testing/study-fakes';
import { flaggedArrheniusTrace, flaggedCurveTrace, flaggedMarks } from './flagged-traces';

describe('flagged readings on the study plots', () => {
  const analysis: SweepAnalysisResponse = {
    ...analysisOf(),
    flaggedReadings: [{ sequence: 15, temperatureK: 440, resistivityOhmCm: 2 }],
    findings: [
      { sequence: 15, row: 16, flag: 'outlier', reason: 'ln rho lies 9.1 scaled MAD off' },
      { sequence: 15, row: 16, flag: 'jump', reason: 'resistivity rises 11.0 times' },
    ],
  };

  it('draws them as a trace of their own, crossed, with every reason on hover', () => {
    const trace = flaggedCurveTrace(flaggedMarks(analysis), 'C', false)!;
    expect(trace['name']).toBe('flagged (left out of fits)');
    expect(trace['x']).toEqual([440 - 273.15]);
    expect(trace['y']).toEqual([2]);
    expect((trace['marker'] as { symbol: string }).symbol).toBe('x-thin-open');
    expect(trace['text']).toEqual([
      'Point 15 (row 16)<br>Outlier: ln rho lies 9.1 scaled MAD off<br>Jump: resistivity rises 11.0 times',
    ]);
  });

  it('places them at 1000/T and ln rho (or ln sigma) on the Arrhenius plot', () => {
    const rho = flaggedArrheniusTrace(flaggedMarks(analysis), 'resistivity', true)!;
    expect(rho['x']).toEqual([1000 / 440]);
    expect(rho['y']).toEqual([Math.log(2)]);
    expect(rho['name']).toBe('flagged (fitted on request)');
    const sigma = flaggedArrheniusTrace(flaggedMarks(analysis), 'conductivity', false)!;
    expect(sigma['y']).toEqual([-Math.log(2)]);
  });

  it('adds nothing when no reading is flagged', () => {
    expect(flaggedCurveTrace(flaggedMarks(analysisOf()), 'K', false)).toBeNull();
    expect(flaggedArrheniusTrace([], 'resistivity', false)).toBeNull();
  });
});
