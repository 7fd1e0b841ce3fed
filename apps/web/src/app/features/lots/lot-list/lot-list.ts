import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE, type LotDto, MATERIALS, type Page } from '@rhotrace/api-types';
import { catchError, debounceTime, distinctUntilChanged, of, switchMap, tap } from 'rxjs';
import { Session } from '../../../core/auth/session';
import { FormatValuePipe } from '../../../shared/format-value';
import { formatDay } from '../../../shared/format';
import { sortParam } from '../../../shared/list-query';
import { LotsApi } from '../lots-api';
import { RowCards } from '../../../shared/row-cards';

interface LotQueryState {
  q: string;
  material: string;
  dopantType: string;
  page: number;
  pageSize: number;
  sort: string | undefined;
}

const EMPTY_PAGE: Page<LotDto> = { items: [], total: 0, page: 1, pageSize: DEFAULT_PAGE_SIZE };

/** All lots: search, filter by material and type, sort and page. */
@Component({
  selector: 'rt-lot-list',
  imports: [
    RowCards,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatProgressBarModule,
    RouterLink,
    FormatValuePipe,
  ],
  templateUrl: './lot-list.html',
  styleUrl: './lot-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LotList {
  private readonly api = inject(LotsApi);
  protected readonly canEdit = inject(Session).can('records:edit');
  protected readonly materials = MATERIALS;
  protected readonly columns = [
    'code',
    'material',
    'dopant',
    'spec',
    'waferCount',
    'receivedOn',
    'supplier',
  ];
  protected readonly day = formatDay;

  protected readonly search = signal('');
  protected readonly query = signal<LotQueryState>({
    q: '',
    material: '',
    dopantType: '',
    page: 1,
    pageSize: DEFAULT_PAGE_SIZE,
    sort: '-receivedOn',
  });
  protected readonly loading = signal(true);

  private readonly debouncedSearch = toSignal(
    toObservable(this.search).pipe(debounceTime(250), distinctUntilChanged()),
    { initialValue: '' },
  );
  private readonly effectiveQuery = computed(() => ({
    ...this.query(),
    q: this.debouncedSearch(),
  }));

  protected readonly page = toSignal(
    toObservable(this.effectiveQuery).pipe(
      tap(() => this.loading.set(true)),
      switchMap((q) =>
        this.api
          .list({
            q: q.q,
            material: q.material,
            dopantType: q.dopantType,
            page: q.page,
            pageSize: q.pageSize,
            sort: q.sort,
          })
          .pipe(catchError(() => of(EMPTY_PAGE))),
      ),
      tap(() => this.loading.set(false)),
    ),
    { initialValue: EMPTY_PAGE },
  );

  protected setSearch(value: string): void {
    this.search.set(value);
    this.query.update((q) => ({ ...q, page: 1 }));
  }

  protected setFilter(key: 'material' | 'dopantType', value: string): void {
    this.query.update((q) => ({ ...q, [key]: value, page: 1 }));
  }

  protected setSort(sort: Sort): void {
    this.query.update((q) => ({ ...q, sort: sortParam(sort.active, sort.direction), page: 1 }));
  }

  protected setPage(event: PageEvent): void {
    this.query.update((q) => ({ ...q, page: event.pageIndex + 1, pageSize: event.pageSize }));
  }
}
