import { describe, expect, it } from 'vitest';
import { MAX_POINTS_PER_TRACE, minMaxIndices, thinTrace, thinningNote } from './decimate';
import { logTicks, powerOfTen } from './log-ticks';
import { prepareFigure } from './plot-figure';

describe('min/max decimation', () => {
  it('keeps at most two points per column, in order, with every extreme', () => {
    const n = 100_000;
    const x = Array.from({ length: n }, (_, i) => 25 + (455 * i) / n);
    const y = x.map((t, i) => 1 / t + (i === 61_234 ? 5 : 0) + (i === 7_000 ? -1 : 0));
    const kept = minMaxIndices(x, y, 2500);
    expect(kept.length).toBeLessThanOrEqual(5000);
    expect(kept).toEqual([...kept].sort((a, b) => a - b));
    // The spike and the dip (outliers a plot must show) survive.
    expect(kept).toContain(61_234);
    expect(kept).toContain(7_000);
    // The global extremes survive too.
    const yMax = Math.max(...kept.map((i) => y[i]!));
    expect(yMax).toBe(Math.max(...y));
  });

  it('cuts columns in log10 x on a log axis', () => {
    const x = Array.from({ length: 1000 }, (_, i) => 10 ** (i / 100));
    const y = x.map(() => 1);
    // Equal y: one point per column; columns equal in log x hold equal counts.
    expect(minMaxIndices(x, y, 10, true)).toHaveLength(10);
    expect(minMaxIndices(x, y, 10, true)[1]).toBe(100);
  });

  it('thins every per-point array of a long trace alike and leaves short ones alone', () => {
    const n = 12_000;
    const x = Array.from({ length: n }, (_, i) => i);
    const trace = {
      name: 'measured',
      x,
      y: x.map((v) => Math.sin(v / 50)),
      error_y: { type: 'data', array: x.map((v) => v / 10) },
      marker: { color: '#1B307F' },
    };
    const { trace: out, thinning } = thinTrace(trace, false);
    const xs = out['x'] as number[];
    expect(xs.length).toBeLessThanOrEqual(MAX_POINTS_PER_TRACE);
    expect((out['error_y'] as { array: number[] }).array).toEqual(xs.map((v) => v / 10));
    expect((out['marker'] as { color: string }).color).toBe('#1B307F');
    expect(thinning).toEqual({ name: 'measured', from: n, to: xs.length, columns: 2500 });
    const short = { x: [1, 2], y: [3, 4] };
    expect(thinTrace(short, false)).toEqual({ trace: short, thinning: null });
  });

  it('says how the plot was thinned and that fits use every point', () => {
    const note = thinningNote([{ name: 'measured', from: 100_000, to: 4_998, columns: 2500 }]);
    expect(note).toContain('100,000 points drawn as 4,998');
    expect(note).toContain('2,500 columns');
    expect(note).toContain('Fits, tables and exports use every point');
    expect(thinningNote([])).toBe('');
  });
});

describe('log-axis ticks', () => {
  it('labels 1-2-5 steps with whole values over up to three decades', () => {
    // The defect: plotly's minor labels read "5" for 0.5.
    const t = logTicks(0.3, 60)!;
    expect(t.ticktext).toEqual(['0.5', '1', '2', '5', '10', '20', '50']);
    expect(t.tickvals).toEqual([0.5, 1, 2, 5, 10, 20, 50]);
  });

  it('labels powers of ten only over wide ranges', () => {
    const t = logTicks(1e-6, 1e5)!;
    expect(t.ticktext[0]).toBe(powerOfTen(-6));
    expect(t.ticktext).toEqual(['10⁻⁶', '10⁻⁴', '10⁻²', '10⁰', '10²', '10⁴']);
    expect(t.tickvals.every((v) => Math.abs(Math.log10(v) - Math.round(Math.log10(v))) < 1e-12));
    expect(powerOfTen(-12)).toBe('10⁻¹²');
  });

  it('still gives two ticks for a narrow range and none for bad input', () => {
    expect(logTicks(2.1, 2.4)!.tickvals.length).toBeGreaterThanOrEqual(2);
    expect(logTicks(0, 10)).toBeNull();
    expect(logTicks(5, 1)).toBeNull();
  });
});

describe('log ticks of a fixed axis', () => {
  it('follow the range a page fixed, not a model curve running far outside it', () => {
    const figure = prepareFigure(
      [{ type: 'scatter', x: [1, 2, 3], y: [1, 1e12, 1e25] }],
      { yaxis: { type: 'log', range: [0, 2], autorange: false } },
      { webgl: false, dark: false, yType: null },
    );
    const yaxis = figure.layout['yaxis'] as { ticktext: string[] };
    expect(yaxis.ticktext).toEqual(['1', '2', '5', '10', '20', '50', '100']);
  });
});
