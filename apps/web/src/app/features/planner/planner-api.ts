import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { PlannerRequest, PlannerResponse } from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';

/** The measurement planner. */
@Injectable({ providedIn: 'root' })
export class PlannerApi {
  private readonly http = inject(HttpClient);

  /** A plan; field errors come back quietly so the form can show them beside the fields. */
  plan(body: PlannerRequest): Observable<PlannerResponse> {
    return this.http.post<PlannerResponse>('/api/planner', body, { context: quietRequest() });
  }
}
