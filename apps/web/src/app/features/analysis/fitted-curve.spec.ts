import { arrheniusFigure } from './arrhenius-window/arrhenius-figure';
import { fitTraceName, fittedCurve, fittedResistivity } from './fitted-curve';
import { curveFigure, residualFigure } from './sweep-study/study-plots';
import { previewOf, savedOf } from './testing/study-fakes';

// CODATA 2018 Boltzmann constant, eV/K (exact in SI 2019).
const K_EV = 8.617333262e-5;

interface Trace {
  name: string;
  x: number[];
  y: number[];
}

const arrhenius = savedOf(
  previewOf(
    { kind: 'arrhenius', minK: 450, maxK: 600 },
    {
      parameters: { activationEnergyEv: 0.6, intercept: -12 },
      inputs: { kind: 'arrhenius', quantity: 'resistivity', prefactorExponent: 0 },
      residuals: [
        { temperatureK: 450, residual: 0.01 },
        { temperatureK: 600, residual: -0.02 },
      ],
    },
  ),
  12,
);

const tcr = previewOf(
  { kind: 'tcr', referenceK: 293.15 },
  {
    windowMinK: null,
    windowMaxK: null,
    parameters: { referenceResistivityOhmCm: 1.68e-6, alphaPerK: 0.0039 },
    inputs: { kind: 'tcr', referenceK: 293.15 },
    residuals: [
      { temperatureK: 250, residual: 0.001 },
      { temperatureK: 400, residual: -0.001 },
    ],
  },
);

describe('fitted curves', () => {
  it('evaluate an Arrhenius fit as ln ρ = a + Ea / kT over its window', () => {
    const expected = Math.exp(-12 + 0.6 / (K_EV * 500));
    expect(fittedResistivity(arrhenius, 500)! / expected).toBeCloseTo(1, 10);
    const curve = fittedCurve(arrhenius);
    expect(curve[0]!.temperatureK).toBe(450);
    expect(curve.at(-1)!.temperatureK).toBe(600);
  });

  it('turn a conductivity fit into resistivity', () => {
    const sigma = { ...arrhenius, inputs: { ...arrhenius.inputs, quantity: 'conductivity' } };
    // ln σ = a - Ea / kT, so ρ = 1 / σ.
    const expected = 1 / Math.exp(-12 - 0.6 / (K_EV * 500));
    expect(fittedResistivity(sigma, 500)! / expected).toBeCloseTo(1, 10);
  });

  it('draw a TCR line through the copper table values over the readings fitted', () => {
    // Introductory physics tables: Cu 1.68e-8 ohm m and 0.0039 /K at 20 °C.
    expect(fittedResistivity(tcr, 393.15)! / (1.68e-6 * 1.39)).toBeCloseTo(1, 10);
    const curve = fittedCurve(tcr);
    expect(curve[0]!.temperatureK).toBe(250);
    expect(curve.at(-1)!.temperatureK).toBe(400);
  });

  it('are named as a fit with their window, in the page’s unit', () => {
    expect(fitTraceName(arrhenius, 'K')).toBe('Arrhenius fit, 450.0–600.0 K (fit 12)');
    expect(fitTraceName(arrhenius, 'C')).toBe('Arrhenius fit, 176.9–326.9 °C (fit 12)');
    expect(fitTraceName(tcr, 'K')).toBe('Linear TCR fit, 250.0–400.0 K (preview)');
  });

  it('appear on the ρ(T) plot and the residual plot as their own traces', () => {
    const options = {
      unit: 'K' as const,
      rangeK: { fromK: 200, toK: 650 },
      modelName: 'model',
      fits: [arrhenius, tcr],
    };
    const curve = curveFigure([], null, options).data as Trace[];
    const names = curve.map((t) => t.name);
    expect(names).toContain('Arrhenius fit, 450.0–600.0 K (fit 12)');
    expect(names).toContain('Linear TCR fit, 250.0–400.0 K (preview)');
    const line = curve.find((t) => t.name.startsWith('Arrhenius'))!;
    expect(line.y[0]! / Math.exp(-12 + 0.6 / (K_EV * 450))).toBeCloseTo(1, 10);

    const residuals = residualFigure([], null, options)!.data as Trace[];
    const r = residuals.find(
      (t) => t.name === 'residuals of Arrhenius fit, 450.0–600.0 K (fit 12)',
    );
    expect(r?.y).toEqual([0.01, -0.02]);
  });

  it('draw the window fit on the Arrhenius plot from its parameters', () => {
    const fig = arrheniusFigure([], 'resistivity', { minK: 450, maxK: 600 }, arrhenius, 'K');
    const line = (fig.data as Trace[]).find((t) => t.name.startsWith('Arrhenius fit'))!;
    expect(line.x[0]).toBeCloseTo(1000 / 450, 10);
    expect(line.y[0]).toBeCloseTo(-12 + 0.6 / (K_EV * 450), 10);
  });
});
