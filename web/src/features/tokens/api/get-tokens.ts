import { apiTokenListSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getTokens = (signal?: AbortSignal) => api.get('/tokens', { schema: apiTokenListSchema, signal });

export const getTokensQueryOptions = () =>
  queryOptions({
    queryKey: ['tokens', 'list'],
    queryFn: ({ signal }) => getTokens(signal),
  });

export const useTokens = () => useQuery(getTokensQueryOptions());
