import type { FitDto, FitPreviewDto, FitRequest } from '@rhotrace/api-types';
import {
  EMPTY,
  type Observable,
  catchError,
  concatMap,
  defer,
  exhaustMap,
  filter,
  map,
  merge,
  of,
  takeUntil,
  tap,
} from 'rxjs';
import { ApiError } from '../../core/http/api-error';

/** A fit on the page: a preview (nothing stored) or, once kept, the saved fit. */
export type ShownFit = FitPreviewDto | FitDto;

/** True when the fit has been saved. */
export function isSaved(fit: ShownFit): fit is FitDto {
  return 'id' in fit;
}

/** Where on the page a fit is asked for and shown. */
export type FitSlot = 'window' | 'model';

/** One slot's fit: the request behind it, the answer, and whether an answer is on its way. */
export interface SlotState {
  request: FitRequest | null;
  fit: ShownFit | null;
  problem: string | null;
  busy: boolean;
  /** When the answer on its way was asked for (`Date.now()`), for the elapsed time shown. */
  startedAt: number | null;
}

/** A slot with nothing asked for. */
export const EMPTY_SLOT: SlotState = {
  request: null,
  fit: null,
  problem: null,
  busy: false,
  startedAt: null,
};

/** A fit asked for in one place of the page (the Arrhenius window, the full model, ...). */
export interface FitJob<S extends string> {
  slot: S;
  body: FitRequest;
}

/** The answer to a job: the fit, or why there is none; `current` is false once overtaken. */
export interface FitAnswer<S extends string> extends FitJob<S> {
  fit: FitPreviewDto | null;
  problem: string | null;
  /** No newer job for the same slot was asked for while this one ran. */
  current: boolean;
}

/**
 * Runs fit previews one at a time, in the order asked (`concatMap`): a second drag waits for the
 * first instead of racing it, so an older answer can never replace a newer one. A job overtaken by
 * a newer one for the same slot while it waited is skipped, not run. A slot named by `cancel$`
 * drops its waiting job and unsubscribes from its running one (which aborts the request); no
 * answer comes for either.
 */
export function queuedFits<S extends string>(
  run: (body: FitRequest) => Observable<FitPreviewDto>,
  cancel$: Observable<S> = EMPTY,
): (jobs$: Observable<FitJob<S>>) => Observable<FitAnswer<S>> {
  return (jobs$) =>
    defer(() => {
      // Per subscription: the number of the newest job (or cancellation) of each slot.
      const newest = new Map<S, number>();
      let asked = 0;
      const cancels$ = cancel$.pipe(
        tap((slot) => newest.set(slot, ++asked)),
        map(() => null),
      );
      return merge(jobs$, cancels$).pipe(
        filter((job): job is FitJob<S> => job !== null),
        map((job) => {
          asked += 1;
          newest.set(job.slot, asked);
          return { job, number: asked };
        }),
        concatMap(({ job, number }) => {
          if (newest.get(job.slot) !== number) return EMPTY;
          const current = () => newest.get(job.slot) === number;
          const cancelled$ = cancel$.pipe(filter((slot) => slot === job.slot));
          return run(job.body).pipe(
            takeUntil(cancelled$),
            map((fit): FitAnswer<S> => ({ ...job, fit, problem: null, current: current() })),
            catchError((err: unknown) =>
              of<FitAnswer<S>>({
                ...job,
                fit: null,
                problem: err instanceof ApiError ? err.message : 'The fit could not be computed.',
                current: current(),
              }),
            ),
          );
        }),
      );
    });
}

/** The answer to a save: the stored fit, or why there is none. */
export interface SaveAnswer<S extends string> {
  slot: S;
  request: FitRequest;
  fit: FitDto | null;
  problem: string | null;
}

/**
 * Saves one slot's fit at a time: a second Keep while one runs is ignored (`exhaustMap`).
 * `begin` gives the request to save (null: nothing to save, answered with null); a slot named by
 * `cancel$` unsubscribes from its save, which aborts the request, and is answered with null.
 */
export function exclusiveSaves<S extends string>(
  begin: (slot: S) => FitRequest | null,
  run: (body: FitRequest) => Observable<FitDto>,
  cancel$: Observable<S>,
): (slots$: Observable<S>) => Observable<SaveAnswer<S> | null> {
  return (slots$) =>
    slots$.pipe(
      exhaustMap((slot) => {
        const request = begin(slot);
        if (!request) return of(null);
        return run(request).pipe(
          takeUntil(cancel$.pipe(filter((s) => s === slot))),
          map((fit): SaveAnswer<S> => ({ slot, request, fit, problem: null })),
          catchError((err: unknown) =>
            of<SaveAnswer<S>>({
              slot,
              request,
              fit: null,
              problem: err instanceof ApiError ? err.message : 'The fit could not be saved.',
            }),
          ),
        );
      }),
    );
}

/**
 * A fit request with the study's options: flagged readings put back when asked, and the ramp leg
 * studied (the API's default leg when none was picked).
 */
export function studyRequest(
  request: FitRequest,
  includeFlagged: boolean,
  leg: number | 'all' | null,
): FitRequest {
  const flagged: FitRequest = includeFlagged ? { ...request, includeFlagged: true } : request;
  return leg === null ? flagged : { ...flagged, leg };
}

/** The sweep studied; a call before one is loaded is a programming error. */
export function loaded(sweepId: number | null): number {
  if (sweepId === null) throw new Error('AnalysisStore: load a sweep first');
  return sweepId;
}
