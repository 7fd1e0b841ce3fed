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
import { HALL_AT_300K_NOTE, HallAt300KLine } from '../../shared/hall-at-300k';
import { Plot } from '../../shared/plot/plot';
import { CompareApi } from './compare-api';
import { type OverlayOptions, overlayFigure } from './overlay-figure';

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
    HallAt300KLine,
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
      <div class="rt-row options" role="group" aria-label="How the overlay is drawn">
        <mat-button-toggle-group
          [value]="view()"
          (change)="view.set($event.value)"
          aria-label="Overlay view"
          hideSingleSelectionIndicator
        >
          <mat-button-toggle value="temperature">Against temperature</mat-button-toggle>
          <mat-button-toggle value="arrhenius">Against 1000/T</mat-button-toggle>
        </mat-button-toggle-group>
        <mat-checkbox [checked]="logY()" (change)="logY.set($event.checked)"
          >Log resistivity axis</mat-checkbox
        >
        <mat-checkbox [checked]="normalise()" (change)="normalise.set($event.checked)"
          >Divide each curve by its 23 °C value</mat-checkbox
        >
        <mat-checkbox
          [checked]="showSpec()"
          [disabled]="!specLot() || normalise()"
          (change)="showSpec.set($event.checked)"
          >Spec band{{
            specLot() ? ' of lot ' + specLot()!.code : ' (choose one lot with a spec)'
          }}</mat-checkbox
        >
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
        @if (f.leftOut.length) {
          <p class="rt-muted" role="status">
            Not drawn (no value at 23 °C to divide by): {{ f.leftOut.join('; ') }}.
          </p>
        }
        @if (normalise()) {
          <p class="rt-muted">
            Each curve is divided by its value at 23 °C, read by linear interpolation between the
            two overlay temperatures around 23 °C.
          </p>
        }
        @if (hallCurves().length) {
          <ul class="hall" aria-label="Hall sweeps at 300 K">
            @for (c of hallCurves(); track c.sweepId) {
              <li>
                {{ c.lotCode }} · Wafer {{ c.waferNumber }}: <rt-hall-at-300k [hall]="c.hall" />
              </li>
            }
          </ul>
          <p class="rt-muted">{{ hallNote }}</p>
        }
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
    .options {
      flex-wrap: wrap;
      gap: 8px 16px;
      margin-bottom: 8px;
    }
    .hall {
      margin: 8px 0 0;
      padding-left: 20px;
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
  /** The Hall sweeps among the curves shown, with their values at 300 K. */
  protected readonly hallCurves = computed(() =>
    (this.shownCurves()?.curves ?? []).flatMap((c) => (c.hall ? [{ ...c, hall: c.hall }] : [])),
  );
  protected readonly hallNote = HALL_AT_300K_NOTE;
  protected readonly view = signal<OverlayOptions['view']>('temperature');
  protected readonly logY = signal(true);
  protected readonly normalise = signal(false);
  protected readonly showSpec = signal(false);
  /** The lot whose spec band can be drawn: the one lot chosen, when it states a spec. */
  protected readonly specLot = computed(() => {
    const chosen = (this.lots.value() ?? []).filter((l) => this.lotIds().includes(l.id));
    const only = chosen.length === 1 ? chosen[0]! : null;
    return only && only.specMinOhmCm !== null && only.specMaxOhmCm !== null ? only : null;
  });
  protected readonly figure = computed(() => {
    const data = this.shownCurves();
    if (!data) return null;
    return overlayFigure(data, {
      unit: this.unit(),
      view: this.view(),
      logY: this.logY(),
      normalise: this.normalise(),
      specLot: this.showSpec() ? this.specLot() : null,
    });
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
