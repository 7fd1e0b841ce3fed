import type { LotSummaryResponse } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../shared/plot/palette';

/** Plot data: each wafer's resistivity at 23 °C, with the lot's spec band shaded. */
export function lotChart(summary: LotSummaryResponse): {
  data: unknown[];
  layout: Record<string, unknown>;
} {
  const measured = summary.wafers.filter((w) => w.resistivityAt23COhmCm !== null);
  const { specMinOhmCm: low, specMaxOhmCm: high } = summary.lot;
  const shapes: unknown[] = [];
  if (low !== null && high !== null) {
    shapes.push({
      type: 'rect',
      xref: 'paper',
      x0: 0,
      x1: 1,
      y0: low,
      y1: high,
      fillcolor: PLOT_ROLES.band,
      opacity: 0.18,
      line: { width: 0 },
      layer: 'below',
    });
  }
  for (const limit of [low, high]) {
    if (limit === null) continue;
    shapes.push({
      type: 'line',
      xref: 'paper',
      x0: 0,
      x1: 1,
      y0: limit,
      y1: limit,
      line: { color: PLOT_ROLES.band, width: 1.5, dash: 'dash' },
    });
  }
  return {
    data: [
      {
        type: 'scatter',
        mode: 'markers',
        name: 'ρ at 23 °C',
        x: measured.map((w) => `W${w.number}`),
        y: measured.map((w) => w.resistivityAt23COhmCm),
        marker: {
          size: 11,
          color: measured.map((w) => (w.pass === false ? PLOT_ROLES.model : PLOT_ROLES.measured)),
          symbol: measured.map((w) => (w.pass === false ? 'x' : 'circle')),
        },
        hovertemplate: '%{x}: %{y:.4g} Ω·cm<extra></extra>',
      },
    ],
    layout: {
      shapes,
      showlegend: false,
      xaxis: { title: { text: 'Wafer' }, type: 'category' },
      yaxis: { title: { text: 'Resistivity at 23 °C (Ω·cm)' } },
    },
  };
}
