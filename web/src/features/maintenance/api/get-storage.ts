import { storageReportSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getStorage = (signal?: AbortSignal) => api.get('/maintenance/storage', { schema: storageReportSchema, signal });

export const getStorageQueryOptions = () =>
  queryOptions({
    queryKey: ['maintenance', 'storage'],
    queryFn: ({ signal }) => getStorage(signal),
  });

export const useStorage = () => useQuery(getStorageQueryOptions());
