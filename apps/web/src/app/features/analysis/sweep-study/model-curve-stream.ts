import type {
  DopingInput,
  ModelCurveRequest,
  ModelCurveResponse,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import { type Observable, catchError, debounce, map, of, startWith, switchMap, timer } from 'rxjs';
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
 * Turns parameter edits into model-curve requests: the first parameters (the starting point,
 * nothing typed yet) are asked for at once, so the curve comes with the page's first plot; after
 * that it waits for a pause in typing, then asks. A newer edit cancels the request in flight
 * (switchMap), so at most one request is ever open.
 */
export function modelCurveStream(
  doping$: Observable<(DopingInput & { mobilityScale?: number }) | null>,
  base: Omit<ModelCurveRequest, 'doping'>,
  fetch: (body: ModelCurveRequest) => Observable<ModelCurveResponse>,
  debounceMs = CURVE_DEBOUNCE_MS,
): Observable<CurveState> {
  return doping$.pipe(
    map((doping, index) => ({ doping, index })),
    debounce(({ index }) => (index === 0 ? of(0) : timer(debounceMs))),
    switchMap(({ doping }) => {
      if (doping === null) {
        return of<CurveState>({
          curve: null,
          problem: 'Fix the highlighted parameters to draw the model.',
          loading: false,
        });
      }
      const { mobilityScale, ...d } = doping;
      const scaled = mobilityScale !== undefined && mobilityScale !== 1 ? { mobilityScale } : {};
      return fetch({ ...base, doping: d, ...scaled }).pipe(
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

/** Temperatures drawn for a model curve. */
const CURVE_STEPS = 400;

/** The model curve request of a sweep but its doping: its material over the plots' range. */
export function curveBaseOf(
  a: SweepAnalysisResponse,
  rangeK: { fromK: number; toK: number },
): Omit<ModelCurveRequest, 'doping'> {
  return {
    material: a.sweep.material,
    fromK: Number(rangeK.fromK.toFixed(2)),
    toK: Number(rangeK.toK.toFixed(2)),
    steps: CURVE_STEPS,
  };
}
