import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  afterRenderEffect,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import type { PlotlyHTMLElement } from 'plotly.js-dist-min';
import { ThemeMode } from '../../core/layout/theme-mode';
import { thinningNote } from './decimate';
import { afterPaint, onScreen, sameValue, whenIdle } from './draw-timing';
import { PLOT_BACKGROUND } from './palette';
import type { AxisName } from './plot-figure';
import { hasLongTrace, prepareFigure, zoomedLogTicks } from './plot-figure';
import { PNG_SIZE, pngFilename, saveBlob, stampedPng } from './plot-png';
import { PlotlyLoader } from './plotly-loader';
import { RovingToolbar } from '../roving-toolbar';

/** A selection made by dragging a box on the plot: the x range chosen. */
export interface PlotSelection {
  xMin: number;
  xMax: number;
}

interface PlotlySelectedEvent {
  range?: { x?: [number, number] };
  points?: Array<{ x: number }>;
}

/**
 * A theme colour as plotly can read it. Material's system colours may be `light-dark(…)`
 * expressions, which plotly does not understand: let the browser resolve them on a probe.
 */
export function resolvedColour(element: HTMLElement, variable: string, fallback: string): string {
  const probe = element.ownerDocument.createElement('span');
  probe.style.color = `var(${variable}, ${fallback})`;
  probe.style.display = 'none';
  element.appendChild(probe);
  const colour = getComputedStyle(probe).color;
  probe.remove();
  return colour || fallback;
}

let webglAvailable: boolean | null = null;
/** Whether the browser can draw WebGL traces (checked once). */
function hasWebgl(doc: Document): boolean {
  webglAvailable ??= (() => {
    try {
      return !!doc.createElement('canvas').getContext('webgl');
    } catch {
      return false;
    }
  })();
  return webglAvailable;
}

/**
 * A Plotly chart with Rhotrace's own toolbar (save image, reset axes, log or linear y) instead of
 * plotly's mode bar. Plotly loads lazily; traces longer than 5,000 points are thinned for display
 * (a note under the plot says how; fits use every point), big ones drawn with WebGL, palette
 * colours follow the scheme and log axes get whole-value ticks. The page's own content is painted
 * before the plot is drawn; a plot off screen, and a redraw, wait for idle time (see
 * draw-timing.ts); a figure equal to the one last asked for is not drawn again.
 */
@Component({
  selector: 'rt-plot',
  imports: [RovingToolbar],
  templateUrl: './plot.html',
  styleUrl: './plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Plot {
  private readonly loader = inject(PlotlyLoader);
  private readonly theme = inject(ThemeMode);
  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');

  readonly data = input.required<unknown[]>();
  readonly layout = input<Record<string, unknown>>({});
  readonly label = input.required<string>();
  readonly caption = input<string>('');
  /** Title drawn in a saved image; the label when empty. */
  readonly title = input<string>('');
  /** The sample named in a saved image (wafer, sweep). */
  readonly sample = input<string>('');
  /** When true, dragging selects an x range (box select) instead of zooming. */
  readonly selectable = input(false);
  readonly selected = output<PlotSelection>();

  protected readonly ready = signal(false);
  protected readonly note = signal('');
  /** The y axis type chosen with the toolbar (null: the page's). */
  protected readonly yType = signal<'log' | 'linear' | null>(null);
  protected readonly yIsLog = signal(false);
  private listening = false;
  private logRanges: Partial<Record<AxisName, [number, number]>> = {};
  private drawn = 0;
  /** Set when the page is left: a draw still waiting (for plotly, a paint, idle time) is dropped. */
  private destroyed = false;
  /** What the last draw was asked to show: the same again is not redrawn. */
  private lastAsked: unknown[] | null = null;

  constructor() {
    afterRenderEffect(() => {
      const data = this.data();
      const layout = this.layout();
      const selectable = this.selectable();
      const yType = this.yType();
      // Read so a change of scheme redraws with that scheme's colours.
      const dark = this.theme.dark();
      const element = this.host().nativeElement;
      const asked = [data, layout, selectable, yType, dark];
      if (this.lastAsked && sameValue(asked, this.lastAsked)) return;
      this.lastAsked = asked;
      void this.draw(element, data, layout, selectable, yType, dark);
    });
    inject(DestroyRef).onDestroy(() => {
      this.destroyed = true;
      // Only a plot that asked for plotly has anything to free.
      if (this.drawn > 0) void this.loader.load().then((p) => p.purge(this.host().nativeElement));
    });
  }

  /** Switches the y axis between log and linear. */
  protected toggleLog(): void {
    this.yType.set(this.yIsLog() ? 'linear' : 'log');
  }

  /** Back to the full range of the data on both axes. */
  protected async resetAxes(): Promise<void> {
    const plotly = await this.loader.load();
    await plotly.relayout(this.host().nativeElement, {
      'xaxis.autorange': true,
      'yaxis.autorange': true,
    });
  }

  /** The toolbar's save: a file named after the title. */
  protected save(): void {
    void this.downloadPng(pngFilename(this.title() || this.label()));
  }

  /** Saves the plot as a PNG file with the title, the sample and the date drawn above it. */
  async downloadPng(filename: string): Promise<void> {
    const plotly = await this.loader.load();
    const element = this.host().nativeElement;
    const image = await plotly.toImage(element, {
      format: 'png',
      width: PNG_SIZE.width,
      height: PNG_SIZE.height,
    });
    const dark = this.theme.dark();
    const blob = await stampedPng(
      image,
      { title: this.title() || this.label(), sample: this.sample(), date: new Date() },
      {
        background: dark ? PLOT_BACKGROUND.dark : PLOT_BACKGROUND.light,
        text: resolvedColour(element, '--mat-sys-on-surface', dark ? '#e3e2e6' : '#1b1b1f'),
      },
    );
    saveBlob(blob, filename.endsWith('.png') ? filename : `${filename}.png`);
  }

  private async draw(
    element: HTMLElement,
    data: unknown[],
    layout: Record<string, unknown>,
    selectable: boolean,
    yType: 'log' | 'linear' | null,
    dark: boolean,
  ): Promise<void> {
    const turn = ++this.drawn;
    const figure = prepareFigure(data, layout, {
      dark,
      // Asked only when a trace is long enough for WebGL: a first WebGL context costs a frame.
      webgl: hasLongTrace(data) && hasWebgl(element.ownerDocument),
      yType,
    });
    this.note.set(thinningNote(figure.thinned));
    this.logRanges = figure.logRanges;
    const yAxis = figure.layout['yaxis'] as Record<string, unknown> | undefined;
    this.yIsLog.set(yAxis?.['type'] === 'log');
    const plotly = await this.loader.load();
    await afterPaint();
    // The first draw of a plot on screen goes at once; one off screen, and a redraw, wait for
    // idle time, so the plot being read, and the reader's input, come first.
    if (turn === this.drawn && (this.ready() || !onScreen(element))) await whenIdle();
    // A newer draw (inputs changed meanwhile) supersedes this one; a plot gone draws nothing.
    if (turn !== this.drawn || this.destroyed) return;
    const text = resolvedColour(element, '--mat-sys-on-surface', '#1b1b1b');
    const grid = resolvedColour(element, '--mat-sys-outline-variant', '#cccccc');
    const axis = { gridcolor: grid, zerolinecolor: grid, linecolor: grid, automargin: true };
    const merged: Record<string, unknown> = {
      font: { family: 'IBM Plex Sans, sans-serif', color: text, size: 13 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      margin: { l: 70, r: 20, t: 24, b: 56 },
      legend: { orientation: 'h', y: -0.22 },
      dragmode: selectable ? 'select' : 'zoom',
      selectdirection: 'h',
      ...figure.layout,
      xaxis: { ...axis, ...(figure.layout['xaxis'] as object) },
      yaxis: { ...axis, ...(figure.layout['yaxis'] as object) },
    };
    // Rhotrace's toolbar replaces plotly's mode bar.
    const config = { responsive: true, displaylogo: false, displayModeBar: false };
    const plotted: PlotlyHTMLElement = await plotly.react(element, figure.data, merged, config);
    this.ready.set(true);
    if (!this.listening) {
      this.listening = true;
      plotted.on('plotly_selected', (event) => this.emitSelection(event as PlotlySelectedEvent));
      plotted.on('plotly_relayout', (event) => {
        if (typeof event !== 'object' || event === null) return;
        const update: Record<string, unknown> = {};
        for (const name of ['xaxis', 'yaxis'] as const) {
          if (plotted.layout?.[name]?.type !== 'log') continue;
          Object.assign(update, zoomedLogTicks(event, name, this.logRanges[name]));
        }
        if (Object.keys(update).length > 0) void plotly.relayout(plotted, update);
      });
    }
  }

  private emitSelection(event: PlotlySelectedEvent | undefined): void {
    if (!event) return;
    let range = event.range?.x;
    if (!range && event.points && event.points.length > 0) {
      const xs = event.points.map((p) => p.x);
      range = [Math.min(...xs), Math.max(...xs)];
    }
    if (range) this.selected.emit({ xMin: Math.min(...range), xMax: Math.max(...range) });
  }
}
