import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssignmentDto,
  AssignmentState,
  DopantDensityResponse,
  Page,
  StationDto,
  SweepCreatedResponse,
  SweepDto,
  SweepGeometryInput,
  SweepMapInput,
  SweepColumnOverride,
  SweepMethod,
  SweepPreviewResponse,
  SweepSummaryDto,
  WaferDto,
  WaferInput,
} from '@rhotrace/api-types';
import { type Observable, map } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { type ListQuery, listParams } from '../../shared/list-query';

/** What the store request sends besides the file. */
export interface SweepStoreOptions {
  method: SweepMethod;
  stationId: number | null;
  columns: SweepColumnOverride[] | null;
  geometry: SweepGeometryInput;
  /** Map fields, sent when set (files with site columns). */
  map?: SweepMapInput;
}

function itemsOf<T>(body: Page<T> | T[]): T[] {
  return Array.isArray(body) ? body : body.items;
}

/** A wafer, its sweeps and assignments, its dopant density, and the sweep upload. */
@Injectable({ providedIn: 'root' })
export class WafersApi {
  private readonly http = inject(HttpClient);

  get(id: number): Observable<WaferDto> {
    return this.http.get<WaferDto>(`/api/wafers/${id}`);
  }

  list(query: ListQuery): Observable<Page<WaferDto>> {
    return this.http.get<Page<WaferDto>>('/api/wafers', { params: listParams(query) });
  }

  update(id: number, body: Partial<WaferInput>): Observable<WaferDto> {
    return this.http.patch<WaferDto>(`/api/wafers/${id}`, body);
  }

  sweeps(waferId: number): Observable<SweepSummaryDto[]> {
    return this.http
      .get<Page<SweepSummaryDto> | SweepSummaryDto[]>(`/api/wafers/${waferId}/sweeps`)
      .pipe(map(itemsOf));
  }

  sweep(id: number): Observable<SweepDto> {
    return this.http.get<SweepDto>(`/api/sweeps/${id}`);
  }

  deleteWafer(id: number): Observable<unknown> {
    return this.http.delete(`/api/wafers/${id}`);
  }

  deleteSweep(id: number): Observable<unknown> {
    return this.http.delete(`/api/sweeps/${id}`);
  }

  /** Quiet: a wafer without a measured sweep has no dopant value, which is not an error to shout. */
  dopant(waferId: number): Observable<DopantDensityResponse> {
    return this.http.get<DopantDensityResponse>(`/api/wafers/${waferId}/dopant`, {
      context: quietRequest(),
    });
  }

  assignments(query: ListQuery): Observable<AssignmentDto[]> {
    return this.http
      .get<Page<AssignmentDto>>('/api/assignments', { params: listParams(query) })
      .pipe(map(itemsOf));
  }

  moveAssignment(id: number, state: AssignmentState): Observable<AssignmentDto> {
    return this.http.patch<AssignmentDto>(`/api/assignments/${id}`, { state });
  }

  stations(): Observable<StationDto[]> {
    return this.http
      .get<Page<StationDto>>('/api/stations', {
        params: listParams({ pageSize: 200, sort: 'name' }),
      })
      .pipe(map(itemsOf));
  }

  /** Parses a file without storing it. Quiet: problems are shown against the file. */
  preview(waferId: number, file: File): Observable<SweepPreviewResponse> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<SweepPreviewResponse>(`/api/wafers/${waferId}/sweeps/preview`, body, {
      context: quietRequest(),
    });
  }

  /** Stores a sweep, reporting upload progress. */
  store(
    waferId: number,
    file: File,
    options: SweepStoreOptions,
  ): Observable<HttpEvent<SweepCreatedResponse>> {
    const body = new FormData();
    body.append('method', options.method);
    if (options.stationId !== null) body.append('stationId', String(options.stationId));
    if (options.columns) body.append('columns', JSON.stringify(options.columns));
    for (const [key, value] of Object.entries(options.geometry)) {
      if (typeof value === 'number' && Number.isFinite(value)) body.append(key, String(value));
    }
    if (options.map?.sitePattern) body.append('sitePattern', options.map.sitePattern);
    if (options.map?.edgeExclusionMm !== undefined && Number.isFinite(options.map.edgeExclusionMm))
      body.append('edgeExclusionMm', String(options.map.edgeExclusionMm));
    body.append('file', file, file.name);
    return this.http.post<SweepCreatedResponse>(`/api/wafers/${waferId}/sweeps`, body, {
      reportProgress: true,
      observe: 'events',
      context: quietRequest(),
    });
  }
}
