/** A page of a list: `{ items, total, page, pageSize }`. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** Largest `pageSize` any list accepts. */
export const MAX_PAGE_SIZE = 200;
/** `pageSize` when the request gives none. */
export const DEFAULT_PAGE_SIZE = 25;

/** `GET /api/health`. */
export interface HealthResponse {
  status: 'ok' | 'degraded';
  db: 'up' | 'down';
}
