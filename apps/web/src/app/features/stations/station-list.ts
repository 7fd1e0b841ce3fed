import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import {
  type StationDto,
  THERMOCOUPLE_LETTERS,
  THERMOMETERS,
  type Thermometer,
} from '@rhotrace/api-types';
import { filter, switchMap } from 'rxjs';
import { Session } from '../../core/auth/session';
import { Confirmer } from '../../shared/confirm-dialog';
import { above, fieldError } from '../../shared/field-error';
import { formatDay } from '../../shared/format';
import { FormatLengthPipe } from '../../shared/format-value';
import { dayFromIso, isoDayOrNull } from '../../shared/iso-date';
import { LengthInput } from '../../shared/length-input';
import { EditSession } from '../../shared/list-editor/edit-session';
import { ListEditor } from '../../shared/list-editor/list-editor';
import { StationTokens } from './station-tokens/station-tokens';
import { StationsApi } from './stations-api';
import {
  REFERENCE_JUNCTION_RANGE_C,
  requireSensorFields,
  sensorFormValues,
  sensorGroup,
  sensorOf,
  sensorWords,
} from './sensor-form';
import { RecordHistory } from '../../shared/record-history/record-history';
import { RowCards } from '../../shared/row-cards';

/** Probe stations: list, register, edit. */
@Component({
  selector: 'rt-station-list',
  imports: [
    RowCards,
    RecordHistory,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
    FormatLengthPipe,
    LengthInput,
    MatDatepickerModule,
    ListEditor,
    StationTokens,
  ],
  templateUrl: './station-list.html',
  styles: `
    .danger {
      color: var(--mat-sys-error);
    }
    .overdue {
      display: block;
      color: var(--mat-sys-error);
      font: var(--mat-sys-label-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationList {
  private readonly api = inject(StationsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly confirmer = inject(Confirmer);
  protected readonly canEdit = inject(Session).can('stations:edit');
  protected readonly thermometers = THERMOMETERS;
  protected readonly thermometerWords: Record<Thermometer, string> = {
    'platinum-rtd': 'Platinum RTD',
    thermocouple: 'Thermocouple',
    table: 'Calibration table',
  };
  protected readonly letters = THERMOCOUPLE_LETTERS;
  protected readonly junctionRange = REFERENCE_JUNCTION_RANGE_C;
  protected readonly sensorWords = sensorWords;
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

  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    probeSpacingCm: this.fb.control<number | null>(0.1, [Validators.required, above(0)]),
    tipRadiusCm: this.fb.control<number | null>(null, above(0)),
    thermometer: this.fb.control<Thermometer>('thermocouple', Validators.required),
    sensor: sensorGroup(this.fb),
    minTemperatureK: this.fb.control<number | null>(77, [Validators.required, above(0)]),
    maxTemperatureK: this.fb.control<number | null>(500, [Validators.required, above(0)]),
    calibratedOn: this.fb.control<Date | null>(null),
    notes: this.fb.control<string | null>(null),
  });
  protected readonly session = new EditSession<number>(this.form);

  constructor() {
    this.form.controls.thermometer.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((kind) => requireSensorFields(this.form.controls.sensor, kind));
  }

  protected remove(s: StationDto): void {
    this.confirmer
      .ask({
        title: `Delete station ${s.name}?`,
        message: 'Sweeps measured on it keep their record of it, and it stays in the change trail.',
        confirmWords: 'Delete the station',
      })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.remove(s.id)),
      )
      .subscribe(() => {
        if (this.session.editing() === s.id) this.session.close();
        this.stations.reload();
      });
  }

  protected startNew(): void {
    this.form.reset();
    this.session.start('new');
  }

  protected edit(s: StationDto): void {
    this.form.reset();
    this.form.patchValue({
      name: s.name,
      probeSpacingCm: s.probeSpacingCm,
      tipRadiusCm: s.tipRadiusCm,
      thermometer: s.thermometer,
      sensor: sensorFormValues(s),
      minTemperatureK: s.minTemperatureK,
      maxTemperatureK: s.maxTemperatureK,
      calibratedOn: s.calibratedOn ? dayFromIso(s.calibratedOn.slice(0, 10)) : null,
      notes: s.notes,
    });
    this.session.start(s.id);
  }

  protected save(): void {
    const { sensor, ...v } = this.form.getRawValue();
    const body = {
      ...v,
      probeSpacingCm: v.probeSpacingCm!,
      minTemperatureK: v.minTemperatureK!,
      maxTemperatureK: v.maxTemperatureK!,
      rtdR0Ohm: v.thermometer === 'platinum-rtd' ? sensor.r0Ohm : null,
      sensor: sensorOf(v.thermometer, sensor),
      calibratedOn: isoDayOrNull(v.calibratedOn),
      notes: v.notes || null,
    };
    const target = this.session.editing();
    this.session.submit(
      () => (target === 'new' ? this.api.create(body) : this.api.update(Number(target), body)),
      () => this.stations.reload(),
    );
  }
}
