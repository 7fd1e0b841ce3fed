import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { AnalysisStore } from '../analysis-store';
import { FitProgress } from './fit-progress';
import { type ShownFit, isSaved } from '../fit-queue';
import type { SlotPanels } from '../fit-slots';

/**
 * Under a previewed fit: keep it (save it with the sweep) or discard it; once kept, says so. The
 * slot belongs to the study's own panels unless `panels` names others (the Hall part's).
 */
@Component({
  selector: 'rt-keep-actions',
  imports: [MatButtonModule, FitProgress],
  template: `
    @if (savingHere() && owner().savingStartedAt(); as started) {
      <rt-fit-progress
        what="Fitting again and saving"
        [startedAt]="started"
        (cancelled)="owner().cancel(slot())"
      />
    }
    <div class="rt-row actions">
      @if (savedId(); as id) {
        <span class="rt-muted" role="status">Kept as fit {{ id }} (see Saved fits).</span>
      } @else {
        <button
          mat-flat-button
          type="button"
          (click)="owner().keep(slot())"
          [disabled]="owner().saving() || slotBusy()"
        >
          Keep this fit
        </button>
        <button mat-button type="button" (click)="owner().discard(slot())">Discard</button>
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
  private readonly study = inject(AnalysisStore);
  readonly slot = input.required<string>();
  readonly fit = input.required<ShownFit>();
  readonly panels = input<SlotPanels>();
  protected readonly owner = computed<SlotPanels>(() => this.panels() ?? this.study.panels);
  protected readonly slotBusy = computed(() => this.owner().slots[this.slot()]?.().busy ?? false);
  /** A save of this slot's fit is on its way. */
  protected readonly savingHere = computed(() => this.owner().savingSlot() === this.slot());
  protected readonly savedId = computed(() => {
    const f = this.fit();
    return isSaved(f) ? f.id : null;
  });
}
