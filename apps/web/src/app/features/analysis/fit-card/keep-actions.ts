import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { AnalysisStore } from '../analysis-store';
import { FitProgress } from './fit-progress';
import { type FitSlot, type ShownFit, isSaved } from '../fit-queue';

/** Under a previewed fit: keep it (save it with the sweep) or discard it; once kept, says so. */
@Component({
  selector: 'rt-keep-actions',
  imports: [MatButtonModule, FitProgress],
  template: `
    @if (savingHere() && store.savingStartedAt(); as started) {
      <rt-fit-progress
        what="Fitting again and saving"
        [startedAt]="started"
        (cancelled)="store.cancel(slot())"
      />
    }
    <div class="rt-row actions">
      @if (savedId(); as id) {
        <span class="rt-muted" role="status">Kept as fit {{ id }} (see Saved fits).</span>
      } @else {
        <button
          mat-flat-button
          type="button"
          (click)="store.keep(slot())"
          [disabled]="store.saving() || store.slots[slot()]().busy"
        >
          Keep this fit
        </button>
        <button mat-button type="button" (click)="store.discard(slot())">Discard</button>
      }
    </div>
  `,
  styles: `
    .actions {
      margin-top: 6px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeepActions {
  protected readonly store = inject(AnalysisStore);
  readonly slot = input.required<FitSlot>();
  readonly fit = input.required<ShownFit>();
  /** A save of this slot's fit is on its way. */
  protected readonly savingHere = computed(() => this.store.savingSlot() === this.slot());
  protected readonly savedId = computed(() => {
    const f = this.fit();
    return isSaved(f) ? f.id : null;
  });
}
