import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { AssignmentDto } from '@rhotrace/api-types';
import { Caution } from '../../shared/caution';
import { formatDay, todayLocal } from '../../shared/format';
import { HomeApi } from './home-api';
import { PlanView } from '../planner/plan-view/plan-view';

/** A technician's queue: open assignments, soonest due first. */
@Component({
  selector: 'rt-technician-queue',
  imports: [RouterLink, MatButtonModule, MatProgressBarModule, Caution, PlanView],
  template: `
    <h2 class="rt-section-title">Your queue</h2>
    @if (queue.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading your queue" />
    }
    @if (open().length === 0 && !queue.isLoading()) {
      <p class="rt-muted">Nothing is assigned to you right now.</p>
    }
    <ul class="cards" aria-label="Assigned wafers">
      @for (a of open(); track a.id) {
        <li class="card" [class.overdue]="a.overdue">
          <a class="title" [routerLink]="['/wafers', a.waferId]"
            >Lot {{ a.lotCode }} · Wafer {{ a.waferNumber }}</a
          >
          <span>{{ a.task }}</span>
          <span class="due"
            >Due {{ day(a.dueDate) }}
            @if (a.overdue) {
              — <span class="rt-fail">overdue</span>
            } @else if (a.dueDate.slice(0, 10) === today) {
              — today
            }
          </span>
          <span class="chip">{{ a.state }}</span>
          @if (a.notes) {
            <span class="rt-muted">{{ a.notes }}</span>
          }
          @if (a.plan; as p) {
            <details>
              <summary>Measurement plan: {{ p.plan.steps.length }} steps</summary>
              <rt-plan-view
                [plan]="p.plan"
                [compact]="true"
                [exportName]="'plan-assignment-' + a.id + '.csv'"
              />
            </details>
          }
          <div class="actions">
            <a mat-flat-button [routerLink]="['/wafers', a.waferId]">Open and upload</a>
          </div>
        </li>
      }
    </ul>
    <rt-caution />
  `,
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TechnicianQueue {
  private readonly api = inject(HomeApi);
  protected readonly day = formatDay;
  protected readonly today = todayLocal();
  protected readonly queue = rxResource({
    stream: () => this.api.assignments({ assignee: 'me', sort: 'dueDate', pageSize: 100 }),
  });
  protected readonly open = computed<AssignmentDto[]>(() =>
    (this.queue.value()?.items ?? []).filter(
      (a) => a.state === 'assigned' || a.state === 'in progress',
    ),
  );
}
