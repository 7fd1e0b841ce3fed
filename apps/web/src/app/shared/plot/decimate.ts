/** Most points one trace draws; a longer trace is thinned for display (fits use every point). */
export const MAX_POINTS_PER_TRACE = 5000;

/** A trace as plotly takes it, as far as thinning needs to know. */
export type TraceInput = Record<string, unknown>;

/** What thinning did to one trace, for the note under the plot. */
export interface Thinning {
  name: string;
  from: number;
  to: number;
  columns: number;
}

/**
 * Indices kept by min/max decimation: the x range is cut into `columns` equal columns (equal in
 * log10 x on a log axis) and each column keeps its lowest and highest y, so every peak, dip,
 * knee and outlier a pixel column could show stays on the plot; the result keeps the input
 * order and has at most 2 x columns points. Points whose x or y is not a finite number (or not
 * positive on a log axis) are dropped, as plotly would not draw them.
 * Source: the min/max ("M4"-style) reduction of Jugel et al., "M4: a visualization-oriented
 * time series data aggregation", Proc. VLDB Endow. 7, 797 (2014), without the first/last pair.
 */
export function minMaxIndices(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  columns: number,
  logX = false,
): number[] {
  const n = Math.min(x.length, y.length);
  const at = (i: number): number => (logX ? Math.log10(x[i]!) : x[i]!);
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = at(i);
    if (Number.isFinite(v) && Number.isFinite(y[i]!)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (!(hi >= lo)) return [];
  const width = hi > lo ? (hi - lo) / columns : 1;
  const low = new Int32Array(columns).fill(-1);
  const high = new Int32Array(columns).fill(-1);
  for (let i = 0; i < n; i++) {
    const v = at(i);
    const value = y[i]!;
    if (!Number.isFinite(v) || !Number.isFinite(value)) continue;
    const c = Math.min(columns - 1, Math.floor((v - lo) / width));
    if (low[c]! < 0 || value < y[low[c]!]!) low[c] = i;
    if (high[c]! < 0 || value > y[high[c]!]!) high[c] = i;
  }
  const kept: number[] = [];
  for (let c = 0; c < columns; c++) {
    if (low[c]! < 0) continue;
    kept.push(low[c]!);
    if (high[c] !== low[c]) kept.push(high[c]!);
  }
  return kept.sort((a, b) => a - b);
}

/** Per-point arrays of a trace (top level and one level down), to be thinned alike. */
const PER_POINT = ['x', 'y', 'text', 'hovertext', 'customdata', 'ids'] as const;
const NESTED_PER_POINT: Record<string, readonly string[]> = {
  error_y: ['array', 'arrayminus'],
  error_x: ['array', 'arrayminus'],
  marker: ['color', 'size', 'symbol', 'opacity'],
};

function pick(values: unknown, indices: readonly number[], n: number): unknown {
  return Array.isArray(values) && values.length === n ? indices.map((i) => values[i]) : values;
}

/**
 * A trace with at most `MAX_POINTS_PER_TRACE` points: longer ones are thinned by
 * `minMaxIndices` over half as many columns, every per-point array alike.
 */
export function thinTrace(
  trace: TraceInput,
  logX: boolean,
  max = MAX_POINTS_PER_TRACE,
): { trace: TraceInput; thinning: Thinning | null } {
  const x = trace['x'];
  const y = trace['y'];
  if (!Array.isArray(x) || !Array.isArray(y) || x.length <= max) return { trace, thinning: null };
  const n = x.length;
  const columns = Math.floor(max / 2);
  const indices = minMaxIndices(x as number[], y as number[], columns, logX);
  const out: TraceInput = { ...trace };
  for (const key of PER_POINT) if (key in trace) out[key] = pick(trace[key], indices, n);
  for (const [key, inner] of Object.entries(NESTED_PER_POINT)) {
    const nested = trace[key];
    if (typeof nested !== 'object' || nested === null) continue;
    const copy: Record<string, unknown> = { ...(nested as Record<string, unknown>) };
    for (const k of inner) if (k in copy) copy[k] = pick(copy[k], indices, n);
    out[key] = copy;
  }
  const name = typeof trace['name'] === 'string' ? trace['name'] : 'series';
  return { trace: out, thinning: { name, from: n, to: indices.length, columns } };
}

/**
 * Thins a page's series before it makes a trace of it, by the same min/max decimation the plot
 * applies to its traces (`minMaxIndices` over x, half as many columns as `max`): the page can
 * then style a thinned series (smaller markers, no error bars) and put `thinningNote` under it.
 * Returns every item when there are at most `max`, and what was done for the note.
 */
export function thinForDisplay<T>(
  items: readonly T[],
  x: (item: T) => number,
  y: (item: T) => number,
  name: string,
  max = MAX_POINTS_PER_TRACE,
): { shown: T[]; thinning: Thinning | null } {
  if (items.length <= max) return { shown: [...items], thinning: null };
  const columns = Math.floor(max / 2);
  const kept = minMaxIndices(Float64Array.from(items, x), Float64Array.from(items, y), columns);
  const shown = kept.map((i) => items[i]!);
  return { shown, thinning: { name, from: items.length, to: shown.length, columns } };
}

/** The sentence under a thinned plot: how it was thinned, and that fits use every point. */
export function thinningNote(thinned: readonly Thinning[]): string {
  if (thinned.length === 0) return '';
  const count = (v: number) => v.toLocaleString('en-US');
  const parts = thinned.map((t) => `${t.name}: ${count(t.from)} points drawn as ${count(t.to)}`);
  const columns = count(thinned[0]!.columns);
  return (
    `Thinned for display (${parts.join('; ')}): the lowest and highest point in each of ` +
    `${columns} columns across the x axis are drawn, so peaks and outliers stay visible. ` +
    'Fits, tables and exports use every point.'
  );
}
