import {
  ChangeDetectionStrategy,
  Component,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource, toObservable, toSignal } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { AssignmentDto, FieldProblem, WaferDto } from '@rhotrace/api-types';
import { catchError, debounceTime, map, of, switchMap } from 'rxjs';
import { ApiError, applyServerErrors } from '../../../core/http/api-error';
import { Caution } from '../../../shared/caution';
import { fieldError } from '../../../shared/field-error';
import { todayLocal } from '../../../shared/format';
import { dayFromIso, isoFromDay } from '../../../shared/iso-date';
import { AssignmentsApi } from '../assignments-api';
import { PlanForm, type PlannedSweep } from '../../planner/plan-form/plan-form';

/** Tasks the lab hands out most (free text is fine too). */
export const COMMON_TASKS = [
  'Temperature sweep, 77 K to 400 K',
  'Temperature sweep, room temperature to 600 K',
  'Room-temperature resistivity check',
  'Repeat the last sweep',
  'Hall sweep, 20 K to 400 K',
] as const;

/** Task wording that means a Hall magnet is used (as the API's safety cautions read it). */
const MAGNET_TASK = /\bhall\b|magnet|\bb[- ]?field|tesla/i;

/** Assigning a wafer to someone with a task and a due date (the assignee is e-mailed). */
@Component({
  selector: 'rt-assign-form',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDatepickerModule,
    Caution,
    PlanForm,
  ],
  templateUrl: './assign-form.html',
  styles: `
    form {
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
      align-items: flex-start;
    }
    mat-form-field {
      width: 260px;
    }
    .wide {
      width: 100%;
      max-width: 540px;
    }
    .problem {
      color: var(--mat-sys-error);
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssignForm {
  private readonly api = inject(AssignmentsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly formDirective = viewChild(FormGroupDirective);

  /** Wafer to preselect (from `?wafer=`). */
  readonly preselectWaferId = input<number | null>(null);
  readonly created = output<AssignmentDto>();

  protected readonly tasks = COMMON_TASKS;
  protected readonly error = fieldError;
  protected readonly today = dayFromIso(todayLocal());
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly unmatched = signal<FieldProblem[]>([]);
  protected readonly assignees = rxResource({ stream: () => this.api.assignees() });
  protected readonly stations = rxResource({ stream: () => this.api.stations() });
  /** Whether a measurement plan goes with the assignment, and the one computed for it. */
  protected readonly attachPlan = signal(false);
  protected readonly plan = signal<PlannedSweep | null>(null);

  protected readonly form = this.fb.group({
    waferId: this.fb.control<number | null>(null, Validators.required),
    assigneeId: this.fb.control<number | null>(null, Validators.required),
    task: ['', [Validators.required, Validators.maxLength(200)]],
    dueDate: this.fb.control<Date | null>(null, Validators.required),
    notes: this.fb.control<string | null>(null),
    stationId: this.fb.control<number | null>(null),
  });

  /** True while the task names a Hall measurement: the caution adds the magnet's hazards. */
  protected readonly magnet = toSignal(
    this.form.controls.task.valueChanges.pipe(map((task) => MAGNET_TASK.test(task ?? ''))),
    { initialValue: false },
  );

  protected readonly waferSearch = signal('');
  protected readonly wafers = toSignal(
    toObservable(this.waferSearch).pipe(
      debounceTime(200),
      switchMap((q) => this.api.wafers(q).pipe(catchError(() => of([] as WaferDto[])))),
    ),
    { initialValue: [] as WaferDto[] },
  );
  protected readonly chosenWafer = signal<WaferDto | null>(null);
  protected readonly waferLabel = (w: WaferDto | null) =>
    w ? `${w.lotCode ? 'Lot ' + w.lotCode + ' · ' : ''}wafer ${w.number}` : '';

  protected pickWafer(wafer: WaferDto): void {
    this.chosenWafer.set(wafer);
    this.form.controls.waferId.setValue(wafer.id);
    this.plan.set(null);
  }

  protected submit(): void {
    const pre = this.preselectWaferId();
    if (this.form.controls.waferId.value === null && pre !== null)
      this.form.controls.waferId.setValue(pre);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const plan = this.attachPlan() ? this.plan() : null;
    if (this.attachPlan() && (!plan || plan.request.waferId !== v.waferId)) {
      this.problem.set('Compute the measurement plan for this wafer first, or untick it.');
      return;
    }
    this.saving.set(true);
    this.problem.set(null);
    this.api
      .create({
        waferId: v.waferId!,
        assigneeId: v.assigneeId!,
        task: v.task,
        dueDate: isoFromDay(v.dueDate!),
        notes: v.notes || null,
        stationId: v.stationId,
        ...(plan ? { plan: plan.request } : {}),
      })
      .subscribe({
        next: (a) => {
          this.saving.set(false);
          // resetForm also clears the submitted state, so the empty form shows no errors.
          this.formDirective()?.resetForm();
          this.chosenWafer.set(null);
          this.waferSearch.set('');
          this.plan.set(null);
          this.attachPlan.set(false);
          this.created.emit(a);
        },
        error: (err: unknown) => {
          this.saving.set(false);
          if (err instanceof ApiError) {
            this.unmatched.set(applyServerErrors(this.form, err));
            this.problem.set(err.message);
          }
        },
      });
  }
}
