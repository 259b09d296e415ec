import { potentialModelSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** The group model a scan was run with, for its name and a link (`GET /api/models/:id`). */
export const getScanModel = (modelId: number, signal?: AbortSignal) => api.get(`/models/${modelId}`, { schema: potentialModelSchema, signal });

export const getScanModelQueryOptions = (modelId: number) =>
  queryOptions({
    // The models' own key: the cache entry is shared with the model pages.
    queryKey: ['models', 'detail', modelId],
    queryFn: ({ signal }) => getScanModel(modelId, signal),
    staleTime: 5 * 60_000,
  });

export const useScanModel = (modelId: number | null) => useQuery({ ...getScanModelQueryOptions(modelId ?? 0), enabled: modelId !== null });
