import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import {
  type AssignmentDto,
  type AssignmentState,
  type SweepSummaryDto,
  WAFER_STATES,
  type WaferDto,
  type WaferState,
} from '@rhotrace/api-types';
import { catchError, filter, of, switchMap } from 'rxjs';
import { Session } from '../../../core/auth/session';
import { Confirmer } from '../../../shared/confirm-dialog';
import { Downloader } from '../../../shared/download';
import { EstimateNote } from '../../../shared/estimate-note';
import { formatDay } from '../../../shared/format';
import { FormatLengthPipe, FormatValuePipe } from '../../../shared/format-value';
import { ValueAt23C } from '../../../shared/value-at-23c/value-at-23c';
import { SweepPoints } from '../sweep-points/sweep-points';
import { LotsApi } from '../../lots/lots-api';
import { METHOD_WORDS } from '../sweep-upload/column-units';
import { SweepUpload } from '../sweep-upload/sweep-upload';
import { NotAvailable } from '../../../shared/not-available';
import { WafersApi } from '../wafers-api';
import { MapView } from '../../maps/map-view/map-view';
import { RecordHistory } from '../../../shared/record-history/record-history';
import { PlanForm } from '../../planner/plan-form/plan-form';
import { PlanView } from '../../planner/plan-view/plan-view';
import { RowCards } from '../../../shared/row-cards';
import { SkipTarget } from '../../../shared/skip-target';
import { WaferEditDialog, type WaferEditQuestion } from './wafer-edit-dialog';

const NEXT_STATE: Partial<Record<AssignmentState, { state: AssignmentState; words: string }>> = {
  assigned: { state: 'in progress', words: 'Start' },
  'in progress': { state: 'done', words: 'Mark done' },
};

/**
 * One wafer: its facts, the 23 °C value with its uncertainty and verdict, dopant density,
 * assignments, sweeps with their points, and the upload.
 */
@Component({
  selector: 'rt-wafer-page',
  imports: [
    SkipTarget,
    RowCards,
    RecordHistory,
    MatTableModule,
    MatButtonModule,
    MatSelectModule,
    MatFormFieldModule,
    MatProgressBarModule,
    RouterLink,
    FormatValuePipe,
    FormatLengthPipe,
    SweepPoints,
    SweepUpload,
    EstimateNote,
    ValueAt23C,
    NotAvailable,
    MapView,
    PlanForm,
    PlanView,
  ],
  templateUrl: './wafer-page.html',
  styleUrl: './wafer-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WaferPage {
  private readonly api = inject(WafersApi);
  private readonly lots = inject(LotsApi);
  private readonly downloader = inject(Downloader);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly confirmer = inject(Confirmer);
  private readonly dialog = inject(MatDialog);

  readonly id = input.required<string>();
  protected readonly waferId = computed(() => Number(this.id()));

  protected readonly canEdit = this.session.can('records:edit');
  protected readonly canAnalyse = this.session.can('fits:run');
  protected readonly canUpload = this.session.can('sweeps:upload');
  protected readonly canPlan = this.session.can('plans:make');
  /** Lots list and breadcrumb are for roles that see every lot. */
  protected readonly seesAllLots = this.session.can('records:see-all');
  /** Roles that see every assignment (others list and move only their own). */
  protected readonly seesAllAssignments = this.session.can('assignments:see-all');
  protected readonly userId = computed(() => this.session.user()?.id ?? null);
  protected readonly states = WAFER_STATES;
  protected readonly day = formatDay;
  protected readonly nextState = NEXT_STATE;

  protected readonly wafer = rxResource({
    params: () => this.waferId(),
    stream: ({ params }) => this.api.get(params),
  });
  protected readonly lot = rxResource({
    params: () => (this.wafer.hasValue() ? this.wafer.value().lotId : undefined),
    stream: ({ params }) => this.lots.get(params),
  });
  // The wafer's parts load once the wafer itself is known to be visible, so a hidden wafer
  // shows one "not available" page, not a row of empty headings and "not found" messages.
  protected readonly sweeps = rxResource({
    params: () => (this.wafer.hasValue() ? this.waferId() : undefined),
    stream: ({ params }) => this.api.sweeps(params),
  });
  /** The sweep chosen to count at 23 °C (null: the newest); read only once the wafer loaded. */
  protected readonly countedSweepId = computed(() =>
    this.wafer.hasValue() ? (this.wafer.value().countedSweepId ?? null) : null,
  );
  protected readonly dopant = rxResource({
    params: () => ({
      id: this.waferId(),
      sweeps: this.sweeps.value()?.length ?? 0,
      counted: this.countedSweepId(),
    }),
    stream: ({ params }) =>
      params.sweeps > 0 ? this.api.dopant(params.id).pipe(catchError(() => of(null))) : of(null),
  });
  protected readonly assignments = rxResource({
    params: () => (this.wafer.hasValue() ? this.waferId() : undefined),
    stream: ({ params }) =>
      this.api.assignments(
        this.seesAllAssignments ? { waferId: params } : { assignee: 'me', waferId: params },
      ),
  });
  protected readonly stations = rxResource({
    params: () => this.canUpload,
    stream: () => this.api.stations().pipe(catchError(() => of([]))),
  });

  protected readonly chosenSweepId = signal<number | null>(null);
  protected readonly shownSweepId = computed(
    () => this.chosenSweepId() ?? this.sweeps.value()?.[0]?.id ?? null,
  );
  /** The shown sweep as listed (its points are the `rt-sweep-points` part's). */
  protected readonly shownSummary = computed(() => {
    const id = this.shownSweepId();
    return this.sweeps.value()?.find((s) => s.id === id) ?? null;
  });
  /** The shown sweep's id when it is a wafer map. */
  protected readonly shownMapId = computed(() => {
    const shown = this.shownSummary();
    return shown?.map ? shown.id : null;
  });
  protected readonly sweepColumns = [
    'file',
    'counts',
    'method',
    'points',
    'range',
    'by',
    'when',
    'actions',
  ];

  protected methodWord(method: string): string {
    return (METHOD_WORDS as Record<string, string>)[method] ?? method;
  }

  /** Chooses the sweep that gives the 23 °C value and verdict (null: the newest); audited. */
  protected countSweep(sweepId: number | null): void {
    this.api
      .update(this.waferId(), { countedSweepId: sweepId })
      .subscribe(() => this.wafer.reload());
  }

  protected setState(state: WaferState): void {
    this.api.update(this.waferId(), { state }).subscribe(() => this.wafer.reload());
  }

  protected advance(assignment: AssignmentDto): void {
    const next = NEXT_STATE[assignment.state];
    if (!next) return;
    this.api.moveAssignment(assignment.id, next.state).subscribe(() => this.assignments.reload());
  }

  /** An upload moves the wafer to measured and the uploader's task on: read all three again. */
  protected onStored(sweepId: number): void {
    this.chosenSweepId.set(sweepId);
    this.sweeps.reload();
    this.wafer.reload();
    this.assignments.reload();
  }

  protected downloadRaw(id: number, name: string): void {
    void this.downloader.save(`/api/sweeps/${id}/raw`, name);
  }

  protected downloadPoints(id: number): void {
    void this.downloader.save(`/api/sweeps/${id}/points.csv`, `sweep-${id}-points.csv`);
  }

  /** Deletes a wafer not yet measured (the API refuses a measured one with a message). */
  protected editWafer(wafer: WaferDto): void {
    const lot = this.lot.value();
    this.dialog
      .open<WaferEditDialog, WaferEditQuestion, WaferDto>(WaferEditDialog, {
        data: {
          wafer,
          lotCode: lot?.code ?? wafer.lotCode ?? '',
          lotThicknessCm: lot?.thicknessCm ?? null,
        },
        width: '480px',
      })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.wafer.reload();
      });
  }

  protected removeWafer(number: string, lotId: number): void {
    this.confirmer
      .ask({
        title: `Delete wafer ${number}?`,
        message: 'Its open assignments are cancelled; the change trail keeps the record.',
        confirmWords: 'Delete the wafer',
      })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.deleteWafer(this.waferId())),
      )
      .subscribe(() => void this.router.navigate(['/lots', lotId]));
  }

  protected removeSweep({ id, originalName }: SweepSummaryDto): void {
    this.confirmer
      .ask({
        title: `Delete the sweep ${originalName}?`,
        message: 'It leaves the lists and the analyses; the change trail keeps the record.',
        confirmWords: 'Delete the sweep',
      })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.deleteSweep(id)),
      )
      .subscribe(() => {
        this.chosenSweepId.set(null);
        this.sweeps.reload();
      });
  }
}
