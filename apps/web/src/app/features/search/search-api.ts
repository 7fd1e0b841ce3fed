import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { SearchKind, SearchResponse } from '@rhotrace/api-types';
import type { Observable } from 'rxjs';

/** What the search page asks: the text, and optionally one kind a page at a time. */
export interface SearchQuery {
  q: string;
  kind: SearchKind | null;
  page: number;
  pageSize: number;
}

/** `GET /api/search`. */
@Injectable({ providedIn: 'root' })
export class SearchApi {
  private readonly http = inject(HttpClient);

  search(query: SearchQuery): Observable<SearchResponse> {
    const params: Record<string, string | number> = { q: query.q };
    if (query.kind) {
      params['kind'] = query.kind;
      params['page'] = query.page;
      params['pageSize'] = query.pageSize;
    }
    return this.http.get<SearchResponse>('/api/search', { params });
  }
}
