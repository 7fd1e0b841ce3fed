import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import type { CompareResponse } from '@rhotrace/api-types';
import { of } from 'rxjs';
import { TemperatureUnitSetting } from '../../shared/temperature-unit';
import { EstimateNote } from '../../shared/estimate-note';
import { seriesColour } from '../../shared/plot/palette';
import { Plot } from '../../shared/plot/plot';
import { CompareApi } from './compare-api';

/** Overlay: sweeps from several wafers or lots on one plot. */
@Component({
  selector: 'rt-compare',
  imports: [
    MatFormFieldModule,
    MatSelectModule,
    MatCheckboxModule,
    MatButtonModule,
    MatButtonToggleModule,
    Plot,
    EstimateNote,
  ],
  template: `
    <div class="rt-page">
      <h1 class="rt-page-title">Overlay</h1>
      <div class="rt-row">
        <mat-form-field class="lots">
          <mat-label>Lots</mat-label>
          <mat-select multiple [value]="lotIds()" (valueChange)="lotIds.set($event)">
            @for (l of lots.value() ?? []; track l.id) {
              <mat-option [value]="l.id">{{ l.code }} ({{ l.material }})</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-button-toggle-group
          [value]="unit()"
          (change)="unitSetting.set($event.value)"
          aria-label="Temperature unit"
          hideSingleSelectionIndicator
        >
          <mat-button-toggle value="K">K</mat-button-toggle>
          <mat-button-toggle value="C">°C</mat-button-toggle>
        </mat-button-toggle-group>
        <button
          mat-button
          type="button"
          (click)="plot()?.downloadPng('overlay')"
          [disabled]="!figure()"
        >
          Save as PNG
        </button>
      </div>
      @if ((choices.value() ?? []).length > 0) {
        <fieldset class="choices">
          <legend>Sweeps to overlay</legend>
          @for (c of choices.value() ?? []; track c.sweep.id) {
            <mat-checkbox
              [checked]="chosen().includes(c.sweep.id)"
              (change)="toggle(c.sweep.id, $event.checked)"
            >
              {{ c.lotCode }} · Wafer {{ c.wafer.number }} · {{ c.sweep.originalName }}
            </mat-checkbox>
          }
        </fieldset>
      } @else if (lotIds().length > 0 && !choices.isLoading()) {
        <p class="rt-muted">These lots have no sweeps yet.</p>
      }
      @if (figure(); as f) {
        <rt-plot
          #plot
          [data]="f.data"
          [layout]="f.layout"
          label="Resistivity against temperature for the chosen sweeps"
        />
        <rt-estimate-note />
      } @else {
        <p class="rt-muted">Choose lots, then the sweeps to draw.</p>
      }
    </div>
  `,
  styles: `
    .lots {
      width: 360px;
      max-width: 100%;
    }
    .choices {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
      margin-bottom: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Compare {
  private readonly api = inject(CompareApi);
  protected readonly plot = viewChild<Plot>('plot');

  /** `?lot=ID` starts with that lot chosen. */
  readonly lot = input<string>();
  protected readonly lotIds = signal<number[]>([]);
  protected readonly chosen = signal<number[]>([]);
  /** `?sweeps=1,2,3` starts with those sweeps drawn; the address follows the choice. */
  readonly sweeps = input<string>();
  private readonly router = inject(Router);
  protected readonly unitSetting = inject(TemperatureUnitSetting);
  protected readonly unit = this.unitSetting.unit;
  protected readonly lots = rxResource({ stream: () => this.api.lots() });
  protected readonly choices = rxResource({
    params: () => (this.lots.value() ?? []).filter((l) => this.lotIds().includes(l.id)),
    stream: ({ params }) => this.api.sweepsOfLots(params),
  });
  protected readonly curves = rxResource({
    params: () => this.chosen(),
    stream: ({ params }) => (params.length === 0 ? of(null) : this.api.compare(params)),
  });
  /**
   * The curves drawn: the newest answer, kept while the next one loads. Ticking boxes quickly
   * used to drop the plot on every tick (a loading resource has no value) and redraw it, racing
   * plotly's drawing of the one just removed; a failed answer draws nothing rather than throwing.
   */
  private readonly shownCurves = linkedSignal<
    CompareResponse | null | undefined,
    CompareResponse | null
  >({
    source: () =>
      this.curves.isLoading() ? undefined : this.curves.hasValue() ? this.curves.value() : null,
    computation: (next, previous) => (next === undefined ? (previous?.value ?? null) : next),
  });
  protected readonly figure = computed(() => {
    const data = this.shownCurves();
    if (!data) return null;
    const x = data.temperaturesK.map((k) => (this.unit() === 'K' ? k : k - 273.15));
    return {
      data: data.curves.map((c, i) => ({
        type: 'scatter',
        mode: 'lines+markers',
        name: `${c.lotCode} W${c.waferNumber} (#${c.sweepId})`,
        x,
        y: c.resistivityOhmCm,
        line: { color: seriesColour(i), width: 2 },
        marker: {
          color: seriesColour(i),
          size: 4,
          symbol: ['circle', 'square', 'diamond', 'triangle-up', 'cross'][i % 5],
        },
        connectgaps: false,
      })),
      layout: {
        xaxis: { title: { text: this.unit() === 'K' ? 'Temperature (K)' : 'Temperature (°C)' } },
        yaxis: { title: { text: 'Resistivity (Ω·cm)' }, type: 'log', exponentformat: 'power' },
      },
    };
  });

  constructor() {
    effect(() => {
      const ids = (this.sweeps() ?? '')
        .split(',')
        .map(Number)
        .filter((n) => n > 0);
      const same = untracked(() => this.chosen().join(',')) === ids.join(',');
      if (ids.length > 0 && !same) untracked(() => this.chosen.set(ids));
    });
    // The address carries the sweeps drawn, so the view can be shared.
    effect(() => {
      const ids = this.chosen();
      void this.router.navigate([], {
        queryParams: { sweeps: ids.length > 0 ? ids.join(',') : null },
        queryParamsHandling: 'merge',
        replaceUrl: true,
      });
    });
    effect(() => {
      const id = this.lot();
      if (id) untracked(() => this.lotIds.set([Number(id)]));
    });
    // Start with every sweep of a lot opened from its page.
    effect(() => {
      const choices = this.choices.value();
      if (choices && this.lot() && untracked(() => this.chosen().length === 0)) {
        untracked(() => this.chosen.set(choices.slice(0, 8).map((c) => c.sweep.id)));
      }
    });
  }

  protected toggle(id: number, on: boolean): void {
    this.chosen.update((list) => (on ? [...list, id] : list.filter((x) => x !== id)));
  }
}
