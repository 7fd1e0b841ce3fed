import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { SEARCH_KINDS, type SearchHit, type SearchKind } from '@rhotrace/api-types';
import { Session } from '../../core/auth/session';
import { SearchApi } from './search-api';

const KIND_WORDS: Readonly<Record<SearchKind, { one: string; many: string }>> = {
  lots: { one: 'lot', many: 'Lots' },
  wafers: { one: 'wafer', many: 'Wafers' },
  sweeps: { one: 'sweep', many: 'Sweep files' },
  people: { one: 'person', many: 'People' },
};

const PAGE_SIZE = 25;

/** Finds lots, wafers, sweep files and people by name; one kind can be paged through in full. */
@Component({
  selector: 'rt-search-page',
  imports: [
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
  ],
  template: `
    <div class="rt-page">
      <h1 class="rt-page-title">
        {{ query().kind ? 'All ' + words(query().kind!).many.toLowerCase() : 'Find' }}
      </h1>
      <form role="search" (submit)="$event.preventDefault(); find(box.value)">
        <mat-form-field class="box">
          <mat-label>Lot code, wafer, sweep file name or person</mat-label>
          <input matInput #box type="search" [value]="query().q" name="q" />
        </mat-form-field>
      </form>
      @if (result.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Searching" />
      } @else if (result.error()) {
        <p role="alert">The search could not be run.</p>
      }
      @for (g of result.value()?.groups ?? []; track g.kind) {
        <section [attr.aria-labelledby]="'found-' + g.kind">
          <h2 class="rt-section-title" [id]="'found-' + g.kind">
            {{ words(g.kind).many }} ({{ g.total }})
          </h2>
          @if (g.items.length === 0) {
            <p class="rt-muted">No {{ words(g.kind).one }} matches.</p>
          }
          <ul class="hits">
            @for (h of g.items; track h.id) {
              <li>
                @if (linkOf(h); as link) {
                  <a [routerLink]="link">{{ h.title }}</a>
                } @else {
                  <span class="title">{{ h.title }}</span>
                }
                <span class="rt-muted"> · {{ h.detail }}</span>
              </li>
            }
          </ul>
          @if (!query().kind && g.total > g.items.length) {
            <a [routerLink]="[]" [queryParams]="{ q: query().q, kind: g.kind }">
              All {{ g.total }} {{ words(g.kind).many.toLowerCase() }}
            </a>
          }
          @if (query().kind) {
            <mat-paginator
              [length]="g.total"
              [pageIndex]="g.page - 1"
              [pageSize]="g.pageSize"
              [hidePageSize]="true"
              (page)="turn($event)"
              [attr.aria-label]="'Pages of ' + words(g.kind).many.toLowerCase()"
            />
          }
        </section>
      }
    </div>
  `,
  styles: `
    .box {
      width: min(100%, 560px);
    }
    .hits {
      list-style: none;
      padding: 0;
      margin: 0 0 8px;
    }
    .hits li {
      padding: 6px 0;
    }
    .title {
      font-weight: 600;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SearchPage {
  private readonly api = inject(SearchApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly params = toSignal(inject(ActivatedRoute).queryParamMap, { requireSync: true });
  protected readonly query = computed(() => {
    const p = this.params();
    const kind = p.get('kind');
    return {
      q: p.get('q') ?? '',
      kind: (SEARCH_KINDS as readonly string[]).includes(kind ?? '') ? (kind as SearchKind) : null,
      page: Math.max(1, Number(p.get('page')) || 1),
      pageSize: PAGE_SIZE,
    };
  });
  protected readonly result = rxResource({
    params: () => this.query(),
    stream: ({ params }) => this.api.search(params),
  });

  protected words(kind: SearchKind) {
    return KIND_WORDS[kind];
  }

  protected find(q: string): void {
    void this.router.navigate([], { queryParams: { q: q.trim(), kind: this.query().kind } });
  }

  protected turn(e: PageEvent): void {
    void this.router.navigate([], {
      queryParams: { page: e.pageIndex + 1 },
      queryParamsHandling: 'merge',
    });
  }

  /** Where a hit opens, or null where the reader has no page for it. */
  protected linkOf(h: SearchHit): unknown[] | null {
    switch (h.kind) {
      case 'lots':
        return this.session.can('records:see-all') ? ['/lots', h.id] : null;
      case 'wafers':
        return ['/wafers', h.id];
      case 'sweeps':
        return this.session.can('fits:run') ? ['/sweeps', h.id] : ['/wafers', h.waferId];
      case 'people':
        return this.session.can('users:manage') ? ['/people'] : null;
    }
  }
}
