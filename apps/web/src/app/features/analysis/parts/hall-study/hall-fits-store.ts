import { Injectable, type WritableSignal, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { FitRequest } from '@rhotrace/api-types';
import { Subject, catchError, exhaustMap, map, of, switchMap } from 'rxjs';
import { ApiError } from '../../../../core/http/api-error';
import { AnalysisApi } from '../../analysis-api';
import { AnalysisStore } from '../../analysis-store';
import { EMPTY_SLOT, type SlotState } from '../../fit-queue';
import type { HallDoping } from './hall-models';

/** The two Hall fit kinds, each with its own panel. */
export type HallFitKind = 'carrier-density' | 'hall-mobility';

/**
 * Previews and saves of the Hall fits of the studied sweep. The newest preview of a kind wins
 * (`switchMap`); a save ignores repeats while one runs (`exhaustMap`) and reloads the study's
 * saved fits. Provided by the Hall part of the study page.
 */
@Injectable()
export class HallFitsStore {
  private readonly api = inject(AnalysisApi);
  private readonly study = inject(AnalysisStore);

  readonly slots: Record<HallFitKind, WritableSignal<SlotState>> = {
    'carrier-density': signal<SlotState>(EMPTY_SLOT),
    'hall-mobility': signal<SlotState>(EMPTY_SLOT),
  };
  /** The doping typed in the carrier-density panel (drawn until a fit replaces it). */
  readonly enteredDoping = signal<HallDoping | null>(null);
  /** The fit window of the newest preview, shaded on all three plots. */
  readonly window = signal<{ minK: number; maxK: number } | null>(null);
  private readonly previews$ = new Subject<{ kind: HallFitKind; body: FitRequest }>();
  private readonly keeps$ = new Subject<HallFitKind>();

  constructor() {
    this.previews$
      .pipe(
        switchMap(({ kind, body }) =>
          this.api.previewFit(this.sweepId(), body).pipe(
            map((fit) => ({ kind, body, fit, problem: null })),
            catchError((err: unknown) =>
              of({ kind, body, fit: null, problem: problemOf(err, 'The fit could not run.') }),
            ),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ kind, body, fit, problem }) => {
        if (this.slots[kind]().request !== body) return;
        this.slots[kind].update((s) => ({ ...s, fit, problem, busy: false }));
        if (fit?.windowMinK != null && fit.windowMaxK != null)
          this.window.set({ minK: fit.windowMinK, maxK: fit.windowMaxK });
      });
    this.keeps$
      .pipe(
        exhaustMap((kind) => {
          const { request, busy } = this.slots[kind]();
          if (!request || busy) return of(null);
          return this.api.createFit(this.sweepId(), request).pipe(
            map((fit) => ({ kind, request, fit, problem: null })),
            catchError((err: unknown) =>
              of({ kind, request, fit: null, problem: problemOf(err, 'The fit was not saved.') }),
            ),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((answer) => {
        if (!answer) return;
        if (answer.fit) this.study.fits.reload();
        if (this.slots[answer.kind]().request !== answer.request) return;
        this.slots[answer.kind].update((s) =>
          answer.fit ? { ...s, fit: answer.fit, problem: null } : { ...s, problem: answer.problem },
        );
      });
  }

  /** Previews a Hall fit (flagged readings follow the study's choice). */
  preview(kind: HallFitKind, request: FitRequest): void {
    const body: FitRequest = this.study.includeFlagged()
      ? { ...request, includeFlagged: true }
      : request;
    this.slots[kind].update((s) => ({ ...s, request: body, problem: null, busy: true }));
    this.previews$.next({ kind, body });
  }

  /** Saves the previewed fit of a kind. */
  keep(kind: HallFitKind): void {
    this.keeps$.next(kind);
  }

  private sweepId(): number {
    const id = this.study.sweepId();
    if (id === null) throw new Error('HallFitsStore: the study has no sweep');
    return id;
  }
}

function problemOf(err: unknown, fallback: string): string {
  return err instanceof ApiError ? err.message : fallback;
}
