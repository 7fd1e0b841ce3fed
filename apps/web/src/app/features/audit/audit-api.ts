import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { AuditEventDto, Page } from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
import { type ListQuery, listParams } from '../../shared/list-query';

/** The change trail (admin and manager). */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);

  list(query: ListQuery): Observable<Page<AuditEventDto>> {
    return this.http.get<Page<AuditEventDto>>('/api/audit', { params: listParams(query) });
  }
}
