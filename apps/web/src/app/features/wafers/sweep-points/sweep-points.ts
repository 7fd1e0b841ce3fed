import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatTableModule } from '@angular/material/table';
import type { SweepSummaryDto } from '@rhotrace/api-types';
import { FormatValuePipe } from '../../../shared/format-value';
import { thinForDisplay } from '../../../shared/plot/decimate';
import { PLOT_ROLES } from '../../../shared/plot/palette';
import { Plot } from '../../../shared/plot/plot';
import { AnalysisApi } from '../../analysis/analysis-api';
import { WafersApi } from '../wafers-api';

/**
 * Sweeps up to this many points are read whole for the wafer page's plot and table; a longer
 * one (a 20 MB file holds about 600,000) would mean tens of megabytes of JSON, so the page plots
 * its temperature-step means instead and leaves every point to the study page and the CSV.
 */
export const WHOLE_SWEEP_POINT_LIMIT = 20_000;

/** Rows of the point table (the CSV has them all). */
const TABLE_ROWS = 200;

/** The shown sweep's points on the wafer page: a plot of ρ(T) and the first stored points. */
@Component({
  selector: 'rt-sweep-points',
  imports: [MatTableModule, FormatValuePipe, Plot],
  templateUrl: './sweep-points.html',
  styles: `
    table {
      width: 100%;
    }
    .small {
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepPoints {
  private readonly wafers = inject(WafersApi);
  private readonly analyses = inject(AnalysisApi);
  readonly summary = input.required<SweepSummaryDto>();
  protected readonly tableRows = TABLE_ROWS;
  protected readonly whole = computed(() => this.summary().pointCount <= WHOLE_SWEEP_POINT_LIMIT);

  protected readonly sweep = rxResource({
    params: () => (this.whole() ? this.summary().id : undefined),
    stream: ({ params }) => this.wafers.sweep(params),
  });
  /** Long sweeps: the analysis's steps (cached on the server, a few kB). */
  protected readonly analysis = rxResource({
    params: () => (this.whole() ? undefined : this.summary().id),
    stream: ({ params }) => this.analyses.analysis(params),
  });

  protected readonly columns = [
    'sequence',
    'temperatureK',
    'currentA',
    'voltageV',
    'resistivityOhmCm',
    'flags',
  ];

  protected readonly plot = computed(() => {
    const points = this.sweep.value()?.points;
    const steps = this.analysis.value()?.steps;
    if (points) {
      // SVG markers only (no WebGL); long sweeps are thinned for display, never for analysis.
      const { shown } = thinForDisplay(
        points,
        (p) => p.temperatureK,
        (p) => p.resistivityOhmCm,
        'measured',
      );
      return figure(
        'measured ρ',
        shown.map((p) => p.temperatureK),
        shown.map((p) => p.resistivityOhmCm),
        shown.length < points.length ? 4 : 6,
      );
    }
    if (steps) {
      return figure(
        'step mean of ρ',
        steps.map((s) => s.temperatureK),
        steps.map((s) => s.resistivityOhmCm),
        4,
      );
    }
    return null;
  });
}

function figure(name: string, x: number[], y: number[], size: number) {
  return {
    data: [
      {
        type: 'scatter',
        mode: 'markers',
        name,
        x,
        y,
        marker: { color: PLOT_ROLES.measured, size },
        hovertemplate: '%{x:.2f} K: %{y:.4g} Ω·cm<extra></extra>',
      },
    ],
    layout: {
      xaxis: { title: { text: 'Temperature (K)' } },
      yaxis: { title: { text: 'Resistivity (Ω·cm)' }, type: 'log' },
      showlegend: false,
    },
  };
}
