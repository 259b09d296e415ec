import { potentialModelSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getModel = (modelId: number, signal?: AbortSignal) =>
  api.get(`/models/${modelId}`, { schema: potentialModelSchema, signal });

export const getModelQueryOptions = (modelId: number) =>
  queryOptions({
    queryKey: ['models', 'detail', modelId],
    queryFn: ({ signal }) => getModel(modelId, signal),
  });

/** A group model by id; null waits (a scan over a built-in family has no model to load). */
export const useModel = (modelId: number | null) => useQuery({ ...getModelQueryOptions(modelId ?? 0), enabled: modelId !== null });
