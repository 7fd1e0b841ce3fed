import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { FREE_WORDS, type FreeParameter } from '../analysis-labels';
import { AnalysisStore } from '../analysis-store';
import { FitCard } from '../fit-card/fit-card';
import { FitProgress } from '../fit-card/fit-progress';
import { KeepActions } from '../fit-card/keep-actions';

/** The full-model fit (Levenberg–Marquardt) from the parameters drawn above; Keep saves it. */
@Component({
  selector: 'rt-model-fit',
  imports: [MatButtonModule, MatCheckboxModule, FitCard, FitProgress, KeepActions],
  template: `
    <section class="panel" aria-labelledby="model-title">
      <h2 id="model-title" class="rt-section-title">Full-model fit (Levenberg–Marquardt)</h2>
      <p class="rt-muted">
        Starts from the parameters above; tick what the fit may change. The fit is previewed; keep
        it to save it.
      </p>
      <div class="rt-row" role="group" aria-label="Free parameters">
        @for (p of choices; track p) {
          <mat-checkbox [checked]="free().includes(p)" (change)="toggle(p, $event.checked)">{{
            words[p]
          }}</mat-checkbox>
        }
        <button
          mat-flat-button
          type="button"
          (click)="store.previewModel(free())"
          [disabled]="slot().busy || free().length === 0"
        >
          Fit the model
        </button>
      </div>
      @if (slot().busy && slot().startedAt; as started) {
        <rt-fit-progress
          what="Fitting the model"
          [startedAt]="started"
          (cancelled)="store.cancel('model')"
        />
      }
      @if (slot().problem; as p) {
        <p class="problem" role="alert">{{ p }}</p>
      }
      @if (slot().fit; as f) {
        <rt-fit-card [fit]="f" [unit]="store.unit()" />
        <rt-keep-actions slot="model" [fit]="f" />
        @if (f.converged) {
          <button mat-stroked-button type="button" (click)="store.useFitted(f)">
            Use fitted values in the model curve
          </button>
        }
      }
    </section>
  `,
  styleUrl: '../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelFit {
  protected readonly store = inject(AnalysisStore);
  protected readonly slot = this.store.slots.model;
  protected readonly words = FREE_WORDS;
  protected readonly choices = Object.keys(FREE_WORDS) as FreeParameter[];
  protected readonly free = signal<FreeParameter[]>(['donorDensity', 'mobilityScale']);

  protected toggle(parameter: FreeParameter, on: boolean): void {
    this.free.update((list) =>
      on ? [...new Set([...list, parameter])] : list.filter((p) => p !== parameter),
    );
  }
}
