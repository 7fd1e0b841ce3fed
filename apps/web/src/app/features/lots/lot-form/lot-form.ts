import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import {
  type AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  type ValidationErrors,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import {
  type FieldProblem,
  type LotDto,
  type LotInput,
  MATERIALS,
  type Material,
} from '@rhotrace/api-types';
import { ApiError, applyServerErrors } from '../../../core/http/api-error';
import { above, fieldError, lengthAtMost } from '../../../shared/field-error';
import { lengthUnitOf } from '../../../shared/format';
import { dayFromIso, isoDayOrNull } from '../../../shared/iso-date';
import { LengthInput } from '../../../shared/length-input';
import { LotsApi } from '../lots-api';

function specOrder(group: AbstractControl): ValidationErrors | null {
  const min = group.get('specMinOhmCm')?.value as number | null;
  const max = group.get('specMaxOhmCm')?.value as number | null;
  if (min !== null && max !== null && min > max) {
    return { order: 'The lower spec limit is above the upper one.' };
  }
  return null;
}

/** Registers a new lot or edits one (`/lots/new`, `/lots/:id/edit`). */
@Component({
  selector: 'rt-lot-form',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatDatepickerModule,
    LengthInput,
    RouterLink,
  ],
  templateUrl: './lot-form.html',
  styleUrl: './lot-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LotForm {
  private readonly api = inject(LotsApi);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  /** Lot id from the route, when editing. */
  readonly id = input<string>();

  protected readonly materials = MATERIALS;
  protected readonly error = fieldError;
  protected readonly unit = lengthUnitOf;
  protected readonly saving = signal(false);
  protected readonly problems = signal<FieldProblem[]>([]);
  protected readonly message = signal<string | null>(null);

  protected readonly form = this.fb.group(
    {
      code: ['', [Validators.required, Validators.maxLength(64)]],
      material: this.fb.control<Material>('Si', Validators.required),
      dopant: this.fb.control<string | null>(null, Validators.pattern(/^[A-Z][a-z]?$/)),
      dopantType: this.fb.control<'n' | 'p' | null>(null),
      orientation: this.fb.control<string | null>(null, Validators.maxLength(16)),
      diameterCm: this.fb.control<number | null>(null, above(0)),
      thicknessCm: this.fb.control<number | null>(null, above(0)),
      thicknessToleranceCm: this.fb.control<number | null>(null, [
        Validators.min(0),
        lengthAtMost(0.1, 'thicknessToleranceCm'),
      ]),
      supplier: this.fb.control<string | null>(null, Validators.maxLength(200)),
      receivedOn: this.fb.control<Date | null>(null),
      specMinOhmCm: this.fb.control<number | null>(null, above(0)),
      specMaxOhmCm: this.fb.control<number | null>(null, above(0)),
      notes: this.fb.control<string | null>(null, Validators.maxLength(5000)),
    },
    { validators: specOrder },
  );

  constructor() {
    effect(() => {
      const id = this.id();
      if (id) this.api.get(Number(id)).subscribe((lot) => this.fill(lot));
    });
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const raw = this.form.getRawValue();
    const body: LotInput = {
      ...raw,
      dopant: raw.dopant || null,
      orientation: raw.orientation || null,
      supplier: raw.supplier || null,
      receivedOn: isoDayOrNull(raw.receivedOn),
      notes: raw.notes || null,
    };
    const id = this.id();
    this.saving.set(true);
    this.problems.set([]);
    this.message.set(null);
    const request = id ? this.api.update(Number(id), body) : this.api.create(body);
    request.subscribe({
      next: (lot) => void this.router.navigate(['/lots', lot.id]),
      error: (err: unknown) => {
        this.saving.set(false);
        if (err instanceof ApiError) {
          if (err.status === 409) {
            this.form.controls.code.setErrors({ server: 'is already used by another lot' });
          }
          this.problems.set(applyServerErrors(this.form, err));
          this.message.set(err.message);
        } else {
          this.message.set('The lot could not be saved.');
        }
      },
    });
  }

  private fill(lot: LotDto): void {
    const { id: _id, createdAt: _c, updatedAt: _u, waferCount: _w, ...values } = lot;
    this.form.patchValue({
      ...values,
      receivedOn: values.receivedOn ? dayFromIso(values.receivedOn.slice(0, 10)) : null,
    });
  }
}
