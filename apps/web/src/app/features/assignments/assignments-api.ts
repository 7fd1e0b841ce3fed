import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssigneeDto,
  AssignmentDto,
  CreateAssignmentRequest,
  Page,
  StationDto,
  UpdateAssignmentRequest,
  WaferDto,
} from '@rhotrace/api-types';
import { type Observable, map } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { type ListQuery, listParams } from '../../shared/list-query';

/** Assignments, the people they can go to, and the wafers they can be about. */
@Injectable({ providedIn: 'root' })
export class AssignmentsApi {
  private readonly http = inject(HttpClient);

  list(query: ListQuery): Observable<Page<AssignmentDto>> {
    return this.http.get<Page<AssignmentDto>>('/api/assignments', { params: listParams(query) });
  }

  create(body: CreateAssignmentRequest): Observable<AssignmentDto> {
    return this.http.post<AssignmentDto>('/api/assignments', body, { context: quietRequest() });
  }

  update(id: number, body: UpdateAssignmentRequest): Observable<AssignmentDto> {
    return this.http.patch<AssignmentDto>(`/api/assignments/${id}`, body);
  }

  assignees(): Observable<AssigneeDto[]> {
    return this.http
      .get<{ items: AssigneeDto[] }>('/api/users/assignees')
      .pipe(map((b) => b.items));
  }

  /** Probe stations an assignment may name (its station token may then post the sweep). */
  stations(): Observable<StationDto[]> {
    return this.http
      .get<Page<StationDto>>('/api/stations', {
        params: listParams({ pageSize: 200, sort: 'name' }),
      })
      .pipe(map((p) => p.items));
  }

  wafers(q: string): Observable<WaferDto[]> {
    return this.http
      .get<Page<WaferDto>>('/api/wafers', {
        params: listParams({ q, pageSize: 50, sort: '-updatedAt' }),
      })
      .pipe(map((p) => p.items));
  }
}
