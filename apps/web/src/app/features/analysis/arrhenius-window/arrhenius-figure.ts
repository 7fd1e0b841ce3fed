import type { ArrheniusPoint, FitPreviewDto } from '@rhotrace/api-types';
import { BOLTZMANN_EV_PER_K } from '@rhotrace/physics';
import { PLOT_ROLES } from '../../../shared/plot/palette';
import { thinForDisplay } from '../../../shared/plot/thin';
import { QUANTITY_WORDS } from '../analysis-labels';
import type { Figure } from '../sweep-study/study-plots';

/** Arrhenius plot: ln ρ (or ln σ) against 1000/T, the chosen window shaded, the fit line drawn. */
export function arrheniusFigure(
  points: ArrheniusPoint[],
  quantity: 'resistivity' | 'conductivity',
  window: { minK: number; maxK: number } | null,
  fit: FitPreviewDto | null,
): Figure {
  const y = (p: ArrheniusPoint) =>
    quantity === 'resistivity' ? p.lnResistivity : p.lnConductivity;
  const shown = thinForDisplay(points, y);
  const data: unknown[] = [
    {
      type: 'scatter',
      mode: 'markers',
      name: QUANTITY_WORDS[quantity].legend,
      x: shown.map((p) => p.inverseTemperaturePerKK),
      y: shown.map(y),
      customdata: shown.map((p) => 1000 / p.inverseTemperaturePerKK),
      marker: { color: PLOT_ROLES.measured, size: shown.length < points.length ? 4 : 6 },
      hovertemplate: '1000/T %{x:.3f} 1/K (%{customdata:.1f} K): %{y:.3f}<extra></extra>',
    },
  ];
  const shapes: unknown[] = [];
  if (window) {
    shapes.push({
      type: 'rect',
      yref: 'paper',
      y0: 0,
      y1: 1,
      x0: 1000 / window.maxK,
      x1: 1000 / window.minK,
      fillcolor: PLOT_ROLES.window,
      opacity: 0.15,
      line: { width: 0 },
      layer: 'below',
    });
  }
  const line = fit ? fitLine(points, quantity, fit) : null;
  if (line) {
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: 'window fit',
      x: line.x,
      y: line.y,
      line: { color: PLOT_ROLES.fit, width: 3 },
    });
  }
  return {
    data,
    layout: {
      shapes,
      showlegend: true,
      xaxis: { title: { text: '1000 / T (1/K)' } },
      yaxis: { title: { text: QUANTITY_WORDS[quantity].axis } },
    },
  };
}

/** The fitted line over the window: through the mean of the window's points with the fit's slope. */
function fitLine(
  points: ArrheniusPoint[],
  quantity: 'resistivity' | 'conductivity',
  fit: FitPreviewDto,
): { x: number[]; y: number[] } | null {
  if (fit.kind !== 'arrhenius' || fit.windowMinK === null || fit.windowMaxK === null) return null;
  const slope = slopeOf(fit);
  if (slope === null) return null;
  const lo = 1000 / fit.windowMaxK;
  const hi = 1000 / fit.windowMinK;
  const inside = points.filter(
    (p) => p.inverseTemperaturePerKK >= lo && p.inverseTemperaturePerKK <= hi,
  );
  if (inside.length === 0) return null;
  const y = (p: ArrheniusPoint) =>
    quantity === 'resistivity' ? p.lnResistivity : p.lnConductivity;
  const mx = inside.reduce((s, p) => s + p.inverseTemperaturePerKK, 0) / inside.length;
  const my = inside.reduce((s, p) => s + y(p), 0) / inside.length;
  return { x: [lo, hi], y: [my + slope * (lo - mx), my + slope * (hi - mx)] };
}

/**
 * Slope of ln ρ against 1000/T implied by an Arrhenius fit, for drawing only: an explicit
 * slope parameter when the fit gives one, else ±Ea / (1000 k_B).
 */
function slopeOf(fit: FitPreviewDto): number | null {
  const p = fit.parameters;
  const explicit = p['slope'] ?? p['slopePerKK'];
  if (typeof explicit === 'number') return explicit;
  const ea = p['activationEnergyEv'];
  if (typeof ea !== 'number') return null;
  const sign = fit.inputs['quantity'] === 'conductivity' ? -1 : 1;
  return (sign * ea) / (1000 * BOLTZMANN_EV_PER_K);
}
