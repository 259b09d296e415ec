import { formatNumber } from './format-number';

describe('formatNumber', () => {
  it('writes ordinary values plainly with the requested significant digits', () => {
    expect(formatNumber(0.964897856, 5)).toBe('0.9649');
    expect(formatNumber(0.96498, 5)).toBe('0.96498');
    expect(formatNumber(76.594731, 4)).toBe('76.59');
    expect(formatNumber(0)).toBe('0');
  });

  it('uses powers of ten for very small or large values, with a true minus sign', () => {
    expect(formatNumber(2.1e-9)).toBe('2.1 × 10⁻⁹');
    expect(formatNumber(-6.2056e-4, 3)).toBe('−6.21 × 10⁻⁴');
    expect(formatNumber(1.3e16, 2)).toBe('1.3 × 10¹⁶');
  });

  it('shows a dash for missing values', () => {
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
  });
});
