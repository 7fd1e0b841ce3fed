import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AssignmentDto,
  FitDto,
  LotDto,
  LotSummaryResponse,
  Page,
  SweepSummaryDto,
  WaferDto,
} from '@rhotrace/api-types';
import { type Observable, catchError, forkJoin, map, of, switchMap } from 'rxjs';
import { type ListQuery, listParams } from '../../shared/list-query';

/** A sweep with the wafer it belongs to. */
export interface RecentSweep {
  sweep: SweepSummaryDto;
  wafer: WaferDto;
}

/** A fit with the sweep and wafer it belongs to. */
export interface RecentFit {
  fit: FitDto;
  sweep: SweepSummaryDto;
  wafer: WaferDto;
}

/** An out-of-spec wafer with its lot. */
export interface OutOfSpec {
  lot: LotSummaryResponse['lot'];
  wafer: LotSummaryResponse['wafers'][number];
}

const itemsOf = <T>(body: Page<T> | T[]): T[] => (Array.isArray(body) ? body : body.items);

/** The lists each role's bench is made of, assembled from the records and analysis APIs. */
@Injectable({ providedIn: 'root' })
export class HomeApi {
  private readonly http = inject(HttpClient);

  assignments(query: ListQuery): Observable<Page<AssignmentDto>> {
    return this.http.get<Page<AssignmentDto>>('/api/assignments', { params: listParams(query) });
  }

  /** Sweeps of the most recently changed measured wafers, newest first. */
  recentSweeps(limit = 8): Observable<RecentSweep[]> {
    return this.http
      .get<Page<WaferDto>>('/api/wafers', { params: listParams({ sort: '-updatedAt', pageSize: 6 }) })
      .pipe(
        switchMap((page) =>
          page.items.length === 0
            ? of([] as RecentSweep[][])
            : forkJoin(
                page.items.map((wafer) =>
                  this.http.get<Page<SweepSummaryDto> | SweepSummaryDto[]>(`/api/wafers/${wafer.id}/sweeps`).pipe(
                    map((body) => itemsOf(body).map((sweep) => ({ sweep, wafer }))),
                    catchError(() => of([] as RecentSweep[])),
                  ),
                ),
              ),
        ),
        map((lists) =>
          lists
            .flat()
            .sort((a, b) => b.sweep.createdAt.localeCompare(a.sweep.createdAt))
            .slice(0, limit),
        ),
      );
  }

  /** Fits saved on recent sweeps, newest first. */
  recentFits(limit = 8): Observable<RecentFit[]> {
    return this.recentSweeps(6).pipe(
      switchMap((sweeps) =>
        sweeps.length === 0
          ? of([] as RecentFit[][])
          : forkJoin(
              sweeps.map(({ sweep, wafer }) =>
                this.http.get<Page<FitDto> | FitDto[]>(`/api/sweeps/${sweep.id}/fits`).pipe(
                  map((body) => itemsOf(body).map((fit) => ({ fit, sweep, wafer }))),
                  catchError(() => of([] as RecentFit[])),
                ),
              ),
            ),
      ),
      map((lists) =>
        lists
          .flat()
          .sort((a, b) => b.fit.createdAt.localeCompare(a.fit.createdAt))
          .slice(0, limit),
      ),
    );
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
                    map((s) => s.wafers.filter((w) => w.pass === false).map((wafer) => ({ lot: s.lot, wafer }))),
                    catchError(() => of([] as OutOfSpec[])),
                  ),
                ),
              ),
        ),
        map((lists) => lists.flat()),
      );
  }
}
