/**
 * Plot traces of a Hall sweep: rho(T), n against 1000/T and mu_H against T, with the model
 * curves and the fit window. Pure functions, so the plots' content is testable without plotly.
 */
import type { AnalysisStep, HallAnalysisStep } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../../shared/plot/palette';

/** Temperatures labelled on the log axis, K (plotly's minor labels crowd a narrow plot). */
const LOG_TICKS_K = [2, 5, 10, 20, 50, 100, 200, 500, 1000, 2000];

/** A curve as (x, y) columns. */
export interface Curve {
  x: number[];
  y: number[];
}

/** What the three plots draw besides the measured steps. */
export interface HallModels {
  /** Neutrality n(T) of the fitted or entered doping, over T (K). */
  density: { temperaturesK: number[]; densitiesCm3: number[]; label: string } | null;
  /** The fitted power law over its window. */
  powerLaw: { temperaturesK: number[]; mobilities: number[]; label: string } | null;
  /** The model's drift mobility for the doping, over T. */
  modelMobility: { temperaturesK: number[]; mobilities: number[]; label: string } | null;
}

const markers = (name: string, curve: Curve) => ({
  type: 'scatter',
  mode: 'markers',
  name,
  x: curve.x,
  y: curve.y,
  marker: { color: PLOT_ROLES.measured, size: 6 },
});
const line = (name: string, curve: Curve, color: string, dash = 'solid') => ({
  type: 'scatter',
  mode: 'lines',
  name,
  x: curve.x,
  y: curve.y,
  line: { color, width: 2.2, dash },
});

/** A shaded x range (the fit window) on a plot whose x is `toX(T)`. */
function windowShape(window: { minK: number; maxK: number } | null, toX: (t: number) => number) {
  if (!window) return [];
  const a = toX(window.minK);
  const b = toX(window.maxK);
  return [
    {
      type: 'rect',
      xref: 'x',
      yref: 'paper',
      x0: Math.min(a, b),
      x1: Math.max(a, b),
      y0: 0,
      y1: 1,
      fillcolor: PLOT_ROLES.window,
      opacity: 0.15,
      line: { width: 0 },
    },
  ];
}

/** rho(T), log y, with the flagged readings' own trace when there are any. */
export function resistivityPlot(
  steps: readonly AnalysisStep[],
  window: { minK: number; maxK: number } | null,
  flagged: Record<string, unknown> | null = null,
) {
  const measured = markers('Measured ρ', {
    x: steps.map((s) => s.temperatureK),
    y: steps.map((s) => s.resistivityOhmCm),
  });
  return {
    data: flagged ? [measured, flagged] : [measured],
    layout: {
      xaxis: { title: { text: 'Temperature (K)' } },
      yaxis: { title: { text: 'ρ (Ω·cm)' }, type: 'log', exponentformat: 'power' },
      shapes: windowShape(window, (t) => t),
    },
  };
}

/** n against 1000/T, log y, with the neutrality model. */
export function densityPlot(
  steps: readonly HallAnalysisStep[],
  model: HallModels['density'],
  window: { minK: number; maxK: number } | null,
) {
  const inv = (t: number) => 1000 / t;
  const data: unknown[] = [
    markers('Measured n (Hall)', {
      x: steps.map((s) => inv(s.temperatureK)),
      y: steps.map((s) => s.carrierDensityCm3),
    }),
  ];
  if (model) {
    data.push(
      line(
        model.label,
        { x: model.temperaturesK.map(inv), y: model.densitiesCm3 },
        PLOT_ROLES.model,
      ),
    );
  }
  return {
    data,
    layout: {
      xaxis: { title: { text: '1000 / T (1/K)' } },
      legend: { orientation: 'h', y: -0.28 },
      yaxis: { title: { text: 'Carrier density (cm⁻³)' }, type: 'log', exponentformat: 'power' },
      shapes: windowShape(window, inv),
    },
  };
}

/** mu_H against T, log-log, with the fitted power law and the model mobility. */
export function mobilityPlot(
  steps: readonly HallAnalysisStep[],
  models: Pick<HallModels, 'powerLaw' | 'modelMobility'>,
  window: { minK: number; maxK: number } | null,
) {
  const data: unknown[] = [
    markers('Measured µ_H', {
      x: steps.map((s) => s.temperatureK),
      y: steps.map((s) => s.hallMobilityCm2PerVs),
    }),
  ];
  if (models.powerLaw) {
    const p = models.powerLaw;
    data.push(line(p.label, { x: p.temperaturesK, y: p.mobilities }, PLOT_ROLES.fit));
  }
  if (models.modelMobility) {
    const m = models.modelMobility;
    data.push(line(m.label, { x: m.temperaturesK, y: m.mobilities }, PLOT_ROLES.model, 'dash'));
  }
  return {
    data,
    layout: {
      xaxis: { title: { text: 'Temperature (K)' }, type: 'log', tickvals: LOG_TICKS_K },
      legend: { orientation: 'h', y: -0.32 },
      yaxis: { title: { text: 'Hall mobility (cm²/(V s))' }, type: 'log', exponentformat: 'power' },
      // On a log axis plotly takes the shape's x in log10 units.
      shapes: windowShape(window, (t) => Math.log10(t)),
    },
  };
}
