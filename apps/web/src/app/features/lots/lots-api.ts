import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  LotDto,
  LotInput,
  LotSummaryResponse,
  Page,
  WaferDto,
  WaferInput,
} from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { type ListQuery, listParams } from '../../shared/list-query';

/** Lots, their wafers and their summary. */
@Injectable({ providedIn: 'root' })
export class LotsApi {
  private readonly http = inject(HttpClient);

  list(query: ListQuery): Observable<Page<LotDto>> {
    return this.http.get<Page<LotDto>>('/api/lots', { params: listParams(query) });
  }

  get(id: number): Observable<LotDto> {
    return this.http.get<LotDto>(`/api/lots/${id}`);
  }

  /** Quiet: the form shows field problems next to the fields. */
  create(body: LotInput): Observable<LotDto> {
    return this.http.post<LotDto>('/api/lots', body, { context: quietRequest() });
  }

  update(id: number, body: Partial<LotInput>): Observable<LotDto> {
    return this.http.patch<LotDto>(`/api/lots/${id}`, body, { context: quietRequest() });
  }

  remove(id: number): Observable<unknown> {
    return this.http.delete(`/api/lots/${id}`);
  }

  wafers(lotId: number, query: ListQuery = { pageSize: 200 }): Observable<Page<WaferDto>> {
    return this.http.get<Page<WaferDto>>(`/api/lots/${lotId}/wafers`, {
      params: listParams(query),
    });
  }

  createWafer(lotId: number, body: WaferInput): Observable<WaferDto> {
    return this.http.post<WaferDto>(`/api/lots/${lotId}/wafers`, body, { context: quietRequest() });
  }

  /** Where the lot summary's CSV export is served. */
  summaryCsvUrl(lotId: number): string {
    return `/api/lots/${lotId}/summary.csv`;
  }

  /** Where the printable lot report (PDF) is served. */
  reportPdfUrl(lotId: number): string {
    return `/api/lots/${lotId}/report.pdf`;
  }

  summary(lotId: number): Observable<LotSummaryResponse> {
    return this.http.get<LotSummaryResponse>(`/api/lots/${lotId}/summary`);
  }
}
