import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssignmentDto,
  LotDto,
  LotSummaryResponse,
  Page,
  RecentFitDto,
  RecentFitsResponse,
  RecentSweepDto,
  RecentSweepsResponse,
} from '@rhotrace/api-types';
import { type Observable, catchError, forkJoin, map, of, switchMap } from 'rxjs';
import { type ListQuery, listParams } from '../../shared/list-query';

/** An out-of-spec wafer with its lot. */
export interface OutOfSpec {
  lot: LotSummaryResponse['lot'];
  wafer: LotSummaryResponse['wafers'][number];
}

/** The lists each role's bench is made of, assembled from the records and analysis APIs. */
@Injectable({ providedIn: 'root' })
export class HomeApi {
  private readonly http = inject(HttpClient);

  assignments(query: ListQuery): Observable<Page<AssignmentDto>> {
    return this.http.get<Page<AssignmentDto>>('/api/assignments', { params: listParams(query) });
  }

  /** The newest sweeps the user may see, labelled (one request). */
  recentSweeps(limit = 8): Observable<RecentSweepDto[]> {
    return this.http
      .get<RecentSweepsResponse>('/api/sweeps/recent', { params: { limit } })
      .pipe(map((body) => body.items));
  }

  /** The newest saved fits (only the user's own with `mine`), labelled (one request). */
  recentFits(limit = 8, mine = false): Observable<RecentFitDto[]> {
    return this.http
      .get<RecentFitsResponse>('/api/fits/recent', { params: { limit, mine } })
      .pipe(map((body) => body.items));
  }

  /** Wafers out of spec in the most recently changed lots. */
  outOfSpec(): Observable<OutOfSpec[]> {
    return this.http
      .get<Page<LotDto>>('/api/lots', { params: listParams({ sort: '-updatedAt', pageSize: 8 }) })
      .pipe(
        switchMap((page) =>
          page.items.length === 0
            ? of([] as OutOfSpec[][])
            : forkJoin(
                page.items.map((lot) =>
                  this.http.get<LotSummaryResponse>(`/api/lots/${lot.id}/summary`).pipe(
                    map((s) =>
                      s.wafers
                        .filter((w) => w.pass === false)
                        .map((wafer) => ({ lot: s.lot, wafer })),
                    ),
                    catchError(() => of([] as OutOfSpec[])),
                  ),
                ),
              ),
        ),
        map((lists) => lists.flat()),
      );
  }
}
