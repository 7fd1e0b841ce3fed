import type { LotSummaryResponse, SpecVerdict } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../shared/plot/palette';

/** Marker per verdict: the shape, not only the colour, tells them apart. */
const VERDICT_SYMBOLS: Readonly<Record<SpecVerdict, string>> = {
  pass: 'circle',
  fail: 'x',
  indeterminate: 'diamond',
};

/** Plot data: each wafer's resistivity at 23 °C ± U (k = 2), with the lot's spec band shaded. */
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
        x: measured.map((w) => w.number),
        y: measured.map((w) => w.resistivityAt23COhmCm),
        error_y: {
          type: 'data',
          array: measured.map((w) => w.uncertaintyOhmCm ?? 0),
          visible: true,
          color: PLOT_ROLES.measured,
        },
        marker: {
          size: 11,
          color: measured.map((w) =>
            w.verdict === 'fail' || w.verdict === 'indeterminate'
              ? PLOT_ROLES.model
              : PLOT_ROLES.measured,
          ),
          symbol: measured.map((w) => VERDICT_SYMBOLS[w.verdict ?? 'pass']),
        },
        customdata: measured.map((w) => w.uncertaintyOhmCm ?? 0),
        hovertemplate: '%{x}: %{y:.4g} ± %{customdata:.2g} Ω·cm (k = 2)<extra></extra>',
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
