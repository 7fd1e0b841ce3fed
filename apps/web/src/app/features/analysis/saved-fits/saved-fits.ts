import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import type { FitDto } from '@rhotrace/api-types';
import { Confirmer } from '../../../shared/confirm-dialog';
import { EstimateNote } from '../../../shared/estimate-note';
import { formatTemperatureRange } from '../../../shared/temperature-unit';
import { KIND_WORDS } from '../analysis-labels';
import { AnalysisStore } from '../analysis-store';
import { mainResult } from '../main-result';
import { FitCard } from '../fit-card/fit-card';
import { RowCards } from '../../../shared/row-cards';

/** The sweep's saved fits: compare side by side, export as CSV, delete (after a confirmation). */
@Component({
  selector: 'rt-saved-fits',
  imports: [MatButtonModule, MatCheckboxModule, FitCard, EstimateNote, RowCards],
  templateUrl: './saved-fits.html',
  styleUrl: '../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavedFits {
  protected readonly store = inject(AnalysisStore);
  private readonly confirmer = inject(Confirmer);
  protected readonly kindWords = KIND_WORDS;
  protected readonly fits = computed(() => this.store.fits.value() ?? []);

  protected windowOf(f: FitDto): string {
    return f.windowMinK !== null && f.windowMaxK !== null
      ? formatTemperatureRange(f.windowMinK, f.windowMaxK, this.store.unit())
      : 'all readings';
  }

  protected readonly mainResult = mainResult;

  protected remove(f: FitDto): void {
    this.confirmer
      .ask({
        title: `Delete fit ${f.id}?`,
        message: 'It leaves the saved fits of this sweep; the change trail keeps a record of it.',
        confirmWords: 'Delete the fit',
      })
      .subscribe((yes) => {
        if (yes) this.store.deleteFit(f.id);
      });
  }
}
