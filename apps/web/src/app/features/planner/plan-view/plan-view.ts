import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';
import type { PlannerResponse } from '@rhotrace/api-types';
import { Downloader } from '../../../shared/download';
import { FormatLengthPipe, FormatValuePipe } from '../../../shared/format-value';
import { Plot } from '../../../shared/plot/plot';
import { planCsv } from '../plan-csv';
import { planFigure } from './plan-figure';
import { siValue } from '../../../shared/si-value';

/**
 * A measurement plan: the summary (duration, current ranges), its cautions and warnings, the
 * figure of expected rho(T) and V(T) with the meter's window, the step table, what it was
 * computed from, and the CSV export for the station. `compact` leaves out the figure.
 */
@Component({
  selector: 'rt-plan-view',
  imports: [MatButtonModule, MatTableModule, FormatValuePipe, FormatLengthPipe, Plot],
  templateUrl: './plan-view.html',
  styles: `
    .summary {
      margin: 8px 0;
    }
    .cautions li {
      margin-bottom: 4px;
    }
    .warning {
      color: var(--mat-sys-error);
    }
    table {
      min-width: 640px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanView {
  private readonly downloader = inject(Downloader);

  readonly plan = input.required<PlannerResponse>();
  readonly compact = input(false);
  readonly exportName = input('measurement-plan.csv');

  protected readonly si = siValue;
  protected readonly columns = [
    'temperatureK',
    'rho',
    'regime',
    'current',
    'voltage',
    'power',
    'limit',
  ];
  protected readonly figure = computed(() => planFigure(this.plan()));
  protected readonly hours = computed(() => (this.plan().estimatedDurationS / 3600).toFixed(1));
  protected readonly first = computed(() => this.plan().steps[0]!);
  protected readonly last = computed(() => this.plan().steps[this.plan().steps.length - 1]!);

  protected exportCsv(): void {
    this.downloader.saveText(planCsv(this.plan()), this.exportName());
  }
}
