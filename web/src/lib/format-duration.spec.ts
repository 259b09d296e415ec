import { formatDuration, formatRate } from './format-duration';

describe('formatDuration', () => {
  it.each([
    [3, 'a few seconds'],
    [42, 'about 40 s'],
    [58, 'about 1 min'],
    [240, 'about 4 min'],
    [3_590, 'about 1 h'],
    [2 * 3_600 + 11 * 60, 'about 2 h 10 min'],
    [26 * 3_600, 'about 1 d 2 h'],
    [72 * 3_600, 'about 3 d'],
  ])('%d s reads %s', (seconds, text) => {
    expect(formatDuration(seconds)).toBe(text);
  });

  it('says unknown for a missing or negative duration', () => {
    expect(formatDuration(Number.NaN)).toBe('unknown');
    expect(formatDuration(-5)).toBe('unknown');
  });
});

describe('formatRate', () => {
  it('keeps three significant figures', () => {
    expect(formatRate(12.345)).toBe('12.3 points/s');
    expect(formatRate(0.5)).toBe('0.5 points/s');
    expect(formatRate(2_512.4)).toBe('2,512 points/s');
  });
});
