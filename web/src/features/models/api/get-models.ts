import { potentialModelSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const modelListSchema = z.array(potentialModelSchema);

export const getModels = (signal?: AbortSignal) => api.get('/models', { schema: modelListSchema, signal });

export const getModelsQueryOptions = () =>
  queryOptions({
    queryKey: ['models', 'list'],
    queryFn: ({ signal }) => getModels(signal),
  });

export const useModels = () => useQuery(getModelsQueryOptions());
