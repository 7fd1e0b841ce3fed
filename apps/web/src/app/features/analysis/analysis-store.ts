import { DestroyRef, Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { rxResource, takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { type DopingInput, type FitRequest, METAL_FILMS } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import { ReplaySubject, filter, switchMap } from 'rxjs';
import { AnalysisApi } from './analysis-api';
import type { ArrheniusOptions, FreeParameter } from './analysis-labels';
import { type FitSlot, type ShownFit, loaded, studyRequest } from './fit-queue';
import { FitSlots } from './fit-slots';
import { type FittedOverlay, fittedOverlayOf } from './model-overlay/fitted-overlay';
import { startingPointResource } from './sweep-study/starting-point';
import { fitsToDraw } from './fitted-curve';
import { type CurveState, curveBaseOf, modelCurveStream } from './sweep-study/model-curve-stream';
import { type TemperatureUnit, TemperatureUnitSetting } from '../../shared/temperature-unit';
import { plotRangeK } from './sweep-study/study-plots';

/**
 * The study of one sweep: its data, the model curve, fit previews and saved fits. Provided by the
 * study page; its parts read the signals and call the methods. Previews queue (a second drag waits
 * for the first, see `queuedFits`), a save ignores repeats while one runs (`exhaustMap`), and the
 * model curve follows the newest parameters (`switchMap`).
 */
@Injectable()
export class AnalysisStore {
  private readonly api = inject(AnalysisApi);
  private readonly unitSetting = inject(TemperatureUnitSetting);

  readonly sweepId = signal<number | null>(null);
  /** The ramp leg studied: null for the API's default (the first leg with 5 steps). */
  readonly leg = signal<number | 'all' | null>(null);
  readonly analysis = rxResource({
    params: () => {
      const id = this.sweepId();
      return id === null ? undefined : { id, leg: this.leg() };
    },
    stream: ({ params }) => this.api.analysis(params.id, params.leg),
  });
  readonly fits = rxResource({
    params: () => this.sweepId() ?? undefined,
    stream: ({ params }) => this.api.fits(params),
  });
  readonly isMetal = computed(() =>
    (METAL_FILMS as readonly string[]).includes(this.analysis.value()?.sweep.material ?? ''),
  );
  /** The temperature range every ρ(T) plot and the model curve cover: the sweep's, plus a margin. */
  readonly rangeK = computed(() => {
    const s = this.analysis.value()?.sweep;
    return plotRangeK(s?.minTemperatureK ?? null, s?.maxTemperatureK ?? null);
  });
  /** Where the model starts, and why (semiconductors only). */
  readonly start = startingPointResource(this.analysis.value, this.isMetal);
  readonly initial = computed<DopingInput | null>(() => this.start.value()?.doping ?? null);

  // The model curve, redrawn as parameters are typed.
  /** The unit of every temperature the page shows or takes (the user's setting). */
  readonly unit = this.unitSetting.unit;
  readonly doping = signal<DopingInput | null>(null);
  readonly curveState = signal<CurveState>({ curve: null, problem: null, loading: false });
  private readonly doping$ = new ReplaySubject<(DopingInput & { mobilityScale?: number }) | null>(
    1,
  );
  /** The full-model fit the overlay is drawn from; null while it shows the values typed. */
  readonly fittedOverlay = signal<FittedOverlay | null>(null);

  // Fits: the options, the chosen window, one slot per panel, the saves.
  readonly arrheniusOptions = signal<ArrheniusOptions>({
    quantity: PHYSICS_DEFAULTS.arrheniusQuantity,
    prefactorExponent: PHYSICS_DEFAULTS.arrheniusPrefactorExponent,
    compensation: 'inferred',
  });
  readonly includeFlagged = signal(false);
  readonly window = signal<{ minK: number; maxK: number } | null>(null);
  /** The Arrhenius-window and model panels' previews and saves. */
  readonly panels = new FitSlots<FitSlot>(['window', 'model'], {
    preview: (body) => this.api.previewFit(loaded(this.sweepId()), body),
    save: (body) => this.api.createFit(loaded(this.sweepId()), body),
    // The API clips a window reaching past the data; shade and type what was fitted.
    previewed: (slot, fit) => {
      if (slot === 'window' && fit?.windowMinK != null && fit.windowMaxK != null)
        this.window.set({ minK: fit.windowMinK, maxK: fit.windowMaxK });
    },
    saved: () => this.fits.reload(),
    cleared: (slot) => {
      if (slot === 'window') this.window.set(null);
    },
    destroyRef: inject(DestroyRef),
  });
  readonly slots = this.panels.slots;
  /** The slot whose fit is being saved, null when none is. */
  readonly savingSlot = this.panels.savingSlot;
  readonly saving = this.panels.saving;
  /** When the save on its way was asked for (`Date.now()`), null when none is. */
  readonly savingStartedAt = this.panels.savingStartedAt;
  /** Saved fits chosen for side-by-side comparison. */
  readonly compared = signal<number[]>([]);
  readonly comparedFits = computed(() =>
    (this.fits.value() ?? []).filter((f) => this.compared().includes(f.id)),
  );
  /** The fits drawn on the ρ(T) plot: the two panels' fits, then the saved ones compared. */
  readonly drawnFits = computed(() =>
    fitsToDraw([this.slots.window().fit, this.slots.model().fit], this.comparedFits()),
  );

  constructor() {
    toObservable(this.analysis.value)
      .pipe(
        filter((a) => a !== undefined),
        switchMap((a) =>
          modelCurveStream(this.doping$, curveBaseOf(a, untracked(this.rangeK)), (body) =>
            this.api.modelCurve(body),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => this.curveState.set(state));
    // Metal films have no doping to edit: draw their reference curve once.
    effect(() => {
      if (this.isMetal()) untracked(() => this.setDoping({ donorDensity: 0, acceptorDensity: 0 }));
    });
  }

  /** Studies another sweep: everything shown before is forgotten. */
  load(sweepId: number): void {
    if (this.sweepId() === sweepId) return;
    this.leg.set(null);
    this.sweepId.set(sweepId);
    this.window.set(null);
    this.compared.set([]);
    this.panels.clear();
  }

  /** Shows and takes every temperature in `unit` (remembered for the user). */
  setUnit(unit: TemperatureUnit): void {
    this.unitSetting.set(unit);
  }

  setDoping(doping: DopingInput | null): void {
    this.doping.set(doping);
    const scale = this.fittedOverlay()?.mobilityScale ?? 1;
    this.doping$.next(doping && scale !== 1 ? { ...doping, mobilityScale: scale } : doping);
  }

  /** Draws the model from a full-model fit's values (its mobility scale too). */
  useFitted(fit: ShownFit): void {
    this.fittedOverlay.set(fittedOverlayOf(fit));
  }

  /** A value typed into the model's parameters: the overlay shows typed values again. */
  markEntered(): void {
    this.fittedOverlay.set(null);
    this.setDoping(this.doping());
  }

  /** Previews an Arrhenius fit over [minK, maxK] (either order), rounded to 0.01 K. */
  previewWindow(minK: number, maxK: number): void {
    const lo = Number(Math.min(minK, maxK).toFixed(2));
    const hi = Number(Math.max(minK, maxK).toFixed(2));
    this.window.set({ minK: lo, maxK: hi });
    const o = this.arrheniusOptions();
    this.preview('window', {
      kind: 'arrhenius',
      minK: lo,
      maxK: hi,
      quantity: o.quantity,
      prefactorExponent: o.prefactorExponent,
      ...(o.compensation === 'inferred' ? {} : { compensated: o.compensation === 'compensated' }),
    });
  }

  /** Changes an Arrhenius option; a window already chosen is previewed again with it. */
  setArrheniusOptions(change: Partial<ArrheniusOptions>): void {
    this.arrheniusOptions.update((o) => ({ ...o, ...change }));
    const w = this.window();
    if (w) this.previewWindow(w.minK, w.maxK);
  }

  /** Fits flagged readings too (or not); a window already chosen is previewed again. */
  setIncludeFlagged(on: boolean): void {
    this.includeFlagged.set(on);
    const w = this.window();
    if (w) this.previewWindow(w.minK, w.maxK);
  }

  /** Previews a full-model fit from the parameters drawn (or the starting point). */
  previewModel(free: FreeParameter[]): void {
    const doping = this.doping() ?? this.initial();
    if (!doping) return;
    this.preview('model', { kind: 'model', initial: { ...doping, mobilityScale: 1 }, free });
  }

  /** Previews a metal-film fit: linear TCR about `referenceK`, or Bloch–Grüneisen. */
  previewMetal(kind: 'tcr' | 'bloch-gruneisen', referenceK: number): void {
    this.preview('model', kind === 'tcr' ? { kind, referenceK } : { kind });
  }

  /** Saves the previewed fit of a slot; a second click while saving is ignored. */
  keep(slot: FitSlot): void {
    this.panels.keep(slot);
  }

  /** Stops the slot's fit or save on its way (see `FitSlots.cancel`). */
  cancel(slot: FitSlot): void {
    this.panels.cancel(slot);
  }

  /** Forgets a slot's preview (a saved fit is deleted from the saved list instead). */
  discard(slot: FitSlot): void {
    this.panels.discard(slot);
  }

  deleteFit(id: number): void {
    this.api.deleteFit(id).subscribe(() => {
      this.compared.update((list) => list.filter((x) => x !== id));
      this.panels.forget(id);
      this.fits.reload();
    });
  }

  toggleCompared(id: number, on: boolean): void {
    this.compared.update((list) => (on ? [...list, id] : list.filter((x) => x !== id)));
  }

  saveFitsCsv(): Promise<void> {
    return this.api.saveFitsCsv(loaded(this.sweepId()));
  }

  saveReport(): Promise<void> {
    return this.api.saveReport(loaded(this.sweepId()));
  }

  private preview(slot: FitSlot, request: FitRequest): void {
    this.panels.preview(slot, studyRequest(request, this.includeFlagged(), this.leg()));
  }
}
