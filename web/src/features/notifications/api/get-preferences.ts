import { userPreferencesSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getPreferences = (signal?: AbortSignal) => api.get('/auth/me/preferences', { schema: userPreferencesSchema, signal });

export const getPreferencesQueryOptions = () =>
  queryOptions({
    queryKey: ['preferences'],
    queryFn: ({ signal }) => getPreferences(signal),
  });

export const usePreferences = () => useQuery(getPreferencesQueryOptions());
