import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** How often the elapsed time is redrawn, ms. */
const TICK_MS = 200;

/**
 * Work on its way (a fit, a save): an indeterminate bar, the time it has taken so far and a
 * Cancel button. The fit reports no progress of its own while it runs, so the bar does not
 * pretend to know how far it is.
 */
@Component({
  selector: 'rt-fit-progress',
  imports: [MatButtonModule, MatProgressBarModule],
  template: `
    <div class="progress" role="status">
      <mat-progress-bar mode="indeterminate" [attr.aria-label]="what()" />
      <div class="rt-row">
        <span class="rt-muted" data-testid="elapsed">{{ what() }}: {{ elapsed() }}</span>
        <button mat-stroked-button type="button" (click)="cancelled.emit()">Cancel</button>
      </div>
    </div>
  `,
  styles: `
    .progress {
      margin: 6px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitProgress {
  /** What is on its way, e.g. "Fitting the model". */
  readonly what = input.required<string>();
  /** When it was asked for (`Date.now()`). */
  readonly startedAt = input.required<number>();
  readonly cancelled = output();

  private readonly now = signal(Date.now());
  protected readonly elapsed = computed(() => {
    const seconds = Math.max(0, (this.now() - this.startedAt()) / 1000);
    return `${seconds.toFixed(1)} s`;
  });

  constructor() {
    const timer = setInterval(() => this.now.set(Date.now()), TICK_MS);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }
}
