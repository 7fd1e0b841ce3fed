import type { DopingInput, ModelCurveRequest, ModelCurveResponse } from '@rhotrace/api-types';
import { type Observable, catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';

/** What the curve panel shows: the latest curve, or why there is none, and whether one is coming. */
export interface CurveState {
  curve: ModelCurveResponse | null;
  problem: string | null;
  loading: boolean;
}

/** Pause after the last keystroke before asking for a curve. */
export const CURVE_DEBOUNCE_MS = 150;

/**
 * Turns parameter edits into model-curve requests: waits for a pause in typing, then asks; a
 * newer edit cancels the request in flight (switchMap), so at most one request is ever open.
 */
export function modelCurveStream(
  doping$: Observable<DopingInput | null>,
  base: Omit<ModelCurveRequest, 'doping'>,
  fetch: (body: ModelCurveRequest) => Observable<ModelCurveResponse>,
  debounceMs = CURVE_DEBOUNCE_MS,
): Observable<CurveState> {
  return doping$.pipe(
    debounceTime(debounceMs),
    switchMap((doping) => {
      if (doping === null) {
        return of<CurveState>({
          curve: null,
          problem: 'Fix the highlighted parameters to draw the model.',
          loading: false,
        });
      }
      return fetch({ ...base, doping }).pipe(
        map((curve): CurveState => ({ curve, problem: null, loading: false })),
        catchError((err: unknown) =>
          of<CurveState>({
            curve: null,
            problem:
              err instanceof ApiError ? err.message : 'The model curve could not be computed.',
            loading: false,
          }),
        ),
        startWith<CurveState>({ curve: null, problem: null, loading: true }),
      );
    }),
  );
}
