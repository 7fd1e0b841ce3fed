import type { HallAnalysisStep } from '@rhotrace/api-types';
import { flaggedCurveTrace } from '../sweep-faults/flagged-traces';
import { densityPlot, mobilityPlot, resistivityPlot } from './hall-traces';

const step = (temperatureK: number, n: number, mu: number): HallAnalysisStep => ({
  temperatureK,
  carrierDensityCm3: n,
  carrierDensitySpreadCm3: 0,
  hallMobilityCm2PerVs: mu,
  hallCoefficientCm3PerC: -1 / (1.602e-19 * n),
  carrierType: 'n',
  count: 1,
});
const steps = [step(50, 1e13, 2e4), step(100, 5e14, 9e3), step(200, 1e15, 2e3)];

describe('Hall plot traces', () => {
  it('draws the flagged readings on ρ(T) as their own trace, in kelvin, and none when none', () => {
    const rhoSteps = [300, 320].map((t) => ({
      temperatureK: t,
      resistivityOhmCm: t / 100,
      spreadOhmCm: 0,
      count: 1,
    }));
    const mark = { temperatureK: 310, resistivityOhmCm: 9, why: 'Point 4<br>Outlier: far off' };
    const flagged = flaggedCurveTrace([mark], 'K', false);
    const plot = resistivityPlot(rhoSteps, null, flagged);
    expect(plot.data).toHaveLength(2);
    expect(plot.data[1]).toMatchObject({ name: 'flagged (left out of fits)', x: [310], y: [9] });
    expect(resistivityPlot(rhoSteps, null, flaggedCurveTrace([], 'K', false)).data).toHaveLength(1);
  });

  it('draws n against 1000/T on a log axis and shades the window in 1000/T', () => {
    const plot = densityPlot(
      steps,
      { temperaturesK: [50, 200], densitiesCm3: [1.1e13, 1e15], label: 'model' },
      { minK: 50, maxK: 100 },
    );
    const measured = plot.data[0] as { x: number[] };
    expect(measured.x).toEqual([20, 10, 5]);
    expect(plot.layout.yaxis.type).toBe('log');
    expect(plot.layout.shapes[0]).toMatchObject({ x0: 10, x1: 20 });
    expect(plot.data).toHaveLength(2);
  });

  it('draws mu against T log-log, with the window in log10 units and no model when absent', () => {
    const plot = mobilityPlot(
      steps,
      { powerLaw: null, modelMobility: null },
      { minK: 100, maxK: 1000 },
    );
    expect(plot.layout.xaxis.type).toBe('log');
    expect(plot.layout.shapes[0]).toMatchObject({ x0: 2, x1: 3 });
    expect(plot.data).toHaveLength(1);
  });
});
