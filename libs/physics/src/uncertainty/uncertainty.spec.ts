import { describe, expect, it } from 'vitest';
import { guardBandedVerdict } from './conformity';
import {
  COVERAGE_FACTOR,
  combinedStandardUncertainty,
  iec60751Tolerance,
  rectangularStandardUncertainty,
} from './gum';

describe('GUM helpers (JCGM 100:2008)', () => {
  it('turns a half-width into a standard uncertainty as a / sqrt(3) (GUM 4.3.7)', () => {
    expect(rectangularStandardUncertainty(Math.sqrt(3))).toBeCloseTo(1, 14);
    expect(rectangularStandardUncertainty(0.415)).toBeCloseTo(0.2396, 4);
  });

  it('combines uncorrelated contributions by root sum of squares (GUM equation 10)', () => {
    expect(combinedStandardUncertainty([3, -4])).toBe(5);
    expect(combinedStandardUncertainty([])).toBe(0);
    expect(() => combinedStandardUncertainty([1, Number.NaN])).toThrow(/contributions\[1\]/);
  });

  it('uses k = 2 (GUM 6.3.3: about 95 % for a normal distribution)', () => {
    expect(COVERAGE_FACTOR).toBe(2);
  });

  it('gives the IEC 60751 class tolerances', () => {
    // IEC 60751 table 1: class B +/-(0.3 + 0.005|t|) °C, class A +/-(0.15 + 0.002|t|) °C.
    expect(iec60751Tolerance(23)).toBeCloseTo(0.415, 12);
    expect(iec60751Tolerance(-100)).toBeCloseTo(0.8, 12);
    expect(iec60751Tolerance(100, 'A')).toBeCloseTo(0.35, 12);
  });
});

describe('guardBandedVerdict (JCGM 106:2012, guard band w = U)', () => {
  it('passes only when the whole expanded interval is inside the limits', () => {
    expect(guardBandedVerdict(10, 0.5, 9, 11)).toBe('pass');
    expect(guardBandedVerdict(10.5, 0.5, 9, 11)).toBe('pass');
  });

  it('is indeterminate when the interval straddles a limit, on either side of it', () => {
    expect(guardBandedVerdict(10.8, 0.5, 9, 11)).toBe('indeterminate');
    expect(guardBandedVerdict(11.2, 0.5, 9, 11)).toBe('indeterminate');
    expect(guardBandedVerdict(9.1, 0.5, 9, null)).toBe('indeterminate');
  });

  it('fails when the interval lies wholly beyond a limit', () => {
    expect(guardBandedVerdict(11.6, 0.5, 9, 11)).toBe('fail');
    expect(guardBandedVerdict(8.4, 0.5, 9, 11)).toBe('fail');
  });

  it('with U = 0 reduces to the plain inclusive check', () => {
    expect(guardBandedVerdict(11, 0, 9, 11)).toBe('pass');
    expect(guardBandedVerdict(11.0001, 0, 9, 11)).toBe('fail');
  });

  it('holds its documented example', () => {
    expect(guardBandedVerdict(10.0, 0.3, 9, 10.2)).toBe('indeterminate');
  });

  it('refuses a negative uncertainty and crossed limits', () => {
    expect(() => guardBandedVerdict(1, -1, 0, 2)).toThrow(/expandedUncertainty/);
    expect(() => guardBandedVerdict(1, 0, 2, 0)).toThrow(RangeError);
  });
});
