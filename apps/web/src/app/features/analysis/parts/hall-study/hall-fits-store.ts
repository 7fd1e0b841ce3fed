import { DestroyRef, Injectable, inject, signal } from '@angular/core';
import type { FitRequest } from '@rhotrace/api-types';
import { AnalysisApi } from '../../analysis-api';
import { AnalysisStore } from '../../analysis-store';
import { loaded, studyRequest } from '../../fit-queue';
import { FitSlots } from '../../fit-slots';
import type { HallDoping } from './hall-models';

/** The two Hall fit kinds, each with its own panel. */
export type HallFitKind = 'carrier-density' | 'hall-mobility';

/**
 * Previews and saves of the Hall fits of the studied sweep, with the same queue, cancel and keep
 * actions as the study's other panels (`FitSlots`); a save reloads the study's saved fits.
 * Provided by the Hall part of the study page.
 */
@Injectable()
export class HallFitsStore {
  private readonly api = inject(AnalysisApi);
  private readonly study = inject(AnalysisStore);

  readonly panels = new FitSlots<HallFitKind>(['carrier-density', 'hall-mobility'], {
    preview: (body) => this.api.previewFit(loaded(this.study.sweepId()), body),
    save: (body) => this.api.createFit(loaded(this.study.sweepId()), body),
    previewed: (_kind, fit) => {
      if (fit?.windowMinK != null && fit.windowMaxK != null)
        this.window.set({ minK: fit.windowMinK, maxK: fit.windowMaxK });
    },
    saved: () => this.study.fits.reload(),
    destroyRef: inject(DestroyRef),
  });
  readonly slots = this.panels.slots;
  /** The doping typed in the carrier-density panel (drawn until a fit replaces it). */
  readonly enteredDoping = signal<HallDoping | null>(null);
  /** The fit window of the newest preview, shaded on all three plots. */
  readonly window = signal<{ minK: number; maxK: number } | null>(null);

  /** Previews a Hall fit (flagged readings and the ramp leg follow the study's choice). */
  preview(kind: HallFitKind, request: FitRequest): void {
    this.panels.preview(kind, studyRequest(request, this.study.includeFlagged(), this.study.leg()));
  }
}
