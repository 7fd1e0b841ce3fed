import { describe, expect, it } from 'vitest';
import {
  bissellLowerBound,
  MIN_PPK_SAMPLE,
  processPerformance,
  SMALL_PPK_SAMPLE,
} from './capability';

describe('bissellLowerBound', () => {
  it('matches the worked values of Bissell 1990 (Appl. Statist. 39, 331)', () => {
    // C - 1.645 sqrt(1/(9n) + C^2/(2(n-1))): C = 1.33 gives 0.786 at n = 10, 0.519 at n = 5
    // (hand computation of the published formula).
    expect(bissellLowerBound(1.33, 10)).toBeCloseTo(0.786, 3);
    expect(bissellLowerBound(1.33, 5)).toBeCloseTo(0.519, 3);
  });

  it('tends to the index as n grows (the bound narrows as 1/sqrt(n))', () => {
    expect(1.33 - bissellLowerBound(1.33, 10_000)).toBeLessThan(0.02);
  });

  it('refuses n below 2 with a named argument', () => {
    expect(() => bissellLowerBound(1, 1)).toThrow(/bissellLowerBound.*n/);
  });
});

describe('processPerformance', () => {
  it('computes Ppk from the overall sample spread (hand computation)', () => {
    // mean 10.0, s = sqrt(0.1/4) = 0.158114, min(11 - 10, 10 - 9) / (3 s) = 2.10819.
    const r = processPerformance([9.8, 10.1, 10.0, 9.9, 10.2], 9, 11);
    expect(r.mean).toBeCloseTo(10, 12);
    expect(r.standardDeviation).toBeCloseTo(0.158114, 6);
    expect(r.ppk).toBeCloseTo(2.10819, 5);
    expect(r.ppkLower95).toBeCloseTo(bissellLowerBound(r.ppk!, 5), 12);
    expect(r.note).toMatch(/^Only 5 values \(fewer than 25\)/);
    expect(processPerformance([9.8, 10.1, 10.0, 9.9], 9, 11, 'wafers').reason).toBe(
      'Ppk needs at least 5 wafers; there are 4',
    );
  });

  it('takes the nearer limit, and one side when only one limit is set', () => {
    const values = [10.4, 10.6, 10.5, 10.5, 10.4, 10.6];
    const both = processPerformance(values, 9, 11);
    const sd = both.standardDeviation!;
    expect(both.ppk).toBeCloseTo((11 - 10.5) / (3 * sd), 10);
    expect(processPerformance(values, 9, null).ppk).toBeCloseTo((10.5 - 9) / (3 * sd), 10);
  });

  it(`is null with a reason below ${MIN_PPK_SAMPLE} values, and notes fewer than ${SMALL_PPK_SAMPLE}`, () => {
    const four = processPerformance([1, 2, 3, 4], 0, 5);
    expect(four.ppk).toBeNull();
    expect(four.ppkLower95).toBeNull();
    expect(four.reason).toMatch(/at least 5/);
    const many = processPerformance(
      Array.from({ length: SMALL_PPK_SAMPLE }, (_, i) => 10 + (i % 5) * 0.1),
      9,
      11,
    );
    expect(many.ppk).not.toBeNull();
    expect(many.note).toBeNull();
  });

  it('is null without limits or without spread', () => {
    expect(processPerformance([1, 2, 3, 4, 5], null, null).reason).toMatch(/no specification/);
    expect(processPerformance([2, 2, 2, 2, 2], 1, 3).reason).toMatch(/standard deviation is 0/);
  });

  it('refuses crossed limits and non-finite values', () => {
    expect(() => processPerformance([1, 2, 3, 4, 5], 3, 2)).toThrow(RangeError);
    expect(() => processPerformance([1, Number.NaN, 3, 4, 5], 0, 9)).toThrow(/values\[1\]/);
  });
});
