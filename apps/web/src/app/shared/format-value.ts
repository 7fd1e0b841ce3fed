import { Pipe, type PipeTransform } from '@angular/core';
import { formatValue } from './format';

/** `{{ x | value }}`: a lab value with a few significant figures. */
@Pipe({ name: 'value' })
export class FormatValuePipe implements PipeTransform {
  transform(value: number | null | undefined, digits = 4): string {
    return formatValue(value, digits);
  }
}
