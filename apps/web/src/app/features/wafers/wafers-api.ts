import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssignmentDto,
  AssignmentState,
  DopantDensityResponse,
  HallFactorName,
  ImportSettingsDto,
  ImportSettingsInput,
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
  /** The separator and decimal mark, where the user corrected the detected ones. */
  layout?: SweepLayoutChoice;
  /** Map fields, sent when set (files with site columns). */
  map?: SweepMapInput;
  /** The Hall factor r_H, a number or a named one; sent for the hall method only. */
  hallFactor?: number | HallFactorName;
}

/** A separator or decimal mark the user gave instead of the detected one. */
export interface SweepLayoutChoice {
  delimiter?: SweepPreviewResponse['delimiter'];
  decimalMark?: SweepPreviewResponse['decimalMark'];
}

/** The choices a preview is checked with: the store's, the method not yet chosen or not. */
export type SweepChoices = Omit<SweepStoreOptions, 'method'> & { method: SweepMethod | null };

/** The choices as the upload's text fields (the file is appended last by the caller). */
function choiceFields(choices: SweepChoices): FormData {
  const body = new FormData();
  if (choices.method) body.append('method', choices.method);
  if (choices.stationId !== null) body.append('stationId', String(choices.stationId));
  if (choices.columns) body.append('columns', JSON.stringify(choices.columns));
  if (choices.layout?.delimiter) body.append('delimiter', choices.layout.delimiter);
  if (choices.layout?.decimalMark) body.append('decimalMark', choices.layout.decimalMark);
  for (const [key, value] of Object.entries(choices.geometry)) {
    if (typeof value === 'number' && Number.isFinite(value)) body.append(key, String(value));
  }
  const site = choices.map;
  if (site?.sitePattern) body.append('sitePattern', site.sitePattern);
  if (site?.edgeExclusionMm !== undefined && Number.isFinite(site.edgeExclusionMm))
    body.append('edgeExclusionMm', String(site.edgeExclusionMm));
  if (choices.method === 'hall' && choices.hallFactor !== undefined)
    body.append('hallFactor', String(choices.hallFactor));
  return body;
}

function itemsOf<T>(body: Page<T> | T[]): T[] {
  return Array.isArray(body) ? body : body.items;
}

/** A wafer, its sweeps and assignments, its dopant density, and the sweep upload. */
@Injectable({ providedIn: 'root' })
export class WafersApi {
  private readonly http = inject(HttpClient);

  /** One wafer. Quiet: a page shows a hidden or missing wafer as not available. */
  get(id: number): Observable<WaferDto> {
    return this.http.get<WaferDto>(`/api/wafers/${id}`, { context: quietRequest() });
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

  /**
   * Parses a file without storing it and runs the store's checks with `choices`. Quiet:
   * problems are shown against the file.
   */
  preview(waferId: number, file: File, choices?: SweepChoices): Observable<SweepPreviewResponse> {
    const body = choices ? choiceFields(choices) : new FormData();
    body.append('file', file, file.name);
    return this.http.post<SweepPreviewResponse>(`/api/wafers/${waferId}/sweeps/preview`, body, {
      context: quietRequest(),
    });
  }

  /** Saves how files of one shape from one station are read, for the next such file. */
  saveImportSettings(input: ImportSettingsInput): Observable<ImportSettingsDto> {
    return this.http.put<ImportSettingsDto>('/api/import-settings', input);
  }

  /** Stores a sweep, reporting upload progress. */
  store(
    waferId: number,
    file: File,
    options: SweepStoreOptions,
  ): Observable<HttpEvent<SweepCreatedResponse>> {
    const body = choiceFields(options);
    body.append('file', file, file.name);
    return this.http.post<SweepCreatedResponse>(`/api/wafers/${waferId}/sweeps`, body, {
      reportProgress: true,
      observe: 'events',
      context: quietRequest(),
    });
  }
}
