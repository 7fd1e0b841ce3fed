import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import { UNIT_SYMBOL, toKelvin, toUnit } from '../../../shared/temperature-unit';
import { AnalysisStore } from '../analysis-store';
import { FitCard } from '../fit-card/fit-card';
import { FitProgress } from '../fit-card/fit-progress';
import { KeepActions } from '../fit-card/keep-actions';

/** Metal-film fits: a linear TCR about a reference temperature, or Bloch–Grüneisen; Keep saves. */
@Component({
  selector: 'rt-metal-fits',
  imports: [
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    FitProgress,
    FitCard,
    KeepActions,
  ],
  template: `
    <section class="panel" aria-labelledby="metal-title">
      <h2 id="metal-title" class="rt-section-title">Metal film fits</h2>
      <div class="rt-row">
        <mat-form-field>
          <mat-label>Reference temperature</mat-label>
          <input
            matInput
            type="number"
            step="any"
            name="reference"
            [ngModel]="shownReference()"
            (ngModelChange)="setReference($event)"
          />
          <span matTextSuffix>{{ symbol() }}</span>
        </mat-form-field>
        <button
          mat-flat-button
          type="button"
          (click)="store.previewMetal('tcr', referenceK())"
          [disabled]="slot().busy"
        >
          Fit linear TCR
        </button>
        <button
          mat-stroked-button
          type="button"
          (click)="store.previewMetal('bloch-gruneisen', referenceK())"
          [disabled]="slot().busy"
        >
          Fit Bloch–Grüneisen
        </button>
      </div>
      @if (slot().busy && slot().startedAt; as started) {
        <rt-fit-progress what="Fitting" [startedAt]="started" (cancelled)="store.cancel('model')" />
      }
      @if (slot().problem; as p) {
        <p class="problem" role="alert">{{ p }}</p>
      }
      @if (slot().fit; as f) {
        <rt-fit-card [fit]="f" [unit]="store.unit()" />
        <rt-keep-actions slot="model" [fit]="f" />
      }
    </section>
  `,
  styleUrl: '../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MetalFits {
  protected readonly store = inject(AnalysisStore);
  protected readonly slot = this.store.slots.model;
  /** The TCR reference, kelvin: the physics library's default (20 °C) until one is typed. */
  protected readonly referenceK = signal<number>(PHYSICS_DEFAULTS.tcrReferenceK);
  protected readonly symbol = computed(() => UNIT_SYMBOL[this.store.unit()]);
  /** The reference as the input shows it: in the page's unit, to 0.01 of a degree. */
  protected readonly shownReference = computed(() =>
    Number(toUnit(this.referenceK(), this.store.unit()).toFixed(2)),
  );

  protected setReference(value: number | null): void {
    if (value !== null && Number.isFinite(value))
      this.referenceK.set(toKelvin(value, this.store.unit()));
  }
}
