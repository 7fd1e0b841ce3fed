import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { LotMapsResponse, SweepMapResponse } from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';

/** Every URL the map views read. */
@Injectable({ providedIn: 'root' })
export class MapsApi {
  private readonly http = inject(HttpClient);

  /**
   * A map sweep's maps. Quiet: a view that asks for the map of a sweep that is no map hears a
   * 404 and shows nothing, without an error message.
   */
  sweepMap(sweepId: number): Observable<SweepMapResponse> {
    return this.http.get<SweepMapResponse>(`/api/sweeps/${sweepId}/map`, {
      context: quietRequest(),
    });
  }

  /** Each wafer's newest map in a lot, on one colour scale. */
  lotMaps(lotId: number): Observable<LotMapsResponse> {
    return this.http.get<LotMapsResponse>(`/api/lots/${lotId}/maps`);
  }
}
