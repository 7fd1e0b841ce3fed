import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { CompareResponse, LotDto, Page, SweepSummaryDto, WaferDto } from '@rhotrace/api-types';
import { type Observable, catchError, forkJoin, map, of, switchMap } from 'rxjs';
import { listParams } from '../../shared/list-query';

/** A sweep offered for overlay, with its wafer. */
export interface SweepChoice {
  sweep: SweepSummaryDto;
  wafer: WaferDto;
  lotCode: string;
}

const itemsOf = <T>(body: Page<T> | T[]): T[] => (Array.isArray(body) ? body : body.items);

/** Sweeps across lots, and their curves on one temperature grid. */
@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  lots(): Observable<LotDto[]> {
    return this.http
      .get<Page<LotDto>>('/api/lots', { params: listParams({ pageSize: 200, sort: 'code' }) })
      .pipe(map((p) => p.items));
  }

  /** Every sweep of the given lots. */
  sweepsOfLots(lots: LotDto[]): Observable<SweepChoice[]> {
    if (lots.length === 0) return of([]);
    return forkJoin(
      lots.map((lot) =>
        this.http
          .get<Page<WaferDto>>(`/api/lots/${lot.id}/wafers`, {
            params: listParams({ pageSize: 200 }),
          })
          .pipe(
            switchMap((page) =>
              page.items.length === 0
                ? of([] as SweepChoice[][])
                : forkJoin(
                    page.items.map((wafer) =>
                      this.http
                        .get<Page<SweepSummaryDto> | SweepSummaryDto[]>(
                          `/api/wafers/${wafer.id}/sweeps`,
                        )
                        .pipe(
                          map((b) =>
                            itemsOf(b).map((sweep) => ({ sweep, wafer, lotCode: lot.code })),
                          ),
                          catchError(() => of([] as SweepChoice[])),
                        ),
                    ),
                  ),
            ),
            map((lists) => lists.flat()),
          ),
      ),
    ).pipe(map((lists) => lists.flat()));
  }

  compare(sweepIds: number[]): Observable<CompareResponse> {
    return this.http.get<CompareResponse>('/api/compare', {
      params: listParams({ sweeps: sweepIds.join(',') }),
    });
  }
}
