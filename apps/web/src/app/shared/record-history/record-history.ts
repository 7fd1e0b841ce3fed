import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { AuditEventDto, Page } from '@rhotrace/api-types';
import { of } from 'rxjs';
import { ChangeList } from './change-list';
import { formatStamp } from '../format';

/** The records with a history of their own. */
export type HistoryRecord = 'lots' | 'wafers' | 'stations';

const PAGE = 20;

/**
 * A record's change trail on its own page, read when the panel is opened: who changed what and
 * when, in words, newest first, a page at a time.
 */
@Component({
  selector: 'rt-record-history',
  imports: [MatExpansionModule, MatButtonModule, MatProgressBarModule, ChangeList],
  template: `
    <mat-expansion-panel (opened)="open.set(true)" class="history">
      <mat-expansion-panel-header>
        <mat-panel-title>History</mat-panel-title>
        <mat-panel-description>Who changed this record, and what</mat-panel-description>
      </mat-expansion-panel-header>
      @if (events.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the history" />
      } @else if (events.error()) {
        <p role="alert">The history could not be loaded.</p>
      } @else if (events.value(); as page) {
        @if (page.items.length === 0) {
          <p class="rt-muted">No changes recorded.</p>
        }
        <ol class="events" aria-label="Changes, newest first">
          @for (e of page.items; track e.id) {
            <li>
              <time [attr.datetime]="e.createdAt">{{ when(e.createdAt) }}</time>
              <rt-change-list [event]="e" />
            </li>
          }
        </ol>
        @if (page.total > page.pageSize) {
          <div class="rt-row">
            <button mat-button type="button" [disabled]="page.page === 1" (click)="turn(-1)">
              Newer changes
            </button>
            <span class="rt-muted">
              {{ (page.page - 1) * page.pageSize + 1 }}–{{
                (page.page - 1) * page.pageSize + page.items.length
              }}
              of {{ page.total }}
            </span>
            <button
              mat-button
              type="button"
              [disabled]="page.page * page.pageSize >= page.total"
              (click)="turn(1)"
            >
              Older changes
            </button>
          </div>
        }
      }
    </mat-expansion-panel>
  `,
  styles: `
    .history {
      margin-top: 24px;
    }
    .events {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .events li {
      display: grid;
      grid-template-columns: 11em 1fr;
      gap: 12px;
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    time {
      color: var(--mat-sys-on-surface-variant);
    }
    @media (max-width: 600px) {
      .events li {
        grid-template-columns: 1fr;
        gap: 2px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordHistory {
  private readonly http = inject(HttpClient);
  readonly record = input.required<HistoryRecord>();
  readonly recordId = input.required<number>();
  protected readonly open = signal(false);
  protected readonly page = signal(1);
  protected readonly events = rxResource({
    params: () => ({ open: this.open(), page: this.page(), id: this.recordId() }),
    stream: ({ params }) =>
      params.open
        ? this.http.get<Page<AuditEventDto>>(`/api/${this.record()}/${params.id}/history`, {
            params: { page: params.page, pageSize: PAGE },
          })
        : of(null),
  });

  protected turn(by: 1 | -1): void {
    this.page.update((p) => Math.max(1, p + by));
  }

  protected readonly when = formatStamp;
}
