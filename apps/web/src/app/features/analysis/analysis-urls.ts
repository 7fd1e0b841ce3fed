/** The address of a sweep's analysis (`leg` null: the API's default leg). */
export function analysisUrl(sweepId: number, leg: number | 'all' | null = null): string {
  return `/api/sweeps/${sweepId}/analysis${leg === null ? '' : `?leg=${leg}`}`;
}

/**
 * The analysis the study page at `path` (the route `/sweeps/:id`) asks for first, or null when
 * `path` is no study page. Kept beside `analysisUrl` so the two cannot drift apart.
 */
export function openingAnalysisUrl(path: string): string | null {
  const match = /^\/sweeps\/(\d+)\/?$/.exec(path);
  return match ? analysisUrl(Number(match[1])) : null;
}
