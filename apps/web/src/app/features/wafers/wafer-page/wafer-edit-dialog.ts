import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { WaferDto } from '@rhotrace/api-types';
import { ApiError, applyServerErrors } from '../../../core/http/api-error';
import { above, fieldError } from '../../../shared/field-error';
import { lengthUnitOf } from '../../../shared/format';
import { FormatLengthPipe } from '../../../shared/format-value';
import { LengthInput } from '../../../shared/length-input';
import { WafersApi } from '../wafers-api';

/** The API's limit on notes (characters). */
const NOTES_MAX = 5000;

/** What the dialog edits: the wafer, and the lot's nominal thickness shown as the fallback. */
export interface WaferEditQuestion {
  wafer: WaferDto;
  lotCode: string;
  /** The lot's nominal thickness (cm), used where the wafer has none measured. */
  lotThicknessCm: number | null;
}

/**
 * Edits a wafer's number, measured thickness and notes; saves through the API itself so a
 * refusal (a number taken in the lot, a thickness out of range) is shown on the field it names,
 * and closes with the stored wafer.
 */
@Component({
  selector: 'rt-wafer-edit-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    LengthInput,
    FormatLengthPipe,
  ],
  template: `
    <h2 mat-dialog-title>
      Edit wafer {{ q.wafer.number }}{{ q.lotCode ? ' of lot ' + q.lotCode : '' }}
    </h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-label="Wafer details">
      <mat-dialog-content>
        @if (problem(); as p) {
          <p class="problem" role="alert">{{ p }}</p>
        }
        <mat-form-field class="wide">
          <mat-label>Wafer number</mat-label>
          <input matInput formControlName="number" required />
          <mat-error>{{ error(form.controls.number) }}</mat-error>
        </mat-form-field>
        <mat-form-field class="wide">
          <mat-label>Measured thickness</mat-label>
          <input
            matInput
            type="number"
            step="any"
            rtLength="thicknessCm"
            formControlName="thicknessCm"
          />
          <span matTextSuffix>{{ thicknessUnit }}</span>
          <mat-hint>
            @if (q.lotThicknessCm !== null) {
              Empty: the lot's nominal {{ q.lotThicknessCm | length: 'thicknessCm' }} is used
            } @else {
              Empty: the lot states no nominal thickness either
            }
          </mat-hint>
          <mat-error>{{ error(form.controls.thicknessCm) }}</mat-error>
        </mat-form-field>
        <p class="rt-muted">
          A new thickness applies to sweeps stored from now on; sweeps already stored keep the
          geometry they were converted with, as each sweep's study states.
        </p>
        <mat-form-field class="wide">
          <mat-label>Notes</mat-label>
          <textarea matInput rows="3" formControlName="notes"></textarea>
          <mat-error>{{ error(form.controls.notes) }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="undefined">Cancel</button>
        <button mat-flat-button type="submit" [attr.aria-disabled]="saving()">Save</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .wide {
      width: 100%;
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WaferEditDialog {
  protected readonly q = inject<WaferEditQuestion>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<WaferEditDialog, WaferDto>>(MatDialogRef);
  private readonly api = inject(WafersApi);
  protected readonly thicknessUnit = lengthUnitOf('thicknessCm');
  protected readonly error = fieldError;
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);

  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    number: [this.q.wafer.number, [Validators.required, Validators.maxLength(32)]],
    thicknessCm: this.fb.control<number | null>(this.q.wafer.thicknessCm, above(0)),
    notes: this.fb.control<string | null>(this.q.wafer.notes, Validators.maxLength(NOTES_MAX)),
  });

  protected save(): void {
    // Store keeps the focus while it works; a second press while saving does nothing.
    if (this.saving()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const raw = this.form.getRawValue();
    this.problem.set(null);
    this.saving.set(true);
    this.api
      .update(this.q.wafer.id, {
        number: raw.number.trim(),
        thicknessCm: raw.thicknessCm,
        notes: raw.notes?.trim() || null,
      })
      .subscribe({
        next: (wafer) => this.ref.close(wafer),
        error: (err: unknown) => {
          this.saving.set(false);
          if (!(err instanceof ApiError)) {
            this.problem.set('The wafer could not be saved; nothing was changed. Try again.');
            return;
          }
          if (err.status === 409) {
            this.form.controls.number.setErrors({ server: 'is already used in this lot' });
          }
          applyServerErrors(this.form, err);
          this.problem.set(err.message);
        },
      });
  }
}
