import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import {
  type AbstractControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  type ValidationErrors,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { MIN_PASSWORD_LENGTH } from '@rhotrace/api-types';
import { AuthApi } from '../../../core/auth/auth-api';
import { ApiError } from '../../../core/http/api-error';

function sameAsPassword(control: AbstractControl): ValidationErrors | null {
  const password = control.parent?.get('password')?.value as string | undefined;
  return control.value === password ? null : { mismatch: true };
}

/** Sets a new password from the single-use link in the reset e-mail. */
@Component({
  selector: 'rt-reset-password',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, RouterLink],
  templateUrl: './reset-password.html',
  styleUrl: '../access.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPassword {
  private readonly auth = inject(AuthApi);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The token from the e-mailed link. */
  readonly token = input<string>('');

  protected readonly minLength = MIN_PASSWORD_LENGTH;
  protected readonly done = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly form = this.fb.group({
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH)]],
    repeat: ['', [Validators.required, sameAsPassword]],
  });

  protected submit(): void {
    this.form.controls.repeat.updateValueAndValidity();
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.auth
      .confirmReset({ token: this.token(), password: this.form.controls.password.value })
      .subscribe({
        next: () => {
          this.busy.set(false);
          this.done.set(true);
        },
        error: (err: unknown) => {
          this.busy.set(false);
          this.problem.set(err instanceof ApiError ? err.message : 'The link could not be used.');
        },
      });
  }
}
