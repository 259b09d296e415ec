import type { ScanProgress } from '@sixtyfold/shared';
import { scanPace } from './scan-pace';

const progress = (overrides: Partial<ScanProgress>): ScanProgress => ({
  total: 400, done: 0, failed: 0, running: 0, queued: 400, elapsedSeconds: null, remainingSeconds: null, ...overrides,
});

describe('scanPace', () => {
  it('counts failed points as finished work', () => {
    expect(scanPace(progress({ done: 90, failed: 10, elapsedSeconds: 8, remainingSeconds: 24 }))).toEqual({ pointsPerSecond: 12.5, remainingSeconds: 24 });
  });

  it('has no rate before a point has finished or the clock has started', () => {
    expect(scanPace(progress({ elapsedSeconds: 3 })).pointsPerSecond).toBeNull();
    expect(scanPace(progress({ done: 5, elapsedSeconds: null })).pointsPerSecond).toBeNull();
    expect(scanPace(progress({ done: 5, elapsedSeconds: 0 })).pointsPerSecond).toBeNull();
  });
});
