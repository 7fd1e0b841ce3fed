import type { Role } from './auth';

/** What `GET /api/search` looks through. */
export const SEARCH_KINDS = ['lots', 'wafers', 'sweeps', 'people'] as const;
export type SearchKind = (typeof SEARCH_KINDS)[number];

/** One found record: its name, a line of context and where it lives in the app. */
export interface SearchHit {
  kind: SearchKind;
  id: number;
  title: string;
  detail: string;
  /** For wafers and sweeps: the wafer page a hit opens (sweeps open their study page). */
  waferId: number | null;
  role?: Role;
}

/** One group of hits with how many there are in all. */
export interface SearchGroup {
  kind: SearchKind;
  items: SearchHit[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * `GET /api/search?q=&kind=&page=&pageSize=`: without `kind`, the first hits of every kind the
 * reader may see; with `kind`, one page of that kind (an empty `q` lists them all).
 */
export interface SearchResponse {
  q: string;
  groups: SearchGroup[];
}
