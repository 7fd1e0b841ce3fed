import {
  ChangeDetectionStrategy,
  Component,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import type { HallAnalysis } from '@rhotrace/api-types';
import { HallFitRange } from '../hall-study/hall-fit-range';
import { HallFitResult } from '../hall-study/hall-fit-result';
import { HallFitsStore } from '../hall-study/hall-fits-store';

/**
 * Lattice range of the mobility fit by default: from 150 K up (where phonons dominate in
 * lightly doped silicon; common practice, no source) to the sweep's end.
 */
export const HALL_MOBILITY_FROM_K = 150;

/** The power-law fit of the Hall mobility, mu_H = mu_300 (T / 300)^exponent. */
@Component({
  selector: 'rt-hall-mobility-fit',
  imports: [MatButtonModule, HallFitRange, HallFitResult],
  template: `
    <section class="panel" aria-labelledby="hall-mobility-title">
      <h2 id="hall-mobility-title" class="rt-section-title">Hall mobility fit (power law)</h2>
      <div class="rt-row">
        <rt-hall-fit-range [(minK)]="minK" [(maxK)]="maxK" />
        <span class="rt-spacer"></span>
        <button mat-flat-button type="button" (click)="run()" [disabled]="slot().busy">
          Fit µ_H(T)
        </button>
      </div>
      <p class="rt-muted">
        About −1.5 for acoustic phonons, −2.2 to −2.6 in silicon where optical phonons join in, +1.5
        for ionized impurities.
      </p>
      <rt-hall-fit-result kind="hall-mobility" what="Fitting µ_H(T)" />
    </section>
  `,
  styleUrl: '../../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallMobilityFit {
  protected readonly store = inject(HallFitsStore);
  readonly hall = input.required<HallAnalysis>();
  protected readonly slot = this.store.slots['hall-mobility'];
  protected readonly minK = signal<number | null>(null);
  protected readonly maxK = signal<number | null>(null);

  constructor() {
    effect(() => {
      const steps = this.hall().steps;
      const first = steps[0]?.temperatureK ?? 0;
      const last = steps[steps.length - 1]?.temperatureK ?? 0;
      untracked(() => {
        this.minK.set(Math.max(HALL_MOBILITY_FROM_K, Math.floor(first)));
        this.maxK.set(Math.ceil(last));
      });
    });
  }

  protected run(): void {
    const minK = this.minK();
    const maxK = this.maxK();
    this.store.preview('hall-mobility', {
      kind: 'hall-mobility',
      ...(minK ? { minK } : {}),
      ...(maxK ? { maxK } : {}),
    });
  }
}
