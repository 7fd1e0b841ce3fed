import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  FitDto,
  FitRequest,
  MaterialsResponse,
  ModelCurveRequest,
  ModelCurveResponse,
  Page,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import { type Observable, map, shareReplay } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';

/** Model curves, a sweep's analysis view, and its fits. */
@Injectable({ providedIn: 'root' })
export class AnalysisApi {
  private readonly http = inject(HttpClient);
  private materialsCache: Observable<MaterialsResponse> | null = null;

  analysis(sweepId: number): Observable<SweepAnalysisResponse> {
    return this.http.get<SweepAnalysisResponse>(`/api/sweeps/${sweepId}/analysis`);
  }

  materials(): Observable<MaterialsResponse> {
    this.materialsCache ??= this.http.get<MaterialsResponse>('/api/materials').pipe(shareReplay(1));
    return this.materialsCache;
  }

  /** Quiet: shown beside the parameters while the user types. */
  modelCurve(body: ModelCurveRequest): Observable<ModelCurveResponse> {
    return this.http.post<ModelCurveResponse>('/api/model/curve', body, {
      context: quietRequest(),
    });
  }

  fits(sweepId: number): Observable<FitDto[]> {
    return this.http
      .get<Page<FitDto> | FitDto[]>(`/api/sweeps/${sweepId}/fits`)
      .pipe(map((body) => (Array.isArray(body) ? body : body.items)));
  }

  /** Quiet: a refused window is explained in the panel that asked for it. */
  createFit(sweepId: number, body: FitRequest): Observable<FitDto> {
    return this.http.post<FitDto>(`/api/sweeps/${sweepId}/fits`, body, { context: quietRequest() });
  }

  deleteFit(id: number): Observable<unknown> {
    return this.http.delete(`/api/fits/${id}`);
  }
}
