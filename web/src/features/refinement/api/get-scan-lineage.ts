import { scanLineageSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getScanLineage = (scanId: number, signal?: AbortSignal) => api.get(`/scans/${scanId}/lineage`, { schema: scanLineageSchema, signal });

/**
 * Refreshes while a level of the chain still computes or the API has yet to follow a finished one,
 * so new levels appear as the API chains them.
 */
export const getScanLineageQueryOptions = (scanId: number) =>
  queryOptions({
    queryKey: ['scans', 'lineage', scanId],
    queryFn: ({ signal }) => getScanLineage(scanId, signal),
    refetchInterval: (query) => {
      const data = query.state.data;
      return data && (data.chaining || data.levels.some((level) => level.status === 'queued' || level.status === 'running')) ? 5_000 : false;
    },
  });

export const useScanLineage = (scanId: number) => useQuery(getScanLineageQueryOptions(scanId));
