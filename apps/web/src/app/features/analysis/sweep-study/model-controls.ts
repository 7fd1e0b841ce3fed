import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  output,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { DopingInput } from '@rhotrace/api-types';
import { exponentValidator, formatExponent, parseExponent } from '../../../shared/engineering';
import { fieldError } from '../../../shared/field-error';

/** Highest density the model takes, cm^-3. */
const MAX_DENSITY_CM3 = 1e22;

/**
 * Doping the model is drawn with, as the user edits it. Densities are typed and shown in
 * exponent notation (1.55e15); the model gets exactly the value shown.
 */
@Component({
  selector: 'rt-model-controls',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <form
      [formGroup]="form"
      class="controls"
      aria-label="Model parameters"
      (submit)="$event.preventDefault()"
    >
      <mat-form-field>
        <mat-label>Donor density{{ donorName() }}</mat-label>
        <input
          matInput
          type="text"
          inputmode="decimal"
          autocomplete="off"
          spellcheck="false"
          formControlName="donorDensity"
        />
        <span matTextSuffix>cm⁻³</span>
        <mat-error>{{ error(form.controls.donorDensity) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Acceptor density{{ acceptorName() }}</mat-label>
        <input
          matInput
          type="text"
          inputmode="decimal"
          autocomplete="off"
          spellcheck="false"
          formControlName="acceptorDensity"
        />
        <span matTextSuffix>cm⁻³</span>
        <mat-error>{{ error(form.controls.acceptorDensity) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Donor level</mat-label>
        <input matInput type="number" step="0.001" formControlName="donorLevel" />
        <span matTextSuffix>eV</span>
        <mat-error>{{ error(form.controls.donorLevel) }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Acceptor level</mat-label>
        <input matInput type="number" step="0.001" formControlName="acceptorLevel" />
        <span matTextSuffix>eV</span>
        <mat-error>{{ error(form.controls.acceptorLevel) }}</mat-error>
      </mat-form-field>
    </form>
  `,
  styles: `
    .controls {
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
    }
    mat-form-field {
      width: 200px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelControls {
  private readonly fb = inject(NonNullableFormBuilder);

  /** Starting values (from the wafer's dopant and the material's levels). */
  readonly initial = input.required<DopingInput>();
  /** Every edit: the doping, or null while a field is invalid. */
  readonly dopingChange = output<DopingInput | null>();
  /** A value typed by the person (not set from `initial`). */
  readonly edited = output();

  protected readonly error = fieldError;
  protected readonly donorName = computed(() =>
    this.initial().donor ? ` (${this.initial().donor})` : '',
  );
  protected readonly acceptorName = computed(() =>
    this.initial().acceptor ? ` (${this.initial().acceptor})` : '',
  );
  protected readonly form = this.fb.group({
    donorDensity: this.fb.control('', [exponentValidator(0, MAX_DENSITY_CM3)]),
    acceptorDensity: this.fb.control('', [exponentValidator(0, MAX_DENSITY_CM3)]),
    donorLevel: this.fb.control<number | null>(null, [Validators.min(0), Validators.max(2)]),
    acceptorLevel: this.fb.control<number | null>(null, [Validators.min(0), Validators.max(2)]),
  });

  constructor() {
    effect(() => {
      const initial = this.initial();
      this.form.setValue(
        {
          donorDensity: formatExponent(initial.donorDensity),
          acceptorDensity: formatExponent(initial.acceptorDensity),
          donorLevel: initial.donorLevel ?? null,
          acceptorLevel: initial.acceptorLevel ?? null,
        },
        { emitEvent: false },
      );
      this.dopingChange.emit(this.current());
    });
    this.form.valueChanges.pipe(takeUntilDestroyed(inject(DestroyRef))).subscribe(() => {
      this.edited.emit();
      this.dopingChange.emit(this.current());
    });
  }

  /** The doping now in the form, or null when a field is invalid. */
  current(): DopingInput | null {
    if (this.form.invalid) return null;
    const v = this.form.getRawValue();
    const initial = this.initial();
    return {
      ...initial,
      donorDensity: parseExponent(v.donorDensity) ?? 0,
      acceptorDensity: parseExponent(v.acceptorDensity) ?? 0,
      ...(v.donorLevel !== null ? { donorLevel: v.donorLevel } : {}),
      ...(v.acceptorLevel !== null ? { acceptorLevel: v.acceptorLevel } : {}),
    };
  }
}
