import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { AuthApi } from '../../../core/auth/auth-api';
import { Session } from '../../../core/auth/session';
import { ApiError } from '../../../core/http/api-error';

/** Sign in, or ask for a password-reset e-mail. */
@Component({
  selector: 'rt-sign-in',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatProgressBarModule,
  ],
  templateUrl: './sign-in.html',
  styleUrl: '../access.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly auth = inject(AuthApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  /** Where to go after signing in (from the query string). */
  readonly next = input<string>();
  /** Set when a session ran out and the user was sent here. */
  readonly expired = input<string>();

  protected readonly mode = signal<'sign-in' | 'forgot'>('sign-in');
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected readonly form = this.fb.group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required]],
  });
  protected readonly forgotForm = this.fb.group({
    email: ['', [Validators.required, Validators.email]],
  });

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.auth.login(this.form.getRawValue()).subscribe({
      next: (response) => {
        this.session.start(response);
        const next = this.next();
        const target = next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
        void this.router.navigateByUrl(target);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.problem.set(err instanceof ApiError ? err.message : 'Sign-in failed.');
      },
    });
  }

  protected sendReset(): void {
    if (this.forgotForm.invalid) {
      this.forgotForm.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.auth.requestReset(this.forgotForm.getRawValue()).subscribe({
      next: () => {
        this.busy.set(false);
        this.notice.set(
          'If that address has an account, a link to choose a new password is on its way.',
        );
        this.mode.set('sign-in');
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.problem.set(err instanceof ApiError ? err.message : 'The request failed.');
      },
    });
  }

  protected showForgot(): void {
    this.forgotForm.controls.email.setValue(this.form.controls.email.value);
    this.problem.set(null);
    this.mode.set('forgot');
  }
}
