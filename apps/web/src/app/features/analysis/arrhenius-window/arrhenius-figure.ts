import type { ArrheniusPoint } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../shared/plot/palette';
import { thinForDisplay, thinningNote } from '../../../shared/plot/decimate';
import { type TemperatureUnit, UNIT_SYMBOL, toUnit } from '../../../shared/temperature-unit';
import { QUANTITY_WORDS } from '../analysis-labels';
import type { ShownFit } from '../fit-queue';
import { fitTraceName, fittedCurve } from '../fitted-curve';
import type { Figure } from '../sweep-study/study-plots';

/** Arrhenius plot: ln ρ (or ln σ) against 1000/T, the chosen window shaded, the fit line drawn. */
export function arrheniusFigure(
  points: ArrheniusPoint[],
  quantity: 'resistivity' | 'conductivity',
  window: { minK: number; maxK: number } | null,
  fit: ShownFit | null,
  unit: TemperatureUnit = 'K',
): Figure {
  const y = (p: ArrheniusPoint) =>
    quantity === 'resistivity' ? p.lnResistivity : p.lnConductivity;
  const { shown, thinning } = thinForDisplay(
    points,
    (p) => p.inverseTemperaturePerKK,
    y,
    QUANTITY_WORDS[quantity].legend,
  );
  const data: unknown[] = [
    {
      type: 'scatter',
      mode: 'markers',
      name: QUANTITY_WORDS[quantity].legend,
      x: shown.map((p) => p.inverseTemperaturePerKK),
      y: shown.map(y),
      customdata: shown.map((p) => toUnit(1000 / p.inverseTemperaturePerKK, unit)),
      marker: { color: PLOT_ROLES.measured, size: thinning ? 4 : 6 },
      hovertemplate: `1000/T %{x:.3f} 1/K (%{customdata:.1f} ${UNIT_SYMBOL[unit]}): %{y:.3f}<extra></extra>`,
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
  const line = fit?.kind === 'arrhenius' ? fitLine(quantity, fit) : null;
  if (fit && line) {
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: fitTraceName(fit, unit),
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
    caption: thinningNote(thinning ? [thinning] : []),
  };
}

/**
 * The fit's line over its window in the plot's own quantity, from the fit's parameters (the
 * same evaluation as the ρ(T) plot, `fittedCurve`).
 */
function fitLine(
  quantity: 'resistivity' | 'conductivity',
  fit: ShownFit,
): { x: number[]; y: number[] } | null {
  const curve = fittedCurve(fit);
  if (curve.length < 2) return null;
  const sign = quantity === 'resistivity' ? 1 : -1;
  return {
    x: curve.map((p) => 1000 / p.temperatureK),
    y: curve.map((p) => sign * Math.log(p.resistivityOhmCm)),
  };
}
