import { FormControl } from '@angular/forms';
import { exponentValidator, formatExponent, parseExponent } from './engineering';

describe('exponent notation', () => {
  it('writes densities short and readable', () => {
    expect(formatExponent(1553997171186115.5)).toBe('1.55e15');
    expect(formatExponent(1e15)).toBe('1e15');
    expect(formatExponent(1.5e13)).toBe('1.5e13');
    expect(formatExponent(2.5e-6)).toBe('2.5e-6');
    expect(formatExponent(0)).toBe('0');
    expect(formatExponent(0.045)).toBe('0.045');
    expect(formatExponent(null)).toBe('');
  });

  it('reads what people type, and refuses what is not a number', () => {
    expect(parseExponent('1.55e15')).toBe(1.55e15);
    expect(parseExponent(' 1.55E+15 ')).toBe(1.55e15);
    expect(parseExponent('1.55×10^15')).toBe(1.55e15);
    expect(parseExponent('1.55 x 10^15')).toBe(1.55e15);
    expect(parseExponent('3·10¹⁶')).toBe(3e16);
    expect(parseExponent('1,5e14')).toBe(1.5e14);
    expect(parseExponent('2000000')).toBe(2e6);
    expect(parseExponent('0')).toBe(0);
    for (const bad of ['', 'abc', '1e', '1.5.5', 'e15', '1e15cm'])
      expect(parseExponent(bad)).toBeNull();
    // Round trip: what is shown reads back to the same value.
    expect(parseExponent(formatExponent(4.2e17))).toBe(4.2e17);
  });

  it('validates range and form', () => {
    const v = exponentValidator(0, 1e22);
    expect(v(new FormControl('1e15'))).toBeNull();
    expect(v(new FormControl(''))).toEqual({ required: true });
    expect(v(new FormControl('lots'))).toEqual({ notNumber: true });
    expect(v(new FormControl('-1'))).toMatchObject({ min: { min: '0' } });
    expect(v(new FormControl('2e22'))).toMatchObject({ max: { max: '1e22' } });
  });
});
