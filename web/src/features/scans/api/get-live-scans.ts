import type { Page, ScanSummary } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { getScans } from './get-scans';

export interface LiveScans {
  running: Page<ScanSummary>;
  queued: Page<ScanSummary>;
}

/** How often views of the queue refresh: every few seconds while work is live, twice a minute otherwise. */
export const LIVE_WORK_REFRESH_MS = 5_000;
export const IDLE_REFRESH_MS = 30_000;

export const liveRefreshMs = (live: LiveScans | undefined) =>
  live && live.running.total + live.queued.total > 0 ? LIVE_WORK_REFRESH_MS : IDLE_REFRESH_MS;

/**
 * The running and the queued scans of my groups, fetched together so one refresh sees a scan
 * move from queued to running instead of missing it between two lists.
 */
export async function getLiveScans(limit: number, signal?: AbortSignal): Promise<LiveScans> {
  const [running, queued] = await Promise.all([
    getScans({ status: 'running', pageSize: limit }, signal),
    getScans({ status: 'queued', pageSize: limit }, signal),
  ]);
  return { running, queued };
}

export const getLiveScansQueryOptions = (limit = 20) =>
  queryOptions({
    queryKey: ['scans', 'live', { limit }],
    queryFn: ({ signal }) => getLiveScans(limit, signal),
    refetchInterval: (query) => liveRefreshMs(query.state.data),
  });

export const useLiveScans = (limit?: number) => useQuery(getLiveScansQueryOptions(limit));
