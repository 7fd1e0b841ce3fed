import type { AnalysisStep, ModelCurveResponse } from '@rhotrace/api-types';
import { PLOT_ROLES } from '../../../shared/plot/palette';
import { thinForDisplay, thinningNote } from '../../../shared/plot/decimate';
import { type TemperatureUnit, UNIT_SYMBOL, toUnit } from '../../../shared/temperature-unit';
import type { ShownFit } from '../fit-queue';
import { fitCurveTraces, fitResidualTraces } from './fit-traces';

/** Plotly figure: traces and layout (the Arrhenius plot's is in arrhenius-figure.ts). */
export interface Figure {
  data: unknown[];
  layout: Record<string, unknown>;
  /** A sentence under the plot, e.g. how a long series was thinned for display. */
  caption?: string;
}

const toAxis = (unit: TemperatureUnit) => (k: number) => toUnit(k, unit);
const axisTitle = (unit: TemperatureUnit) => `Temperature (${UNIT_SYMBOL[unit]})`;

/** The temperature range a sweep's plots show: the data's range with a margin of 4 % (≥ 2 K). */
export function plotRangeK(
  minK: number | null,
  maxK: number | null,
): { fromK: number; toK: number } {
  const lo = minK ?? 50;
  const hi = maxK ?? 500;
  const margin = Math.max(2, (hi - lo) * 0.04);
  return { fromK: Math.max(1, lo - margin), toK: Math.min(1500, hi + margin) };
}

/** Options of the curve and residual plots. */
export interface CurveOptions {
  unit: TemperatureUnit;
  /** The temperature range shown, K (see plotRangeK). */
  rangeK: { fromK: number; toK: number };
  /** Legend words for the model line (e.g. "model (Si, P 1.55e15 cm⁻³)" or "bulk W reference"). */
  modelName: string;
  /** Fits drawn as their own lines (and residuals), each named with its window. */
  fits?: readonly ShownFit[];
}

/** Measured steps (with their spread) over the model curve, log resistivity axis. */
export function curveFigure(
  steps: AnalysisStep[],
  model: ModelCurveResponse | null,
  options: CurveOptions,
): Figure {
  const { unit, rangeK } = options;
  const x = toAxis(unit);
  const { shown, thinning } = thinForDisplay(
    steps,
    (s) => s.temperatureK,
    (s) => s.resistivityOhmCm,
    'measured steps',
  );
  const thinned = thinning !== null;
  const data: unknown[] = [
    {
      type: 'scatter',
      mode: 'markers',
      name: thinned
        ? `measured (${shown.length} of ${steps.length} steps shown)`
        : 'measured (mean ± spread per step)',
      x: shown.map((s) => x(s.temperatureK)),
      y: shown.map((s) => s.resistivityOhmCm),
      error_y: {
        type: 'data',
        array: shown.map((s) => s.spreadOhmCm),
        visible: !thinned,
        color: PLOT_ROLES.measured,
        thickness: 1,
      },
      marker: { color: PLOT_ROLES.measured, size: thinned ? 4 : 6 },
      hovertemplate: `%{x:.2f} ${UNIT_SYMBOL[unit]}: %{y:.4g} Ω·cm<extra>measured</extra>`,
    },
  ];
  if (model) {
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: options.modelName,
      x: model.points.map((p) => x(p.temperatureK)),
      y: model.points.map((p) => p.resistivityOhmCm),
      line: { color: PLOT_ROLES.model, width: 2.5, dash: 'solid' },
      hovertemplate: `%{x:.2f} ${UNIT_SYMBOL[unit]}: %{y:.4g} Ω·cm<extra>model</extra>`,
    });
  }
  data.push(...fitCurveTraces(options.fits ?? [], unit));
  const shapes: unknown[] = [];
  const annotations: unknown[] = [];
  if (model?.kind === 'semiconductor') {
    for (const [k, label, anchor] of [
      [model.boundaries.freezeOutBelowK, '← freeze-out', 'right'],
      [model.boundaries.intrinsicAboveK, 'intrinsic →', 'left'],
    ] as const) {
      // Only boundaries inside the shown range: one far outside would stretch the axis.
      if (k === null || k < rangeK.fromK || k > rangeK.toK) continue;
      shapes.push({
        type: 'line',
        yref: 'paper',
        y0: 0,
        y1: 1,
        x0: x(k),
        x1: x(k),
        line: { color: PLOT_ROLES.window, dash: 'dot', width: 1.5 },
      });
      annotations.push({
        x: x(k),
        y: 1,
        yref: 'paper',
        yanchor: 'bottom',
        xanchor: anchor,
        text: label,
        showarrow: false,
        font: { size: 12 },
      });
    }
  }
  return {
    data,
    layout: {
      shapes,
      annotations,
      xaxis: {
        title: { text: axisTitle(unit) },
        range: [x(rangeK.fromK), x(rangeK.toK)],
        autorange: false,
      },
      yaxis: {
        title: { text: 'Resistivity (Ω·cm)' },
        type: 'log',
        exponentformat: 'power',
        ...logRangeOf(steps),
      },
    },
    caption: thinningNote(thinning ? [thinning] : []),
  };
}

/**
 * The log axis range of the measured values, widened by a factor of 3 each way: the model may
 * run far off (10²⁵ Ω·cm deep in freeze-out) without squashing the data into a line.
 */
function logRangeOf(steps: AnalysisStep[]): { range?: [number, number]; autorange?: boolean } {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of steps) {
    if (!(s.resistivityOhmCm > 0)) continue;
    lo = Math.min(lo, s.resistivityOhmCm);
    hi = Math.max(hi, s.resistivityOhmCm);
  }
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return {};
  const pad = Math.log10(3);
  return { range: [Math.log10(lo) - pad, Math.log10(hi) + pad], autorange: false };
}

/** Model resistivity at temperature `k`, interpolated in log ρ between the curve's points. */
export function modelAt(model: ModelCurveResponse, k: number): number | null {
  const points = model.points;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    if (k >= a.temperatureK && k <= b.temperatureK) {
      if (!a.resistivityOhmCm || !b.resistivityOhmCm) return null;
      const t = (k - a.temperatureK) / (b.temperatureK - a.temperatureK || 1);
      return Math.exp(Math.log(a.resistivityOhmCm) * (1 - t) + Math.log(b.resistivityOhmCm) * t);
    }
  }
  return null;
}

/**
 * Residuals ln(ρ measured / ρ model) at each measured step inside the model's range, and each
 * drawn fit's own residuals; null when there is neither a model nor a fit.
 */
export function residualFigure(
  steps: AnalysisStep[],
  model: ModelCurveResponse | null,
  options: CurveOptions,
): Figure | null {
  const fitTraces = fitResidualTraces(options.fits ?? [], options.unit);
  if (!model && fitTraces.length === 0) return null;
  const { unit, rangeK } = options;
  const x = toAxis(unit);
  const xs: number[] = [];
  const ys: number[] = [];
  if (model) {
    const { shown } = thinForDisplay(
      steps,
      (s) => s.temperatureK,
      (s) => s.resistivityOhmCm,
      'residuals',
    );
    for (const s of shown) {
      const m = modelAt(model, s.temperatureK);
      if (m === null || m <= 0) continue;
      xs.push(x(s.temperatureK));
      ys.push(Math.log(s.resistivityOhmCm / m));
    }
  }
  const modelTrace = {
    type: 'scatter',
    mode: 'markers',
    name: 'residuals of the model',
    x: xs,
    y: ys,
    marker: { color: PLOT_ROLES.measured, size: 5 },
    hovertemplate: `%{x:.2f} ${UNIT_SYMBOL[unit]}: %{y:.3f}<extra>ln(ρ measured / ρ model)</extra>`,
  };
  return {
    data: [...(model ? [modelTrace] : []), ...fitTraces],
    layout: {
      showlegend: fitTraces.length > 0,
      margin: { l: 80, r: 20, t: 10, b: 48 },
      xaxis: {
        title: { text: axisTitle(unit) },
        range: [x(rangeK.fromK), x(rangeK.toK)],
        autorange: false,
      },
      yaxis: { title: { text: 'ln(ρ / ρ fit)' }, zeroline: true },
    },
  };
}
