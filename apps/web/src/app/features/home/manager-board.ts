import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { formatDay } from '../../shared/format';
import type { AssignmentDto, Page } from '@rhotrace/api-types';
import type { ListQuery } from '../../shared/list-query';
import { HomeApi } from './home-api';

/** Tasks listed per group; the rest are one link away, in the worklist. */
const SHOWN_PER_GROUP = 6;

/** A manager's view of the lab's assignments: open, overdue and finished. */
@Component({
  selector: 'rt-manager-board',
  imports: [RouterLink, MatButtonModule],
  template: `
    <div class="rt-row">
      <h2 class="rt-section-title">Assignments</h2>
      <span class="rt-spacer"></span>
      <a mat-stroked-button routerLink="/worklist">Open the worklist</a>
    </div>
    <div class="counts">
      <div class="count">
        <strong>{{ counts().open }}</strong> open
      </div>
      <div class="count" [class.alarm]="counts().overdue > 0">
        <strong>{{ counts().overdue }}</strong> overdue
      </div>
      <div class="count">
        <strong>{{ counts().finished }}</strong> finished
      </div>
    </div>
    @for (group of groups(); track group.title) {
      <h3 class="rt-section-title">{{ group.title }}</h3>
      @if (group.items.length === 0) {
        <p class="rt-muted">None.</p>
      }
      <ul class="cards" [attr.aria-label]="group.title">
        @for (a of group.items; track a.id) {
          <li class="card" [class.overdue]="a.overdue">
            <a class="title" [routerLink]="['/wafers', a.waferId]"
              >Lot {{ a.lotCode }} · Wafer {{ a.waferNumber }}</a
            >
            <span>{{ a.task }} — {{ a.assigneeName }}</span>
            <span class="due">Due {{ day(a.dueDate) }}</span>
            <span class="chip">{{ a.state }}</span>
          </li>
        }
      </ul>
      @if (group.total > group.items.length) {
        <a class="more" routerLink="/worklist"
          >All {{ group.total }} {{ group.title.toLowerCase() }} in the worklist</a
        >
      }
    }
  `,
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ManagerBoard {
  private readonly api = inject(HomeApi);
  protected readonly day = formatDay;
  /**
   * Each group is asked of the server with its own filter, so its count is the lab's whole count
   * (the page's `total`) however many tasks there are; only the first few of each are listed.
   */
  private readonly overdueTasks = this.group({ overdue: true, sort: 'dueDate' });
  private readonly openTasks = this.group({ open: true, overdue: false, sort: 'dueDate' });
  private readonly doneTasks = this.group({ state: 'done', sort: '-updatedAt' });
  protected readonly counts = computed(() => {
    const overdue = this.overdueTasks.value()?.total ?? 0;
    return {
      overdue,
      open: overdue + (this.openTasks.value()?.total ?? 0),
      finished: this.doneTasks.value()?.total ?? 0,
    };
  });
  protected readonly groups = computed(() => [
    this.shown('Overdue', this.overdueTasks.value()),
    this.shown('Open', this.openTasks.value()),
    this.shown('Recently finished', this.doneTasks.value()),
  ]);

  private group(query: ListQuery) {
    return rxResource({
      stream: () => this.api.assignments({ ...query, pageSize: SHOWN_PER_GROUP }),
    });
  }

  private shown(title: string, page: Page<AssignmentDto> | undefined) {
    return { title, items: page?.items ?? [], total: page?.total ?? 0 };
  }
}
