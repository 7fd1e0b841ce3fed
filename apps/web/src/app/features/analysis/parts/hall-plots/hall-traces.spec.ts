import type { HallAnalysisStep } from '@rhotrace/api-types';
import { densityPlot, mobilityPlot } from './hall-traces';

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
