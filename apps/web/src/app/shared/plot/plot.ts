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
import { PlotlyLoader } from './plotly-loader';

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

/** A Plotly chart; loads plotly lazily and redraws when its inputs change. */
@Component({
  selector: 'rt-plot',
  template: `
    <figure class="figure" [attr.aria-label]="label()">
      <div #host class="host"></div>
      @if (!ready()) {
        <p class="loading">Drawing the plot…</p>
      }
      @if (caption()) {
        <figcaption>{{ caption() }}</figcaption>
      }
    </figure>
  `,
  styles: `
    :host {
      display: block;
    }
    .figure {
      margin: 0;
      position: relative;
    }
    .host {
      width: 100%;
      height: var(--rt-plot-height, 380px);
    }
    .loading {
      position: absolute;
      inset: 40% 0 auto;
      text-align: center;
      color: var(--mat-sys-on-surface-variant);
    }
    figcaption {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
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
  /** When true, dragging selects an x range (box select) instead of zooming. */
  readonly selectable = input(false);
  readonly selected = output<PlotSelection>();

  protected readonly ready = signal(false);
  private listening = false;

  constructor() {
    afterRenderEffect(() => {
      const data = this.data();
      const layout = this.layout();
      const selectable = this.selectable();
      // Read so a change of scheme redraws with that scheme's colours.
      this.theme.dark();
      const element = this.host().nativeElement;
      void this.draw(element, data, layout, selectable);
    });
    inject(DestroyRef).onDestroy(() => {
      void this.loader.load().then((p) => p.purge(this.host().nativeElement));
    });
  }

  /** Saves the plot as a PNG file. */
  async downloadPng(filename: string): Promise<void> {
    const plotly = await this.loader.load();
    await plotly.downloadImage(this.host().nativeElement, {
      format: 'png',
      filename,
      width: 1200,
      height: 700,
    });
  }

  private async draw(
    element: HTMLElement,
    data: unknown[],
    layout: Record<string, unknown>,
    selectable: boolean,
  ): Promise<void> {
    const plotly = await this.loader.load();
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
      ...layout,
      xaxis: { ...axis, ...(layout['xaxis'] as object) },
      yaxis: { ...axis, ...(layout['yaxis'] as object) },
    };
    const config = {
      responsive: true,
      displaylogo: false,
      modeBarButtonsToRemove: ['sendDataToCloud', 'lasso2d'],
    };
    const plotted: PlotlyHTMLElement = await plotly.react(element, data, merged, config);
    this.ready.set(true);
    if (!this.listening) {
      this.listening = true;
      plotted.on('plotly_selected', (event) => this.emitSelection(event as PlotlySelectedEvent));
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
