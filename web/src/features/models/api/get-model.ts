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

export const useModel = (modelId: number) => useQuery(getModelQueryOptions(modelId));
