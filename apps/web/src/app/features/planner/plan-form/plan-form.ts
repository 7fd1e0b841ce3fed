import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type {
  FieldProblem,
  PlannerRequest,
  PlannerResponse,
  PlanSpacing,
} from '@rhotrace/api-types';
import { catchError, of } from 'rxjs';
import { ApiError, applyServerErrors } from '../../../core/http/api-error';
import { above, fieldError } from '../../../shared/field-error';
import { WafersApi } from '../../wafers/wafers-api';
import { PlannerApi } from '../planner-api';
import { PlanView } from '../plan-view/plan-view';

/** A plan with the request it was computed from (what an assignment attaches). */
export interface PlannedSweep {
  request: PlannerRequest;
  plan: PlannerResponse;
}

/**
 * "Plan a sweep" for one wafer: station, temperature range and steps, the meter's and the
 * sample's limits; the server computes the plan from the wafer's lot and the station, and the
 * plan is shown below the form.
 */
@Component({
  selector: 'rt-plan-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    PlanView,
  ],
  templateUrl: './plan-form.html',
  styles: `
    form {
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
      align-items: flex-start;
    }
    mat-form-field {
      width: 180px;
    }
    .station {
      width: 260px;
    }
    .problem {
      color: var(--mat-sys-error);
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanForm {
  private readonly api = inject(PlannerApi);
  private readonly wafers = inject(WafersApi);
  private readonly fb = inject(NonNullableFormBuilder);

  readonly waferId = input.required<number>();
  /** Label of the submit button (the assignment form says what happens next). */
  readonly action = input('Compute the plan');
  readonly planned = output<PlannedSweep>();

  protected readonly error = fieldError;
  protected readonly stations = rxResource({
    stream: () => this.wafers.stations().pipe(catchError(() => of([]))),
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly unmatched = signal<FieldProblem[]>([]);
  protected readonly result = signal<PlannedSweep | null>(null);
  protected readonly spacings: Array<{ value: PlanSpacing; words: string }> = [
    { value: 'inverse', words: 'Even in 1/T (Arrhenius)' },
    { value: 'linear', words: 'Even in T' },
  ];

  protected readonly form = this.fb.group({
    stationId: this.fb.control<number | null>(null, Validators.required),
    minK: this.fb.control<number | null>(80, [Validators.required, above(0)]),
    maxK: this.fb.control<number | null>(300, [Validators.required, above(0)]),
    count: this.fb.control<number | null>(20, [
      Validators.required,
      Validators.min(2),
      Validators.max(500),
    ]),
    spacing: this.fb.control<PlanSpacing>('inverse'),
    targetVoltageV: this.fb.control<number | null>(0.01, [Validators.required, above(0)]),
    maxVoltageV: this.fb.control<number | null>(0.1, [Validators.required, above(0)]),
    maxPowerW: this.fb.control<number | null>(0.001, [Validators.required, above(0)]),
    dwellS: this.fb.control<number | null>(120, [Validators.min(0)]),
    rampKPerMin: this.fb.control<number | null>(5, [above(0)]),
    denseAroundTransitions: this.fb.control(false),
  });

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const request: PlannerRequest = {
      waferId: this.waferId(),
      stationId: v.stationId!,
      minK: v.minK!,
      maxK: v.maxK!,
      count: v.count!,
      spacing: v.spacing,
      targetVoltageV: v.targetVoltageV!,
      maxVoltageV: v.maxVoltageV!,
      maxPowerW: v.maxPowerW!,
      ...(v.dwellS !== null ? { dwellS: v.dwellS } : {}),
      ...(v.rampKPerMin !== null ? { rampKPerMin: v.rampKPerMin } : {}),
      denseAroundTransitions: v.denseAroundTransitions,
    };
    this.busy.set(true);
    this.problem.set(null);
    this.unmatched.set([]);
    this.api.plan(request).subscribe({
      next: (plan) => {
        this.busy.set(false);
        this.result.set({ request, plan });
        this.planned.emit({ request, plan });
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.result.set(null);
        if (err instanceof ApiError) {
          this.unmatched.set(applyServerErrors(this.form, err));
          this.problem.set(err.message);
        }
      },
    });
  }
}
