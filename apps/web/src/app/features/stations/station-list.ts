import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { type StationDto, THERMOMETERS, type Thermometer } from '@rhotrace/api-types';
import { Session } from '../../core/auth/session';
import { ApiError, applyServerErrors } from '../../core/http/api-error';
import { above, fieldError } from '../../shared/field-error';
import { formatDay } from '../../shared/format';
import { FormatValuePipe } from '../../shared/format-value';
import { StationsApi } from './stations-api';

/** Probe stations: list, register, edit. */
@Component({
  selector: 'rt-station-list',
  imports: [
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
    FormatValuePipe,
  ],
  templateUrl: './station-list.html',
  styles: `
    table {
      width: 100%;
    }
    form {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      padding: 12px 16px;
      margin-bottom: 16px;
    }
    .problem,
    .danger {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationList {
  private readonly api = inject(StationsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly canEdit = inject(Session).can('stations:edit');
  protected readonly thermometers = THERMOMETERS;
  protected readonly error = fieldError;
  protected readonly day = formatDay;
  protected readonly columns = [
    'name',
    'spacing',
    'tip',
    'thermometer',
    'range',
    'calibrated',
    'edit',
  ];
  protected readonly stations = rxResource({
    stream: () => this.api.list({ pageSize: 200, sort: 'name' }),
  });
  protected readonly editing = signal<number | 'new' | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    probeSpacingCm: this.fb.control<number | null>(0.1, [Validators.required, above(0)]),
    tipRadiusCm: this.fb.control<number | null>(null, above(0)),
    thermometer: this.fb.control<Thermometer>('thermocouple', Validators.required),
    rtdR0Ohm: this.fb.control<number | null>(null, above(0)),
    minTemperatureK: this.fb.control<number | null>(77, [Validators.required, above(0)]),
    maxTemperatureK: this.fb.control<number | null>(500, [Validators.required, above(0)]),
    calibratedOn: this.fb.control<string | null>(null),
    notes: this.fb.control<string | null>(null),
  });

  protected remove(s: StationDto): void {
    const question =
      `Delete station ${s.name}? Sweeps measured on it keep their record of it, ` +
      'and it stays in the change trail.';
    if (!globalThis.confirm(question)) return;
    this.api.remove(s.id).subscribe(() => {
      if (this.editing() === s.id) this.editing.set(null);
      this.stations.reload();
    });
  }

  protected startNew(): void {
    this.form.reset();
    this.problem.set(null);
    this.editing.set('new');
  }

  protected edit(s: StationDto): void {
    const { id: _i, createdAt: _c, updatedAt: _u, ...values } = s;
    this.form.setValue({ ...values, calibratedOn: values.calibratedOn?.slice(0, 10) ?? null });
    this.problem.set(null);
    this.editing.set(s.id);
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const body = {
      ...v,
      probeSpacingCm: v.probeSpacingCm!,
      minTemperatureK: v.minTemperatureK!,
      maxTemperatureK: v.maxTemperatureK!,
      rtdR0Ohm: v.thermometer === 'platinum-rtd' ? v.rtdR0Ohm : null,
      calibratedOn: v.calibratedOn || null,
      notes: v.notes || null,
    };
    const target = this.editing();
    const request =
      target === 'new' ? this.api.create(body) : this.api.update(Number(target), body);
    request.subscribe({
      next: () => {
        this.editing.set(null);
        this.stations.reload();
      },
      error: (err: unknown) => {
        if (err instanceof ApiError) {
          applyServerErrors(this.form, err);
          this.problem.set(err.message);
        }
      },
    });
  }
}
