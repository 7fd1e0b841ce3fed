/**
 * The figure a plot hands plotly, prepared from what a page gives: long traces thinned, big ones
 * drawn with WebGL, palette colours mapped to the scheme, log axes given our own ticks.
 */
import type { Thinning, TraceInput } from './decimate';
import { thinTrace } from './decimate';
import { logTicks } from './log-ticks';
import { schemeColour } from './palette';

/** Traces longer than this (before thinning) are drawn with WebGL where the browser has it. */
export const WEBGL_MIN_POINTS = 2000;

export type AxisName = 'xaxis' | 'yaxis';

/** Whether any trace has more than `WEBGL_MIN_POINTS` points (and may be drawn with WebGL). */
export function hasLongTrace(data: readonly unknown[]): boolean {
  return data.some((t) => isRecord(t) && Array.isArray(t['x']) && t['x'].length > WEBGL_MIN_POINTS);
}

/** Options of `prepareFigure`. */
export interface FigureOptions {
  dark: boolean;
  webgl: boolean;
  /** The y axis type chosen with the toolbar, or null to keep the page's. */
  yType: 'log' | 'linear' | null;
}

/** The prepared figure: traces, layout and what thinning did. */
export interface PreparedFigure {
  data: TraceInput[];
  layout: Record<string, unknown>;
  thinned: Thinning[];
  /** Positive data range of each log axis, for its ticks after a zoom is reset. */
  logRanges: Partial<Record<AxisName, [number, number]>>;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** The trace with every palette colour (line, marker, fill, error bars) as the scheme draws it. */
export function schemeTrace(trace: TraceInput, dark: boolean): TraceInput {
  if (!dark) return trace;
  const out: TraceInput = { ...trace };
  const colour = (v: unknown) => (typeof v === 'string' ? schemeColour(v, true) : v);
  if ('fillcolor' in out) out['fillcolor'] = colour(out['fillcolor']);
  for (const key of ['line', 'marker', 'error_y', 'error_x']) {
    const nested = out[key];
    if (!isRecord(nested)) continue;
    const copy: Record<string, unknown> = { ...nested, color: colour(nested['color']) };
    if (isRecord(nested['line'])) {
      copy['line'] = { ...nested['line'], color: colour(nested['line']['color']) };
    }
    if (!('color' in nested)) delete copy['color'];
    out[key] = copy;
  }
  return out;
}

/** The axis a trace plots against (`xaxis`/`yaxis`; second axes keep their own ranges). */
function tracesOn(data: readonly TraceInput[], axis: AxisName): TraceInput[] {
  const ref = axis === 'xaxis' ? 'xaxis' : 'yaxis';
  return data.filter((t) => t[ref] === undefined || t[ref] === ref.charAt(0));
}

function positiveRange(data: readonly TraceInput[], key: 'x' | 'y'): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of data) {
    const values = t[key];
    if (!Array.isArray(values)) continue;
    for (const v of values) {
      if (typeof v === 'number' && v > 0 && v < Infinity) {
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
    }
  }
  return hi >= lo ? [lo, hi] : null;
}

/** Prepares a page's traces and layout for plotly (see the file comment). */
export function prepareFigure(
  data: readonly unknown[],
  layout: Record<string, unknown>,
  options: FigureOptions,
): PreparedFigure {
  const xAxis = isRecord(layout['xaxis']) ? layout['xaxis'] : {};
  const yAxis = isRecord(layout['yaxis']) ? { ...layout['yaxis'] } : {};
  if (options.yType) yAxis['type'] = options.yType;
  const logX = xAxis['type'] === 'log';
  const thinned: Thinning[] = [];
  const traces = data.filter(isRecord).map((input) => {
    const n = Array.isArray(input['x']) ? input['x'].length : 0;
    const { trace, thinning } = thinTrace(input, logX);
    if (thinning) thinned.push(thinning);
    const type = trace['type'] ?? 'scatter';
    const big = options.webgl && type === 'scatter' && n > WEBGL_MIN_POINTS && !trace['fill'];
    return schemeTrace(big ? { ...trace, type: 'scattergl' } : trace, options.dark);
  });
  const axes: Record<AxisName, Record<string, unknown>> = { xaxis: { ...xAxis }, yaxis: yAxis };
  const logRanges: PreparedFigure['logRanges'] = {};
  for (const axis of ['xaxis', 'yaxis'] as const) {
    const a = axes[axis];
    if (a['type'] !== 'log' || a['tickvals'] !== undefined) continue;
    // A page that fixes the axis (log10 units, as plotly takes them) is ticked over what shows,
    // not over every trace: a model far off the data would otherwise leave one label in view.
    const fixed = a['range'];
    const range =
      Array.isArray(fixed) && typeof fixed[0] === 'number' && typeof fixed[1] === 'number'
        ? ([10 ** Math.min(fixed[0], fixed[1]), 10 ** Math.max(fixed[0], fixed[1])] as [
            number,
            number,
          ])
        : positiveRange(tracesOn(traces, axis), axis === 'xaxis' ? 'x' : 'y');
    const ticks = range ? logTicks(range[0], range[1]) : null;
    if (!range || !ticks) continue;
    logRanges[axis] = range;
    Object.assign(a, { tickmode: 'array', ...ticks });
  }
  const shapes = Array.isArray(layout['shapes'])
    ? layout['shapes'].map((s) => (isRecord(s) ? schemeTrace(s, options.dark) : s))
    : layout['shapes'];
  return {
    data: traces,
    layout: { ...layout, ...axes, ...(shapes === undefined ? {} : { shapes }) },
    thinned,
    logRanges,
  };
}

/**
 * Ticks for a log axis after a zoom (plotly reports the range in log10 units) or after the
 * range is reset to the data (`autorange`, back to `dataRange`); null when the event is neither.
 */
export function zoomedLogTicks(
  event: object,
  axis: AxisName,
  dataRange: [number, number] | undefined,
): Record<string, unknown> | null {
  const e = new Map(Object.entries(event));
  const r0 = e.get(`${axis}.range[0]`);
  const r1 = e.get(`${axis}.range[1]`);
  let range: [number, number] | null = null;
  if (typeof r0 === 'number' && typeof r1 === 'number') {
    range = [10 ** Math.min(r0, r1), 10 ** Math.max(r0, r1)];
  } else if (e.get(`${axis}.autorange`) === true && dataRange) {
    range = dataRange;
  }
  const ticks = range ? logTicks(range[0], range[1]) : null;
  return ticks
    ? { [`${axis}.tickvals`]: ticks.tickvals, [`${axis}.ticktext`]: ticks.ticktext }
    : null;
}
