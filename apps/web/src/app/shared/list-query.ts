import { HttpParams } from '@angular/common/http';

/** The common list query: paging, `sort` (`field` or `-field`), search and filters. */
export interface ListQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  q?: string;
  [filter: string]: string | number | boolean | undefined;
}

/** HttpParams from a list query, leaving out empty values. */
export function listParams(query: ListQuery): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === '' || value === null) continue;
    params = params.set(key, String(value));
  }
  return params;
}

/** `sort` value from a MatSort state: `field`, `-field`, or nothing. */
export function sortParam(active: string, direction: 'asc' | 'desc' | ''): string | undefined {
  if (!active || !direction) return undefined;
  return direction === 'desc' ? `-${active}` : active;
}
