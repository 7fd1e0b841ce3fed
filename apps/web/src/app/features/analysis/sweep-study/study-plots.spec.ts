import type { AnalysisStep, ModelCurveResponse } from '@rhotrace/api-types';
import { MAX_POINTS_PER_TRACE, thinForDisplay } from '../../../shared/plot/decimate';
import { arrheniusFigure } from '../arrhenius-window/arrhenius-figure';
import { curveFigure, plotRangeK, residualFigure } from './study-plots';

const steps = (fromK: number, toK: number, n: number): AnalysisStep[] =>
  Array.from({ length: n }, (_, i) => {
    const t = fromK + ((toK - fromK) * i) / (n - 1);
    return { temperatureK: t, resistivityOhmCm: 1 + t / 100, spreadOhmCm: 0.01, count: 1 };
  });

const model = (
  fromK: number,
  toK: number,
  freezeOutBelowK: number | null,
  intrinsicAboveK: number | null,
) =>
  ({
    kind: 'semiconductor',
    material: 'Si',
    points: [fromK, toK].map((t) => ({ temperatureK: t, resistivityOhmCm: 1 + t / 100 })),
    boundaries: { freezeOutBelowK, intrinsicAboveK },
    modelVersion: 'test',
  }) as ModelCurveResponse;

describe('study plots', () => {
  it('follow the sweep’s range with a small margin, and draw only boundaries inside it', () => {
    const range = plotRangeK(298, 698);
    expect(range.fromK).toBeCloseTo(298 - 16, 6);
    expect(range.toK).toBeCloseTo(698 + 16, 6);
    const fig = curveFigure(steps(298, 698, 81), model(282, 714, 100, 565), {
      unit: 'K',
      rangeK: range,
      modelName: 'model',
    });
    const xaxis = fig.layout['xaxis'] as { range: number[]; title: { text: string } };
    expect(xaxis.range).toEqual([range.fromK, range.toK]);
    expect(xaxis.title.text).toBe('Temperature (K)');
    const shapes = fig.layout['shapes'] as Array<{ x0: number }>;
    expect(shapes.map((s) => s.x0)).toEqual([565]); // the 100 K freeze-out line would stretch the axis
    const yaxis = fig.layout['yaxis'] as { type: string; title: { text: string }; range: number[] };
    expect(yaxis.type).toBe('log');
    expect(yaxis.title.text).toBe('Resistivity (Ω·cm)');
    // log10 of 3.98 and 7.98 Ω·cm, widened by a factor of 3
    expect(yaxis.range[0]).toBeCloseTo(Math.log10(3.98 / 3), 6);
    expect(yaxis.range[1]).toBeCloseTo(Math.log10(7.98 * 3), 6);
  });

  it('in °C shift every axis value by 273.15 and name the unit', () => {
    const range = plotRangeK(300, 400);
    // ρ = exp(T / 100): the model is interpolated in ln ρ, so two points reproduce it exactly.
    const measured = steps(300, 400, 11).map((s) => ({
      ...s,
      resistivityOhmCm: Math.exp(s.temperatureK / 100),
    }));
    const curve = model(290, 410, null, null);
    for (const p of curve.points) p.resistivityOhmCm = Math.exp(p.temperatureK / 100);
    const fig = residualFigure(measured, curve, { unit: 'C', rangeK: range, modelName: 'model' });
    const xaxis = fig!.layout['xaxis'] as { range: number[]; title: { text: string } };
    expect(xaxis.title.text).toBe('Temperature (°C)');
    expect(xaxis.range[0]).toBeCloseTo(range.fromK - 273.15, 9);
    const trace = fig!.data[0] as { x: number[]; y: number[] };
    expect(trace.x[0]).toBeCloseTo(300 - 273.15, 9);
    expect(trace.y[0]).toBeCloseTo(0, 9); // measured equals the model here
  });

  it('label the Arrhenius axis 1000/T in 1/K and never use WebGL traces', () => {
    const points = Array.from({ length: 5000 }, (_, i) => ({
      inverseTemperaturePerKK: 1 + i / 1000,
      lnResistivity: i / 100,
      lnConductivity: -i / 100,
    }));
    const fig = arrheniusFigure(points, 'resistivity', null, null);
    expect((fig.layout['xaxis'] as { title: { text: string } }).title.text).toBe('1000 / T (1/K)');
    const trace = fig.data[0] as { type: string; x: number[] };
    expect(trace.type).toBe('scatter');
    expect(trace.x.length).toBeLessThanOrEqual(MAX_POINTS_PER_TRACE);
    const big = curveFigure(steps(250, 450, 10_000), null, {
      unit: 'K',
      rangeK: plotRangeK(250, 450),
      modelName: 'model',
    });
    expect((big.data[0] as { type: string }).type).toBe('scatter');
    expect((big.data[0] as { name: string }).name).toMatch(/5000 of 10000 steps shown/);
    // Under the plot: how it was thinned (the plot's own words), and that the numbers use
    // every step.
    expect(big.caption).toMatch(/measured steps: 10,000 points drawn as 5,000\): the lowest/);
    expect(big.caption).toContain('Fits, tables and exports use every point.');
    const small = curveFigure(steps(250, 450, 50), null, {
      unit: 'K',
      rangeK: plotRangeK(250, 450),
      modelName: 'model',
    });
    expect(small.caption).toBe('');
  });

  it('thinning keeps each column’s extremes in order', () => {
    const values = Array.from({ length: 3000 }, (_, i) => (i === 1234 ? 99 : Math.sin(i / 50)));
    const items = values.map((v, i) => ({ i, v }));
    const { shown, thinning } = thinForDisplay(
      items,
      (p) => p.i,
      (p) => p.v,
      'series',
      300,
    );
    expect(shown.length).toBeLessThanOrEqual(300);
    expect(shown.map((p) => p.v)).toContain(99); // an outlier survives
    expect(Math.min(...shown.map((p) => p.v))).toBe(Math.min(...values));
    expect(shown.map((p) => p.i)).toEqual([...shown.map((p) => p.i)].sort((a, b) => a - b));
    expect(thinning).toEqual({ name: 'series', from: 3000, to: shown.length, columns: 150 });
    expect(
      thinForDisplay(
        [1, 2, 3],
        (v) => v,
        (v) => v,
        'series',
        300,
      ),
    ).toEqual({
      shown: [1, 2, 3],
      thinning: null,
    });
  });
});
