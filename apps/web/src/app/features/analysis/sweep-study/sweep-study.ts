import { ChangeDetectionStrategy, Component, effect, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { formatValue, geometryWords } from '../../../shared/format';
import { formatTemperatureRange } from '../../../shared/temperature-unit';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { AnalysisStore } from '../analysis-store';
import { ArrheniusWindow } from '../arrhenius-window/arrhenius-window';
import { HallStudy } from '../parts/hall-study/hall-study';
import { MetalFits } from '../metal-fits/metal-fits';
import { ModelFit } from '../model-fit/model-fit';
import { ModelOverlay } from '../model-overlay/model-overlay';
import { SavedFits } from '../saved-fits/saved-fits';
import { SweepFaults } from '../parts/sweep-faults/sweep-faults';

import { MapView } from '../../maps/map-view/map-view';
import { SkipTarget } from '../../../shared/skip-target';
/**
 * Studying one sweep: the page around its parts (model overlay, Arrhenius window, full-model or
 * metal fits, saved fits). The parts share one `AnalysisStore`, provided here.
 */
@Component({
  selector: 'rt-sweep-study',
  imports: [
    SkipTarget,
    MatButtonModule,
    MatCheckboxModule,
    MatProgressBarModule,
    RouterLink,
    ModelOverlay,
    ArrheniusWindow,
    ModelFit,
    MetalFits,
    SavedFits,
    MapView,
    HallStudy,
    SweepFaults,
  ],
  providers: [AnalysisStore],
  templateUrl: './sweep-study.html',
  styleUrl: './sweep-study.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepStudy {
  protected readonly store = inject(AnalysisStore);
  /** The sweep id from the route. */
  readonly id = input.required<string>();
  protected readonly format = formatValue;
  protected readonly geometry = geometryWords;
  protected range(minK: number | null, maxK: number | null): string {
    return formatTemperatureRange(minK, maxK, this.store.unit());
  }

  constructor() {
    // Fetch and evaluate plotly while the sweep's data are on their way, not after.
    inject(PlotlyLoader).preload();
    effect(() => this.store.load(Number(this.id())));
  }
}
