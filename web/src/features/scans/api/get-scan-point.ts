import { scanPointSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { LIVE_REFRESH_MS } from './get-scan';
import { scanResultsKey } from './scan-results-key';

/** One stored point; a 404 says whether it is outside the grid or not computed yet. */
export const getScanPoint = (scanId: number, pointIndex: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/points/${pointIndex}`, { schema: scanPointSchema, signal });

/** While the scan is live, a point not stored yet is asked for again until it is. */
export const getScanPointQueryOptions = (scanId: number, pointIndex: number, { live = false }: { live?: boolean } = {}) =>
  queryOptions({
    queryKey: [...scanResultsKey(scanId), 'point', pointIndex],
    queryFn: ({ signal }) => getScanPoint(scanId, pointIndex, signal),
    refetchInterval: (query) => (live && !query.state.data ? LIVE_REFRESH_MS : false),
  });

export const useScanPoint = (scanId: number, pointIndex: number, options: { live?: boolean } = {}) =>
  useQuery(getScanPointQueryOptions(scanId, pointIndex, options));
