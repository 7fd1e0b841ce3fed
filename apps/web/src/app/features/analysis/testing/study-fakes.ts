import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import type {
  FitDto,
  FitPreviewDto,
  FitRequest,
  ModelCurveRequest,
  ModelCurveResponse,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import { type Observable, Subject, of } from 'rxjs';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { LotsApi } from '../../lots/lots-api';
import { WafersApi } from '../../wafers/wafers-api';
import { AnalysisApi } from '../analysis-api';
import { AnalysisStore } from '../analysis-store';

/** A silicon sweep of four steps, 300–450 K, with one suggested window. */
export function analysisOf(material = 'Si'): SweepAnalysisResponse {
  const steps = [300, 350, 400, 450].map((t, i) => ({
    temperatureK: t,
    resistivityOhmCm: 10 / (i + 1),
    spreadOhmCm: 0.01,
    count: 3,
  }));
  return {
    sweep: {
      id: 7,
      waferId: 3,
      waferNumber: '03',
      lotId: 2,
      lotCode: 'L-0002',
      material,
      method: 'four-point',
      stationId: null,
      pointCount: 12,
      skippedPointCount: 0,
      minTemperatureK: 300,
      maxTemperatureK: 450,
      originalName: 'demo.csv',
      createdAt: '2026-01-02T03:04:05.000Z',
      geometry: {
        thicknessCm: 0.0524,
        spacingCm: 0.1588,
        sources: { thicknessCm: 'wafer', spacingCm: 'station' },
      },
    },
    steps,
    arrhenius: steps.map((s) => ({
      inverseTemperaturePerKK: 1000 / s.temperatureK,
      lnResistivity: Math.log(s.resistivityOhmCm),
      lnConductivity: -Math.log(s.resistivityOhmCm),
    })),
    suggestedWindows: [{ regime: 'intrinsic', minK: 350, maxK: 450, pointCount: 9 }],
    spec: {
      resistivityAt23COhmCm: null,
      inSpec: null,
      specMinOhmCm: null,
      specMaxOhmCm: null,
      method: null,
      distanceK: null,
      reason: 'no spec',
      verdict: null,
      uncertaintyOhmCm: null,
      coverageFactor: null,
      uncertaintyBudget: [],
    },
  };
}

/** A previewed Arrhenius fit over [minK, maxK]; `extra` overrides any field. */
export function previewOf(request: FitRequest, extra: Partial<FitPreviewDto> = {}): FitPreviewDto {
  return {
    sweepId: 7,
    kind: request.kind,
    inputs: { ...request },
    windowMinK: request.minK ?? null,
    windowMaxK: request.maxK ?? null,
    parameters: { activationEnergyEv: 0.55 },
    standardErrors: { activationEnergyEv: 0.01 },
    confidenceIntervals: { activationEnergyEv: [0.53, 0.57] },
    goodness: { rSquared: 0.999, count: 9, residualRms: 0.01, residualUnit: 'ln(Ω·cm)' },
    residuals: [],
    converged: true,
    reason: null,
    reading: null,
    modelVersion: 'physics@0.1.0+arrhenius',
    stepCount: null,
    excludedSequences: [],
    interpretation: null,
    curvature: null,
    warnings: [],
    ...extra,
  };
}

/** The saved form of a preview. */
export function savedOf(preview: FitPreviewDto, id: number): FitDto {
  return {
    ...preview,
    id,
    createdBy: { id: 1, name: 'Ada Physicist' },
    createdAt: '2026-01-02T03:04:05.000Z',
  };
}

/**
 * An AnalysisApi whose fit requests answer only when the test says so: each call is recorded
 * with the Subject that answers it.
 */
export class FakeAnalysisApi {
  analysisAnswer: SweepAnalysisResponse = analysisOf();
  saved: FitDto[] = [];
  readonly previews: Array<{ body: FitRequest; answer: Subject<FitPreviewDto> }> = [];
  readonly creates: Array<{ body: FitRequest; answer: Subject<FitDto> }> = [];
  readonly deleted: number[] = [];
  readonly curves: ModelCurveRequest[] = [];

  /** The leg asked of each analysis request. */
  readonly legsAsked: Array<number | 'all' | null> = [];

  analysis(
    _sweepId?: number,
    leg: number | 'all' | null = null,
  ): Observable<SweepAnalysisResponse> {
    this.legsAsked.push(leg);
    return of(this.analysisAnswer);
  }
  materials(): Observable<null> {
    return of(null);
  }
  fits(): Observable<FitDto[]> {
    return of(this.saved);
  }
  modelCurve(body: ModelCurveRequest): Observable<ModelCurveResponse> {
    this.curves.push(body);
    return new Subject<ModelCurveResponse>();
  }
  previewFit(_sweepId: number, body: FitRequest): Observable<FitPreviewDto> {
    const answer = new Subject<FitPreviewDto>();
    this.previews.push({ body, answer });
    return answer;
  }
  createFit(_sweepId: number, body: FitRequest): Observable<FitDto> {
    const answer = new Subject<FitDto>();
    this.creates.push({ body, answer });
    return answer;
  }
  deleteFit(id: number): Observable<unknown> {
    this.deleted.push(id);
    this.saved = this.saved.filter((f) => f.id !== id);
    return of(null);
  }
  saveFitsCsv(): Promise<void> {
    return Promise.resolve();
  }
  saveReport(): Promise<void> {
    return Promise.resolve();
  }
}

/** Answers a recorded request once. */
export function answer<T>(call: { answer: Subject<T> } | undefined, value: T): void {
  if (!call) throw new Error('no such request was made');
  call.answer.next(value);
  call.answer.complete();
}

/** Mounts one part of the study over a store with the fake API, sweep 7 loaded. */
export async function mountPart<T>(component: Type<T>, api = new FakeAnalysisApi()) {
  TestBed.configureTestingModule({
    imports: [component],
    providers: [
      AnalysisStore,
      // Dialogs close at once, so a confirmation answers within the test.
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      { provide: AnalysisApi, useValue: api },
      { provide: LotsApi, useValue: { get: () => of({ dopant: null, dopantType: 'n' }) } },
      { provide: WafersApi, useValue: { dopant: () => of(null) } },
      // Plotly never loads in unit tests: the plot shows its placeholder.
      { provide: PlotlyLoader, useValue: { load: () => new Promise(() => undefined) } },
    ],
  });
  const store = TestBed.inject(AnalysisStore);
  store.load(7);
  const fixture = TestBed.createComponent(component);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  return { fixture, loader, root, store, api };
}
