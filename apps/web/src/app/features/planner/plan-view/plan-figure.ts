import type { PlannerResponse } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../shared/plot/palette';

/**
 * The plan's figure: expected resistivity (left axis) and expected voltage (right axis) against
 * temperature, both logarithmic, with the meter's readable window drawn as two dashed lines on
 * the voltage axis and the regime boundaries as dotted verticals.
 */
export function planFigure(plan: PlannerResponse): {
  data: unknown[];
  layout: Record<string, unknown>;
} {
  const t = plan.steps.map((s) => s.temperatureK);
  const [lowV, highV] = plan.basis.readableVoltageV;
  const volts = plan.steps.map((s) => s.voltageV);
  const hLine = (y: number) => ({
    type: 'line',
    xref: 'paper',
    x0: 0,
    x1: 1,
    yref: 'y2',
    y0: y,
    y1: y,
    line: { dash: 'dash', width: 1, color: PLOT_ROLES.model },
  });
  const boundaries = [
    plan.regimeBoundaries?.freezeOutBelowK ?? null,
    plan.regimeBoundaries?.intrinsicAboveK ?? null,
  ].filter((b): b is number => b !== null && b >= t[0]! && b <= t[t.length - 1]!);
  return {
    data: [
      {
        type: 'scatter',
        mode: 'lines+markers',
        name: 'expected ρ',
        x: t,
        y: plan.steps.map((s) => s.expectedResistivityOhmCm),
        marker: { color: PLOT_ROLES.measured, size: 5 },
        hovertemplate: '%{x:.2f} K: %{y:.4g} Ω·cm<extra></extra>',
      },
      {
        type: 'scatter',
        mode: 'lines+markers',
        name: 'expected V',
        x: t,
        y: volts,
        yaxis: 'y2',
        line: { shape: 'hv' },
        marker: { color: PLOT_ROLES.fit, size: 5, symbol: 'square' },
        hovertemplate: '%{x:.2f} K: %{y:.3g} V<extra></extra>',
      },
    ],
    layout: {
      xaxis: { title: { text: 'Temperature (K)' } },
      yaxis: { title: { text: 'Expected resistivity (Ω·cm)' }, type: 'log' },
      yaxis2: {
        title: { text: 'Expected voltage (V)' },
        type: 'log',
        overlaying: 'y',
        side: 'right',
        range: [
          Math.log10(Math.min(lowV, ...volts)) - 0.3,
          Math.log10(Math.max(highV, ...volts)) + 0.3,
        ],
      },
      shapes: [
        hLine(lowV),
        hLine(highV),
        ...boundaries.map((b) => ({
          type: 'line',
          x0: b,
          x1: b,
          yref: 'paper',
          y0: 0,
          y1: 1,
          line: { dash: 'dot', width: 1, color: PLOT_ROLES.model },
        })),
      ],
      showlegend: true,
      legend: { orientation: 'h' },
    },
  };
}
