import { GRID_MAX_CELLS } from '@sixtyfold/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { json, mockApi } from '@/testing/mock-api';
import { createTestQueryClient } from '@/testing/render';
import { slice } from '@/testing/scan-fixtures';
import { LIVE_REFRESH_MS } from './get-scan';
import { LIVE_PANEL_CELLS, LIVE_SLICE_BACKOFF, liveSliceRefreshMs, PANEL_CELLS, panelCells, useScanGridSlice } from './get-scan-grid';

describe('liveSliceRefreshMs', () => {
  it('asks every LIVE_REFRESH_MS while answers come quickly', () => {
    expect(liveSliceRefreshMs(undefined)).toBe(LIVE_REFRESH_MS);
    expect(liveSliceRefreshMs(50)).toBe(LIVE_REFRESH_MS);
  });

  it('waits LIVE_SLICE_BACKOFF times as long as a slow answer took', () => {
    expect(liveSliceRefreshMs(1_500)).toBe(LIVE_SLICE_BACKOFF * 1_500);
    // At most a tenth of the time spent answering one panel.
    expect(LIVE_SLICE_BACKOFF).toBeGreaterThanOrEqual(10);
  });
});

describe('panelCells', () => {
  it('asks fewer cells while the scan is live, the finest once it is finished', () => {
    expect(panelCells({ wide: false, live: false })).toBe(PANEL_CELLS);
    expect(panelCells({ wide: true, live: false })).toBe(GRID_MAX_CELLS);
    expect(panelCells({ wide: false, live: true })).toBe(LIVE_PANEL_CELLS);
    expect(LIVE_PANEL_CELLS).toBeLessThan(PANEL_CELLS);
    expect(panelCells({ wide: true, live: true })).toBeLessThan(GRID_MAX_CELLS);
  });
});

describe('a live slice', () => {
  beforeEach(() => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'setInterval', 'clearInterval', 'Date', 'performance'] });
  });
  afterEach(() => {
    vi.useRealTimers();
  });

  /** A grid endpoint whose answers take `answerMs` each; records when each request came and how many were open at once. */
  function slowGrid(answerMs: number) {
    const asked: number[] = [];
    let open = 0;
    let mostOpen = 0;
    mockApi({
      'GET /api/scans/42/grid': async () => {
        asked.push(performance.now());
        mostOpen = Math.max(mostOpen, ++open);
        await new Promise((resolve) => setTimeout(resolve, answerMs));
        open--;
        return json(200, slice('ns', [[0.96]], [['ok']]));
      },
    });
    return { asked, mostOpen: () => mostOpen };
  }

  const watch = () => {
    const queryClient = createTestQueryClient();
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    return renderHook(() => useScanGridSlice(42, { x: 'nStar', y: 'f', output: 'ns', at: {} }, { live: true }), { wrapper });
  };

  it('asks again LIVE_REFRESH_MS after a quick answer', async () => {
    const grid = slowGrid(100);
    const view = watch();
    await act(() => vi.advanceTimersByTimeAsync(10_000));
    view.unmount();
    // Asked at 0, 2.1 s, 4.2 s, 6.3 s, 8.4 s: each LIVE_REFRESH_MS after the answer before.
    expect(grid.asked).toHaveLength(5);
    expect(grid.asked.slice(1).map((t, i) => Math.round(t - grid.asked[i]))).toEqual([2_100, 2_100, 2_100, 2_100]);
  });

  it('waits longer the longer answers take, and never asks while an answer is coming', async () => {
    const grid = slowGrid(3_000);
    const view = watch();
    await act(() => vi.advanceTimersByTimeAsync(100_000));
    view.unmount();
    // Each answer takes 3 s, so the next request comes 30 s after it: at 0, 33, 66 and 99 s.
    expect(grid.asked.map((t) => Math.round(t / 1000))).toEqual([0, 33, 66, 99]);
    expect(grid.mostOpen()).toBe(1);
  });
});
