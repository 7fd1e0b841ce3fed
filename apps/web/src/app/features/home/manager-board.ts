import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { formatDay } from '../../shared/format';
import { HomeApi } from './home-api';

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
        <strong>{{ open().length }}</strong> open
      </div>
      <div class="count" [class.alarm]="overdue().length > 0">
        <strong>{{ overdue().length }}</strong> overdue
      </div>
      <div class="count">
        <strong>{{ finished().length }}</strong> finished
      </div>
    </div>
    @for (group of groups(); track group.title) {
      <h3 class="rt-section-title">{{ group.title }}</h3>
      @if (group.items.length === 0) {
        <p class="rt-muted">None.</p>
      }
      <ul class="cards" [attr.aria-label]="group.title">
        @for (a of group.items.slice(0, 6); track a.id) {
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
      @if (group.items.length > 6) {
        <a class="more" routerLink="/worklist"
          >All {{ group.items.length }} {{ group.title.toLowerCase() }} in the worklist</a
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
  private readonly all = rxResource({
    stream: () => this.api.assignments({ sort: 'dueDate', pageSize: 200 }),
  });
  private readonly items = computed(() => this.all.value()?.items ?? []);
  protected readonly overdue = computed(() => this.items().filter((a) => a.overdue));
  protected readonly open = computed(() =>
    this.items().filter((a) => a.state === 'assigned' || a.state === 'in progress'),
  );
  protected readonly finished = computed(() => this.items().filter((a) => a.state === 'done'));
  protected readonly groups = computed(() => [
    { title: 'Overdue', items: this.overdue() },
    { title: 'Open', items: this.open().filter((a) => !a.overdue) },
    {
      title: 'Recently finished',
      items: [...this.finished()].sort((a, b) => b.updatedAt.localeCompare(a.updatedAt)),
    },
  ]);
}
