import type { AbstractControl } from '@angular/forms';
import { cmToLength } from '@rhotrace/api-types';
import { formatLength, lengthUnitOf } from './format';
import { isoFromDay } from './iso-date';

/** The message for the first error of a control, in the app's words. */
export function fieldError(control: AbstractControl | null): string {
  const errors = control?.errors;
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return `The server says this ${errors['server']}.`;
  if (errors['matDatepickerParse'])
    return `Write the date as YYYY-MM-DD, e.g. 2026-12-05 ("${errors['matDatepickerParse'].text}" is not).`;
  if (errors['required']) return 'This is needed.';
  if (errors['matDatepickerMin'])
    return `Use ${isoFromDay(errors['matDatepickerMin'].min as Date)} or later.`;
  if (errors['matDatepickerMax'])
    return `Use ${isoFromDay(errors['matDatepickerMax'].max as Date)} or earlier.`;
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

/**
 * Validator: a stored length (cm) of `field` at most `maxCm`, worded in the field's unit
 * ("Use 1000 µm or less.") since that is what the person typed.
 */
export function lengthAtMost(maxCm: number, field: string) {
  return (control: AbstractControl) => {
    const v = control.value as number | null;
    if (v === null || v === undefined || Number.isNaN(v) || v <= maxCm) return null;
    return {
      max: { max: formatLength(maxCm, field), actual: cmToLength(v, lengthUnitOf(field)) },
    };
  };
}
