import { formatInterval } from './format-interval';

describe('formatInterval', () => {
  it('writes a two-sided interval as a range, a one-sided one as a limit', () => {
    expect(formatInterval({ level: 0.68, kind: 'two-sided', lower: 0.02801, upper: 2.2812 })).toBe('0.028 – 2.28');
    expect(formatInterval({ level: 0.95, kind: 'upper-limit', lower: 0.001, upper: 0.86312 })).toBe('< 0.863');
    expect(formatInterval({ level: 0.95, kind: 'lower-limit', lower: 58.34, upper: 60 })).toBe('> 58.3');
  });
});
