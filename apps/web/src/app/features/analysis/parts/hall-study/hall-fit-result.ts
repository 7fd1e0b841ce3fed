import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { FitCard } from '../../fit-card/fit-card';
import { FitProgress } from '../../fit-card/fit-progress';
import { KeepActions } from '../../fit-card/keep-actions';
import { type HallFitKind, HallFitsStore } from './hall-fits-store';

/**
 * Under a Hall fit panel's inputs, as under the study's other fit panels: the fit on its way
 * (elapsed time, Cancel), why it failed, or the fit with its keep and discard actions.
 */
@Component({
  selector: 'rt-hall-fit-result',
  imports: [FitCard, FitProgress, KeepActions],
  template: `
    @if (slot().busy && slot().startedAt; as started) {
      <rt-fit-progress
        [what]="what()"
        [startedAt]="started"
        (cancelled)="store.panels.cancel(kind())"
      />
    }
    @if (slot().problem; as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    @if (slot().fit; as f) {
      <rt-fit-card [fit]="f" />
      <rt-keep-actions [slot]="kind()" [fit]="f" [panels]="store.panels" />
    }
  `,
  styleUrl: '../../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallFitResult {
  protected readonly store = inject(HallFitsStore);
  readonly kind = input.required<HallFitKind>();
  /** What the progress line says while the fit runs, e.g. "Fitting n(T)". */
  readonly what = input.required<string>();
  protected readonly slot = computed(() => this.store.slots[this.kind()]());
}
