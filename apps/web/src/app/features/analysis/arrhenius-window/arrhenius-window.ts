import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { formatValue } from '../../../shared/format';
import {
  UNIT_SYMBOL,
  formatTemperatureRange,
  toKelvin,
  toUnit,
} from '../../../shared/temperature-unit';
import { Plot, type PlotSelection } from '../../../shared/plot/plot';
import {
  COMPENSATION_CHOICE_WORDS,
  type CompensationChoice,
  PREFACTOR_CHOICES,
  QUANTITY_WORDS,
  REGIME_WORDS,
} from '../analysis-labels';
import { AnalysisStore } from '../analysis-store';
import { FitCard } from '../fit-card/fit-card';
import { FitProgress } from '../fit-card/fit-progress';
import { KeepActions } from '../fit-card/keep-actions';
import { flaggedArrheniusTrace, flaggedMarks } from '../parts/sweep-faults/flagged-traces';
import { arrheniusFigure } from './arrhenius-figure';

/**
 * The Arrhenius window: ln ρ (or ln σ) against 1000/T. Dragging across the plot, a suggested
 * window or typed bounds preview a fit over that window (the store queues the requests); Keep
 * saves it.
 */
@Component({
  selector: 'rt-arrhenius-window',
  imports: [
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    FitProgress,
    MatSelectModule,
    Plot,
    FitCard,
    KeepActions,
  ],
  templateUrl: './arrhenius-window.html',
  styleUrl: '../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArrheniusWindow {
  protected readonly store = inject(AnalysisStore);
  private readonly plot = viewChild<Plot>('arrheniusPlot');

  protected readonly format = formatValue;
  protected readonly regimeWords = REGIME_WORDS;
  protected readonly prefactorChoices = PREFACTOR_CHOICES;
  protected readonly quantityWords = QUANTITY_WORDS;
  protected readonly quantities = ['resistivity', 'conductivity'] as const;
  protected readonly compensationWords = COMPENSATION_CHOICE_WORDS;
  protected readonly compensationChoices = Object.keys(
    COMPENSATION_CHOICE_WORDS,
  ) as CompensationChoice[];

  protected readonly options = this.store.arrheniusOptions;
  protected readonly slot = this.store.slots.window;
  protected readonly suggestions = computed(
    () => this.store.analysis.value()?.suggestedWindows ?? [],
  );
  protected readonly symbol = computed(() => UNIT_SYMBOL[this.store.unit()]);
  /** The typed bounds (kept in kelvin) follow the window chosen by dragging or a suggestion. */
  protected readonly minK = linkedSignal<number | null>(() => this.store.window()?.minK ?? null);
  protected readonly maxK = linkedSignal<number | null>(() => this.store.window()?.maxK ?? null);
  protected readonly typedProblem = signal<string | null>(null);

  protected readonly figure = computed(() => {
    const analysis = this.store.analysis.value();
    const quantity = this.options().quantity;
    const figure = arrheniusFigure(
      analysis?.arrhenius ?? [],
      quantity,
      this.store.window(),
      this.slot().fit,
      this.store.unit(),
    );
    const marks = flaggedMarks(analysis);
    const flagged = flaggedArrheniusTrace(marks, quantity, this.store.includeFlagged());
    return flagged ? { ...figure, data: [...figure.data, flagged] } : figure;
  });

  /** A drag selects a range of 1000/T; its ends become the window in kelvin. */
  protected onDragged(selection: PlotSelection): void {
    if (selection.xMin <= 0) return;
    this.typedProblem.set(null);
    this.store.previewWindow(1000 / selection.xMax, 1000 / selection.xMin);
  }

  protected range(minK: number, maxK: number): string {
    return formatTemperatureRange(minK, maxK, this.store.unit());
  }

  /** A bound in kelvin as the input shows it: in the page's unit, to 0.01 of a degree. */
  protected shown(kelvin: number | null): number | null {
    return kelvin === null ? null : Number(toUnit(kelvin, this.store.unit()).toFixed(2));
  }

  /** A typed bound in the page's unit, in kelvin (an emptied field is no bound). */
  protected typed(value: number | null): number | null {
    return value === null || !Number.isFinite(value) ? null : toKelvin(value, this.store.unit());
  }

  protected previewTyped(): void {
    const min = this.minK();
    const max = this.maxK();
    if (min === null || max === null) {
      this.typedProblem.set('Give both ends of the window, or drag across the Arrhenius plot.');
      return;
    }
    this.typedProblem.set(null);
    this.store.previewWindow(min, max);
  }

  protected exportPng(): void {
    void this.plot()?.downloadPng(`sweep-${this.store.sweepId()}-arrhenius`);
  }
}
