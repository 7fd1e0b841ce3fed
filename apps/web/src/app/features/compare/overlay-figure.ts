/**
 * The overlay's figure: each chosen sweep on the common temperature grid, against T or as an
 * Arrhenius plot (1000/T), on a log or linear axis, optionally divided by its own value at 23 °C,
 * with the spec band of a lot when the view is in Ω·cm.
 */
import type { CompareResponse, LotDto } from '@rhotrace/api-types';
import { seriesColour } from '../../shared/plot/palette';

/** 23 °C, where specs are stated, K. */
export const T23_K = 296.15;

export interface OverlayOptions {
  unit: 'K' | 'C';
  view: 'temperature' | 'arrhenius';
  logY: boolean;
  normalise: boolean;
  /** The lot whose spec band is drawn (only in Ω·cm, not normalised). */
  specLot: Pick<LotDto, 'code' | 'specMinOhmCm' | 'specMaxOhmCm'> | null;
}

/**
 * A curve's value at 23 °C by linear interpolation between the two grid temperatures around it
 * (the overlay's grid is the API's common grid); null when the curve does not span 23 °C.
 */
export function valueAt23C(
  temperaturesK: readonly number[],
  values: ReadonlyArray<number | null>,
): number | null {
  for (let i = 0; i + 1 < temperaturesK.length; i += 1) {
    const t0 = temperaturesK[i]!;
    const t1 = temperaturesK[i + 1]!;
    if (t0 <= T23_K && T23_K <= t1) {
      const y0 = values[i];
      const y1 = values[i + 1];
      if (y0 == null || y1 == null) return null;
      return t1 === t0 ? y0 : y0 + ((y1 - y0) * (T23_K - t0)) / (t1 - t0);
    }
  }
  return null;
}

/** The plotly traces and layout of the overlay, and the sweeps left out (with why). */
export function overlayFigure(data: CompareResponse, o: OverlayOptions) {
  const x =
    o.view === 'arrhenius'
      ? data.temperaturesK.map((k) => 1000 / k)
      : data.temperaturesK.map((k) => (o.unit === 'K' ? k : k - 273.15));
  const leftOut: string[] = [];
  const traces: unknown[] = [];
  data.curves.forEach((c, i) => {
    const name = `${c.lotCode} ${c.waferNumber} (sweep ${c.sweepId})`;
    let y = c.resistivityOhmCm;
    if (o.normalise) {
      const at23 = valueAt23C(data.temperaturesK, c.resistivityOhmCm);
      if (at23 === null || !(at23 > 0)) {
        leftOut.push(`${name}: does not reach 23 °C`);
        return;
      }
      y = y.map((v) => (v === null ? null : v / at23));
    }
    traces.push({
      type: 'scatter',
      mode: 'lines+markers',
      name,
      x,
      y,
      line: { color: seriesColour(i), width: 2 },
      marker: {
        color: seriesColour(i),
        size: 4,
        symbol: ['circle', 'square', 'diamond', 'triangle-up', 'cross'][i % 5],
      },
      connectgaps: false,
    });
  });
  const band =
    o.specLot && !o.normalise && o.specLot.specMinOhmCm !== null && o.specLot.specMaxOhmCm !== null
      ? {
          type: 'rect',
          xref: 'paper',
          x0: 0,
          x1: 1,
          yref: 'y',
          y0: o.specLot.specMinOhmCm,
          y1: o.specLot.specMaxOhmCm,
          fillcolor: 'rgba(127, 127, 127, 0.15)',
          line: { width: 0 },
          layer: 'below',
          label: {
            text: `Spec of lot ${o.specLot.code} (applies at 23 °C)`,
            textposition: 'top left',
          },
        }
      : null;
  const xTitle =
    o.view === 'arrhenius'
      ? '1000 / T (1/K)'
      : o.unit === 'K'
        ? 'Temperature (K)'
        : 'Temperature (°C)';
  const yTitle = o.normalise ? 'ρ / ρ(23 °C)' : 'Resistivity (Ω·cm)';
  return {
    data: traces,
    layout: {
      xaxis: { title: { text: xTitle } },
      yaxis: {
        title: { text: yTitle },
        type: o.logY ? 'log' : 'linear',
        ...(o.logY ? { exponentformat: 'power' } : {}),
      },
      ...(band ? { shapes: [band] } : {}),
    },
    leftOut,
  };
}
