import { formatNumber } from './format-number';

describe('formatNumber', () => {
  it('writes ordinary values plainly with the requested significant digits', () => {
    expect(formatNumber(0.964897856, 5, 'power')).toBe('0.9649');
    expect(formatNumber(0.96498, 5, 'power')).toBe('0.96498');
    expect(formatNumber(76.594731, 4, 'power')).toBe('76.59');
    expect(formatNumber(0, 4, 'power')).toBe('0');
    expect(formatNumber(0.964897856)).toBe('0.964898');
    expect(formatNumber(-76.594731, 3)).toBe('-76.6');
  });

  it('uses powers of ten for very small or large values, with a true minus sign in prose', () => {
    expect(formatNumber(2.1e-9, 4, 'power')).toBe('2.1 × 10⁻⁹');
    expect(formatNumber(-6.2056e-4, 3, 'power')).toBe('−6.21 × 10⁻⁴');
    expect(formatNumber(1.3e16, 2, 'power')).toBe('1.3 × 10¹⁶');
  });

  it('writes exponents as a copyable e in tables, one digit fewer in the mantissa', () => {
    expect(formatNumber(1e-10)).toBe('1.0000e-10');
    expect(formatNumber(-6.2056e-4)).toBe('-6.2056e-4');
    expect(formatNumber(123456.7, 3)).toBe('1.2e+5');
  });

  it('shows a dash for missing values', () => {
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(undefined, 4, 'power')).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
  });
});
