import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  ASSIGNMENT_STATES,
  type AssignmentDto,
  type AssignmentState,
  DEFAULT_PAGE_SIZE,
} from '@rhotrace/api-types';
import { formatDay } from '../../../shared/format';
import { isoFromDay } from '../../../shared/iso-date';
import { AssignmentsApi } from '../assignments-api';
import { AssignForm } from './assign-form';
import { RowCards } from '../../../shared/row-cards';

/** The manager's worklist: assign wafers, follow states, see what is overdue. */
@Component({
  selector: 'rt-worklist',
  imports: [
    RowCards,
    MatTableModule,
    MatPaginatorModule,
    MatSelectModule,
    MatFormFieldModule,
    MatCheckboxModule,
    MatDatepickerModule,
    MatInputModule,
    MatButtonModule,
    RouterLink,
    AssignForm,
  ],
  templateUrl: './worklist.html',
  styles: `
    table {
      width: 100%;
    }
    .filters mat-form-field {
      width: 200px;
    }
    tr.overdue td:first-child {
      border-left: 4px solid var(--mat-sys-error);
    }
    .state-field,
    .assignee-field {
      width: 150px;
    }
    .fulfilled {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .due-field {
      width: 11rem;
    }
    .panel {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      padding: 4px 16px 12px;
      margin-bottom: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Worklist {
  private readonly api = inject(AssignmentsApi);
  private readonly snackBar = inject(MatSnackBar);

  /** `?wafer=ID` preselects the wafer in the form. */
  readonly wafer = input<string>();
  protected readonly preselect = computed(() => (this.wafer() ? Number(this.wafer()) : null));

  protected readonly states = ASSIGNMENT_STATES;
  protected readonly day = formatDay;
  protected readonly columns = ['wafer', 'task', 'assignee', 'station', 'due', 'state'];
  private readonly stations = rxResource({ stream: () => this.api.stations() });
  /** Active people a task can be handed to. */
  protected readonly assignees = rxResource({ stream: () => this.api.assignees() });
  /** Station names by id, for the station column. */
  protected readonly stationNames = computed(
    () => new Map((this.stations.value() ?? []).map((s) => [s.id, s.name])),
  );
  protected readonly state = signal<AssignmentState | ''>('');
  protected readonly overdueOnly = signal(false);
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(DEFAULT_PAGE_SIZE);
  protected readonly list = rxResource({
    params: () => ({
      state: this.state(),
      overdue: this.overdueOnly(),
      page: this.pageIndex() + 1,
      pageSize: this.pageSize(),
    }),
    stream: ({ params }) =>
      this.api.list({
        state: params.state,
        overdue: params.overdue ? 'true' : undefined,
        page: params.page,
        pageSize: params.pageSize,
        sort: 'dueDate',
      }),
  });

  protected setPage(e: PageEvent): void {
    this.pageIndex.set(e.pageIndex);
    this.pageSize.set(e.pageSize);
  }

  protected move(a: AssignmentDto, state: AssignmentState): void {
    this.api.update(a.id, { state }).subscribe(() => this.list.reload());
  }

  protected isListed(userId: number): boolean {
    return (this.assignees.value() ?? []).some((p) => p.id === userId);
  }

  /** Gives the task to someone else; they get the assignment e-mail. */
  protected handOver(a: AssignmentDto, assigneeId: number): void {
    if (assigneeId === a.assigneeId) return;
    this.api.update(a.id, { assigneeId }).subscribe((saved) => {
      this.snackBar.open(
        `Handed to ${saved.assigneeName ?? 'them'}; an e-mail is on its way.`,
        'OK',
        { duration: 5000 },
      );
      this.list.reload();
    });
  }

  /**
   * Moves the due date (an emptied field keeps the old one; a day not written YYYY-MM-DD is
   * refused in words).
   */
  protected redate(a: AssignmentDto, day: Date | null, field: HTMLElement): void {
    const text = field instanceof HTMLInputElement ? field.value.trim() : '';
    if (day === null) {
      if (text !== '')
        this.snackBar.open(
          `Write the date as YYYY-MM-DD, e.g. 2026-12-05 ("${text}" is not).`,
          'OK',
          {
            duration: 6000,
          },
        );
      return;
    }
    const dueDate = isoFromDay(day);
    if (dueDate === a.dueDate) return;
    this.api.update(a.id, { dueDate }).subscribe(() => {
      this.snackBar.open(`Now due on ${dueDate}.`, 'OK', { duration: 4000 });
      this.list.reload();
    });
  }

  protected onCreated(a: AssignmentDto): void {
    this.snackBar.open(`Assigned to ${a.assigneeName ?? 'them'}; an e-mail is on its way.`, 'OK', {
      duration: 5000,
    });
    this.list.reload();
  }
}
