import { type DestroyRef, type Signal, type WritableSignal, computed, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { FitDto, FitPreviewDto, FitRequest } from '@rhotrace/api-types';
import { type Observable, Subject } from 'rxjs';
import {
  EMPTY_SLOT,
  type FitJob,
  type SlotState,
  exclusiveSaves,
  isSaved,
  queuedFits,
} from './fit-queue';

/** What a set of fit slots asks of the page it lives on. */
export interface FitSlotsHost<S extends string> {
  preview: (body: FitRequest) => Observable<FitPreviewDto>;
  save: (body: FitRequest) => Observable<FitDto>;
  /** A shown preview came back (after the slot was updated). */
  previewed?: (slot: S, fit: FitPreviewDto | null) => void;
  /** A fit was stored. */
  saved?: () => void;
  /** A slot was emptied (cancelled or discarded) before its fit came. */
  cleared?: (slot: S) => void;
  destroyRef: DestroyRef;
}

/** What the actions under a fit (progress, keep, discard, cancel) need of its panels. */
export interface SlotPanels {
  readonly slots: Readonly<Record<string, Signal<SlotState>>>;
  readonly savingSlot: Signal<string | null>;
  readonly saving: Signal<boolean>;
  readonly savingStartedAt: Signal<number | null>;
  keep(slot: string): void;
  cancel(slot: string): void;
  discard(slot: string): void;
}

/**
 * The fit panels of one page, each a slot: previews queue (see `queuedFits`), a save ignores
 * repeats while one runs (`exclusiveSaves`), and Cancel aborts whichever is on its way. The sweep
 * study and its Hall part each hold one, so both show the same progress, cancel and keep actions.
 */
export class FitSlots<S extends string> implements SlotPanels {
  readonly slots: Record<S, WritableSignal<SlotState>>;
  /** The slot whose fit is being saved, null when none is. */
  readonly savingSlot = signal<S | null>(null);
  readonly saving = computed(() => this.savingSlot() !== null);
  /** When the save on its way was asked for (`Date.now()`), null when none is. */
  readonly savingStartedAt = signal<number | null>(null);
  private readonly previews$ = new Subject<FitJob<S>>();
  private readonly keeps$ = new Subject<S>();
  private readonly cancels$ = new Subject<S>();

  constructor(
    names: readonly S[],
    private readonly host: FitSlotsHost<S>,
  ) {
    this.slots = Object.fromEntries(names.map((n) => [n, signal<SlotState>(EMPTY_SLOT)])) as Record<
      S,
      WritableSignal<SlotState>
    >;
    this.previews$
      .pipe(queuedFits<S>(host.preview, this.cancels$), takeUntilDestroyed(host.destroyRef))
      .subscribe(({ slot, body, fit, problem, current }) => {
        // An answer to a request since discarded or replaced is not shown.
        if (!current || this.slots[slot]().request !== body) return;
        this.slots[slot].update((s) => ({ ...s, fit, problem, busy: false, startedAt: null }));
        host.previewed?.(slot, fit);
      });
    this.keeps$
      .pipe(
        exclusiveSaves<S>((slot) => this.beginSave(slot), host.save, this.cancels$),
        takeUntilDestroyed(host.destroyRef),
      )
      .subscribe((answer) => {
        this.endSaving();
        if (!answer) return;
        if (answer.fit) host.saved?.();
        // The slot shows the saved fit unless another preview has replaced the one kept.
        if (this.slots[answer.slot]().request !== answer.request) return;
        this.slots[answer.slot].update((s) =>
          answer.fit ? { ...s, fit: answer.fit, problem: null } : { ...s, problem: answer.problem },
        );
      });
  }

  /** Asks for a preview of `body` in `slot`; the slot is busy until the answer comes. */
  preview(slot: S, body: FitRequest): void {
    const asked = { request: body, problem: null, busy: true, startedAt: Date.now() };
    this.slots[slot].update((s) => ({ ...s, ...asked }));
    this.previews$.next({ slot, body });
  }

  /** Saves the previewed fit of a slot; a second click while saving is ignored. */
  keep(slot: S): void {
    this.keeps$.next(slot);
  }

  /**
   * Stops the slot's fit or save on its way: the request is aborted (the API stores nothing for
   * an aborted save) and no answer to it is shown. A preview shown before stays only when the
   * cancelled work was saving it.
   */
  cancel(slot: S): void {
    const saving = this.savingSlot() === slot;
    if (!this.slots[slot]().busy && !saving) return;
    this.cancels$.next(slot);
    if (saving) {
      this.endSaving();
      const problem = 'Saving was cancelled: nothing was stored.';
      this.slots[slot].update((s) => ({ ...s, problem }));
    } else {
      this.slots[slot].set({ ...EMPTY_SLOT, problem: 'The fit was cancelled.' });
      this.host.cleared?.(slot);
    }
  }

  /** Forgets a slot's preview (a saved fit is deleted from the saved list instead). */
  discard(slot: S): void {
    this.slots[slot].set(EMPTY_SLOT);
    this.host.cleared?.(slot);
  }

  /** Empties every slot (another sweep is studied). */
  clear(): void {
    for (const slot of Object.values<WritableSignal<SlotState>>(this.slots)) slot.set(EMPTY_SLOT);
  }

  /** Empties the slot that shows the saved fit `id` (it was deleted). */
  forget(id: number): void {
    for (const slot of Object.values<WritableSignal<SlotState>>(this.slots)) {
      const fit = slot().fit;
      if (fit && isSaved(fit) && fit.id === id) slot.set(EMPTY_SLOT);
    }
  }

  private beginSave(slot: S): FitRequest | null {
    const { request, busy } = this.slots[slot]();
    if (!request || busy) return null;
    this.savingSlot.set(slot);
    this.savingStartedAt.set(Date.now());
    return request;
  }

  private endSaving(): void {
    this.savingSlot.set(null);
    this.savingStartedAt.set(null);
  }
}
