import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssigneeDto,
  AssignmentDto,
  CreateUserRequest,
  Page,
  UpdateUserRequest,
  UserDto,
} from '@rhotrace/api-types';
import { type Observable, map } from 'rxjs';
import { quietRequest } from '../../core/http/api-error';
import { type ListQuery, listParams } from '../../shared/list-query';

/** Accounts (admin only). */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  list(query: ListQuery): Observable<Page<UserDto>> {
    return this.http.get<Page<UserDto>>('/api/users', { params: listParams(query) });
  }

  create(body: CreateUserRequest): Observable<UserDto> {
    return this.http.post<UserDto>('/api/users', body, { context: quietRequest() });
  }

  /** Quiet: the list tells what happened (or what went wrong) itself. */
  update(id: number, body: UpdateUserRequest): Observable<UserDto> {
    return this.http.patch<UserDto>(`/api/users/${id}`, body, { context: quietRequest() });
  }

  /** A person's open tasks (assigned or in progress), overdue first. */
  openTasks(userId: number): Observable<AssignmentDto[]> {
    return this.http
      .get<Page<AssignmentDto>>('/api/assignments', {
        params: listParams({ pageSize: 200, sort: 'dueDate' })
          .set('assignee', userId)
          .set('open', true),
      })
      .pipe(map((p) => p.items));
  }

  /** Active accounts that can take over tasks. */
  assignees(): Observable<AssigneeDto[]> {
    return this.http
      .get<{ items: AssigneeDto[] }>('/api/users/assignees')
      .pipe(map((b) => b.items));
  }
}
