import { Pipe, type PipeTransform } from '@angular/core';
import { formatLength, formatValue } from './format';

/** `{{ x | value }}`: a lab value with a few significant figures. */
@Pipe({ name: 'value' })
export class FormatValuePipe implements PipeTransform {
  transform(value: number | null | undefined, digits = 4): string {
    return formatValue(value, digits);
  }
}

/** `{{ lot.thicknessCm | length: 'thicknessCm' }}`: a stored length in its field's unit, "525 µm". */
@Pipe({ name: 'length' })
export class FormatLengthPipe implements PipeTransform {
  transform(lengthCm: number | null | undefined, field: string, digits = 4): string {
    return formatLength(lengthCm, field, digits);
  }
}
