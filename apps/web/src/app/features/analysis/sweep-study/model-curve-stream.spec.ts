import { HttpClient, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { DopingInput, ModelCurveRequest, ModelCurveResponse } from '@rhotrace/api-types';
import { Subject } from 'rxjs';
import { type CurveState, modelCurveStream } from './model-curve-stream';

const doping = (n: number): DopingInput => ({ donorDensity: n, acceptorDensity: 0 });
const curve: ModelCurveResponse = {
  kind: 'semiconductor',
  material: 'Si',
  points: [],
  boundaries: { freezeOutBelowK: null, intrinsicAboveK: null },
  modelVersion: 't',
  warnings: [],
};

describe('modelCurveStream', () => {
  let backend: HttpTestingController;
  let http: HttpClient;
  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
    http = TestBed.inject(HttpClient);
    vi.useFakeTimers();
  });
  afterEach(() => vi.useRealTimers());

  it('asks for the starting point at once, then waits for a pause in typing', () => {
    const edits = new Subject<DopingInput | null>();
    const states: CurveState[] = [];
    modelCurveStream(edits, { material: 'Si', fromK: 50, toK: 500, steps: 100 }, (body) =>
      http.post<ModelCurveResponse>('/api/model/curve', body),
    ).subscribe((s) => states.push(s));

    // The starting point (nothing typed yet): asked for with no pause.
    edits.next(doping(1.4e15));
    const start = backend.expectOne('/api/model/curve');
    expect((start.request.body as ModelCurveRequest).doping?.donorDensity).toBe(1.4e15);
    expect(states.at(-1)).toEqual({ curve: null, problem: null, loading: true });
    start.flush(curve);
    expect(states.at(-1)).toEqual({ curve, problem: null, loading: false });

    // Typing 1, 1e, 1e1, 1e15 quickly: nothing is asked until the pause.
    for (const n of [1, 10, 1e1, 1e15]) {
      edits.next(doping(n));
      vi.advanceTimersByTime(50);
    }
    backend.expectNone('/api/model/curve');
    vi.advanceTimersByTime(150);
    const first = backend.expectOne('/api/model/curve');
    expect((first.request.body as ModelCurveRequest).doping?.donorDensity).toBe(1e15);

    // A new value while the first is open: the first is cancelled, only one stays open.
    edits.next(doping(2e15));
    vi.advanceTimersByTime(200);
    expect(first.cancelled).toBe(true);
    const open = backend.match('/api/model/curve');
    expect(open).toHaveLength(1);
    open[0]!.flush(curve);
    expect(states.at(-1)).toEqual({ curve, problem: null, loading: false });
    backend.verify();
  });

  it('an invalid parameter set asks nothing and says why', () => {
    const edits = new Subject<DopingInput | null>();
    const states: CurveState[] = [];
    modelCurveStream(edits, { material: 'Si', fromK: 50, toK: 500, steps: 100 }, (body) =>
      http.post<ModelCurveResponse>('/api/model/curve', body),
    ).subscribe((s) => states.push(s));
    edits.next(null);
    vi.advanceTimersByTime(200);
    backend.expectNone('/api/model/curve');
    expect(states.at(-1)?.problem).toMatch(/Fix the highlighted parameters/);
  });
});
