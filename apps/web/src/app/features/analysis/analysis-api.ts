import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  FitDto,
  FitPreviewDto,
  FitRequest,
  MaterialsResponse,
  ModelCurveRequest,
  ModelCurveResponse,
  Page,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import { type Observable, map, shareReplay } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { OpeningRequest } from '../../core/http/opening-request';
import { Downloader } from '../../shared/download';
import { analysisUrl } from './analysis-urls';

/** Model curves, a sweep's analysis view, its fits and its downloads. */
@Injectable({ providedIn: 'root' })
export class AnalysisApi {
  private readonly http = inject(HttpClient);
  private readonly downloader = inject(Downloader);
  private readonly opening = inject(OpeningRequest);
  private materialsCache: Observable<MaterialsResponse> | null = null;

  /** A sweep's analysis; the one asked for while the app started (see app.config), if it was. */
  analysis(sweepId: number, leg: number | 'all' | null = null): Observable<SweepAnalysisResponse> {
    const url = analysisUrl(sweepId, leg);
    return this.opening.take(url, () => this.http.get<SweepAnalysisResponse>(url));
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

  /** Quiet, like `createFit`: runs the fit and answers it; nothing is stored. */
  previewFit(sweepId: number, body: FitRequest): Observable<FitPreviewDto> {
    return this.http.post<FitPreviewDto>(`/api/sweeps/${sweepId}/fits/preview`, body, {
      context: quietRequest(),
    });
  }

  deleteFit(id: number): Observable<unknown> {
    return this.http.delete(`/api/fits/${id}`);
  }

  /** Saves the sweep's fits as CSV, one row per fitted parameter. */
  saveFitsCsv(sweepId: number): Promise<void> {
    return this.downloader.save(`/api/sweeps/${sweepId}/fits.csv`, `sweep-${sweepId}-fits.csv`);
  }

  /** Saves the sweep's printable report. */
  saveReport(sweepId: number): Promise<void> {
    return this.downloader.save(`/api/sweeps/${sweepId}/report`, `sweep-${sweepId}-report.pdf`);
  }
}
