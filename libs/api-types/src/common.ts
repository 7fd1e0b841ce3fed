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
  /** `host:port` of the database server new connections go to. */
  dbHost: string;
  /** Nodes in the Galera cluster that server belongs to; null for a single server or when down. */
  clusterSize: number | null;
}
