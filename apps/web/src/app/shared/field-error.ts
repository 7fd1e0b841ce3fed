import type { AbstractControl } from '@angular/forms';

/** The message for the first error of a control, in the app's words. */
export function fieldError(control: AbstractControl | null): string {
  const errors = control?.errors;
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return `The server says this ${errors['server']}.`;
  if (errors['required']) return 'This is needed.';
  if (errors['email']) return 'That does not look like an e-mail address.';
  if (errors['min']) return `Use ${errors['min'].min} or more.`;
  if (errors['max']) return `Use ${errors['max'].max} or less.`;
  if (errors['exclusiveMin']) return `Use a value above ${errors['exclusiveMin'].min}.`;
  if (errors['minlength']) return `Use at least ${errors['minlength'].requiredLength} characters.`;
  if (errors['maxlength']) return `Use at most ${errors['maxlength'].requiredLength} characters.`;
  if (errors['pattern']) return 'That is not in the expected form.';
  if (errors['notNumber']) return 'Type a number, e.g. 1.5e15.';
  if (errors['order']) return String(errors['order']);
  return 'Check this value.';
}

/** Validator: a number strictly above `min` (empty passes; pair with `required`). */
export function above(min: number) {
  return (control: AbstractControl) => {
    const v = control.value as number | null | '';
    if (v === null || v === '' || v === undefined) return null;
    return Number(v) > min ? null : { exclusiveMin: { min } };
  };
}
