import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { CreateUserRequest, Page, UpdateUserRequest, UserDto } from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
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

  update(id: number, body: UpdateUserRequest): Observable<UserDto> {
    return this.http.patch<UserDto>(`/api/users/${id}`, body);
  }
}
