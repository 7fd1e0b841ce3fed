import type { AbstractControl, ValidationErrors } from '@angular/forms';

/**
 * A value in short exponent notation, as typed in a lab notebook: `1.55e15`, `2e13`, `0`.
 * Values between 0.001 and 99 999 keep plain digits.
 */
export function formatExponent(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e5) return String(Number(value.toPrecision(digits)));
  const [mantissa = '', exponent = '0'] = value.toExponential(digits - 1).split('e');
  const trimmed = mantissa.includes('.')
    ? mantissa.replace(/0+$/, '').replace(/\.$/, '')
    : mantissa;
  return `${trimmed}e${Number(exponent)}`;
}

const SUPERSCRIPT_DIGITS: Record<string, string> = {
  '⁻': '-',
  '⁺': '+',
  '⁰': '0',
  '¹': '1',
  '²': '2',
  '³': '3',
  '⁴': '4',
  '⁵': '5',
  '⁶': '6',
  '⁷': '7',
  '⁸': '8',
  '⁹': '9',
};

/**
 * Reads a number as people type densities: `1.55e15`, `1.55E+15`, `1.55×10^15`, `1.55 x 10^15`,
 * `1.55·10¹⁵`, `1,55e15` (decimal comma) or plain digits. Null when it is not a number.
 */
export function parseExponent(text: string | null | undefined): number | null {
  if (text === null || text === undefined) return null;
  let s = text
    .trim()
    .replace(/\s+/g, '')
    .replace(/[⁻⁺⁰¹²³⁴⁵⁶⁷⁸⁹]/g, (c) => SUPERSCRIPT_DIGITS[c] ?? c);
  if (s === '') return null;
  s = s.replace(/^(-?[\d.,]+)[×x*·]10\^?([+-]?\d+)$/i, '$1e$2');
  if (/^-?\d+,\d+(e[+-]?\d+)?$/i.test(s)) s = s.replace(',', '.');
  if (!/^-?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

/**
 * Validator for a text field holding a number in exponent notation, between `min` and `max`.
 * Errors: `required`, `notNumber`, `min`, `max` (the shapes `fieldError` words).
 */
export function exponentValidator(min: number, max: number) {
  return (control: AbstractControl): ValidationErrors | null => {
    const raw = control.value as string | null;
    if (raw === null || raw.trim() === '') return { required: true };
    const n = parseExponent(raw);
    if (n === null) return { notNumber: true };
    if (n < min) return { min: { min: formatExponent(min), actual: n } };
    if (n > max) return { max: { max: formatExponent(max), actual: n } };
    return null;
  };
}
