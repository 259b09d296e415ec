import { groupDetailSchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const getGroup = (groupId: number, signal?: AbortSignal) =>
  api.get(`/groups/${groupId}`, { schema: groupDetailSchema, signal });

export const getGroupQueryOptions = (groupId: number) =>
  queryOptions({
    queryKey: ['groups', 'detail', groupId],
    queryFn: ({ signal }) => getGroup(groupId, signal),
  });

/** `enabled: false` waits, e.g. until a scan says which group it belongs to. */
export const useGroup = (groupId: number, { enabled = true }: { enabled?: boolean } = {}) => useQuery({ ...getGroupQueryOptions(groupId), enabled });
