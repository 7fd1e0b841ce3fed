import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  Page,
  StationDto,
  StationInput,
  StationTokenCreatedResponse,
  StationTokenDto,
} from '@rhotrace/api-types';
import { type Observable, map } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { type ListQuery, listParams } from '../../shared/list-query';

/** Probe stations. */
@Injectable({ providedIn: 'root' })
export class StationsApi {
  private readonly http = inject(HttpClient);

  list(query: ListQuery): Observable<Page<StationDto>> {
    return this.http.get<Page<StationDto>>('/api/stations', { params: listParams(query) });
  }

  create(body: StationInput): Observable<StationDto> {
    return this.http.post<StationDto>('/api/stations', body, { context: quietRequest() });
  }

  update(id: number, body: Partial<StationInput>): Observable<StationDto> {
    return this.http.patch<StationDto>(`/api/stations/${id}`, body, { context: quietRequest() });
  }

  remove(id: number): Observable<unknown> {
    return this.http.delete(`/api/stations/${id}`);
  }

  /** A station's tokens (never their secrets), newest first. */
  tokens(stationId: number): Observable<StationTokenDto[]> {
    return this.http
      .get<{ items: StationTokenDto[] }>(`/api/stations/${stationId}/tokens`)
      .pipe(map((b) => b.items));
  }

  /** Makes a token; the answer holds the token itself, shown once. */
  createToken(stationId: number, label: string): Observable<StationTokenCreatedResponse> {
    return this.http.post<StationTokenCreatedResponse>(
      `/api/stations/${stationId}/tokens`,
      { label },
      { context: quietRequest() },
    );
  }

  revokeToken(stationId: number, tokenId: number): Observable<unknown> {
    return this.http.delete(`/api/stations/${stationId}/tokens/${tokenId}`);
  }
}
