import type { ScanSummary } from '@sixtyfold/shared';
import { scan } from '@/testing/fixtures';
import { IDLE_REFRESH_MS, LIVE_WORK_REFRESH_MS, liveRefreshMs } from './get-live-scans';

const page = (items: ScanSummary[], total = items.length) => ({ items, total, page: 1, pageSize: 20 });

describe('liveRefreshMs', () => {
  it('refreshes every few seconds while anything is running or queued', () => {
    expect(liveRefreshMs({ running: page([scan()]), queued: page([]) })).toBe(LIVE_WORK_REFRESH_MS);
    expect(liveRefreshMs({ running: page([]), queued: page([], 3) })).toBe(LIVE_WORK_REFRESH_MS);
    expect(LIVE_WORK_REFRESH_MS).toBeLessThanOrEqual(5_000);
  });

  it('slows down when the queue is empty or not known yet', () => {
    expect(liveRefreshMs({ running: page([]), queued: page([]) })).toBe(IDLE_REFRESH_MS);
    expect(liveRefreshMs(undefined)).toBe(IDLE_REFRESH_MS);
    expect(IDLE_REFRESH_MS).toBeGreaterThan(LIVE_WORK_REFRESH_MS);
  });
});
