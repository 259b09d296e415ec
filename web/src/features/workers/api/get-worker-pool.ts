import { workerPoolSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getWorkerPool = (signal?: AbortSignal) => api.get('/workers/pool', { schema: workerPoolSchema, signal });

/** Workers beat every 5 s, so polling faster than that only repeats the same answer. */
export const POOL_REFRESH_MS = 5_000;

export const getWorkerPoolQueryOptions = ({ refetchMs = POOL_REFRESH_MS }: { refetchMs?: number } = {}) =>
  queryOptions({
    queryKey: ['workers', 'pool'],
    queryFn: ({ signal }) => getWorkerPool(signal),
    staleTime: POOL_REFRESH_MS,
    refetchInterval: refetchMs,
  });

export const useWorkerPool = (options: { refetchMs?: number } = {}) => useQuery(getWorkerPoolQueryOptions(options));
