import { signal } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import type { Observable } from 'rxjs';
import { ApiError, applyServerErrors } from '../../core/http/api-error';

/**
 * Which record of a list is being edited (`'new'` for one being added) and what the server said
 * about the last save. One per list-editor screen.
 */
export class EditSession<K> {
  readonly editing = signal<K | 'new' | null>(null);
  readonly problem = signal<string | null>(null);

  constructor(private readonly form: FormGroup) {}

  /** Opens the editor on a record (or a new one); the form holds its values already. */
  start(target: K | 'new'): void {
    this.problem.set(null);
    this.editing.set(target);
  }

  close(): void {
    this.editing.set(null);
  }

  /**
   * Sends a save when the form is valid: on success closes the editor and calls `saved`; on a
   * refusal puts the field problems on their controls and shows the message above the form.
   * `onRefused` may add errors of its own (e.g. a 409 on a unique field).
   */
  submit<T>(request: () => Observable<T>, saved: () => void, onRefused?: (e: ApiError) => void) {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    request().subscribe({
      next: () => {
        this.close();
        saved();
      },
      error: (err: unknown) => {
        if (!(err instanceof ApiError)) return;
        onRefused?.(err);
        applyServerErrors(this.form, err);
        this.problem.set(err.message);
      },
    });
  }
}
