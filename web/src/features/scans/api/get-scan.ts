import { scanDetailSchema, type ScanDetail } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getScan = (scanId: number, signal?: AbortSignal) => api.get(`/scans/${scanId}`, { schema: scanDetailSchema, signal });

/** True while workers may still write points, so views of the scan should keep refreshing. */
export const isLive = (scan: Pick<ScanDetail, 'status'> | undefined) => scan?.status === 'queued' || scan?.status === 'running';

/** How often live views refresh: often enough to watch, rare enough for a 2-core server. */
export const LIVE_REFRESH_MS = 2_000;

export const getScanQueryOptions = (scanId: number) =>
  queryOptions({
    queryKey: ['scans', 'detail', scanId],
    queryFn: ({ signal }) => getScan(scanId, signal),
    refetchInterval: (query) => (isLive(query.state.data) ? LIVE_REFRESH_MS : false),
  });

export const useScan = (scanId: number) => useQuery(getScanQueryOptions(scanId));
