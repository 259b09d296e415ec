import { reproductionListSchema, type ReproductionList } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { LIVE_REFRESH_MS } from './get-scan';

export const getReproductions = (scanId: number, signal?: AbortSignal) =>
  api.get(`/scans/${scanId}/reproductions`, { schema: reproductionListSchema, signal });

/** True while a check is still waiting for or on a worker. */
const checking = (list: ReproductionList | undefined) => Boolean(list?.items.some((c) => c.status === 'queued' || c.status === 'running'));

export const getReproductionsQueryOptions = (scanId: number) =>
  queryOptions({
    queryKey: ['scans', 'reproductions', scanId],
    queryFn: ({ signal }) => getReproductions(scanId, signal),
    refetchInterval: (query) => (checking(query.state.data) ? LIVE_REFRESH_MS : false),
  });

export const useReproductions = (scanId: number) => useQuery(getReproductionsQueryOptions(scanId));
