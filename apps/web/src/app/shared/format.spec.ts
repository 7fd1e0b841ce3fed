import { formatValue } from './format';

describe('formatValue', () => {
  it('uses a power of ten for extremes', () => {
    expect(formatValue(1.5e16, 3)).toBe('1.50 × 10¹⁶');
  });
});
