import { retentionPolicySchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** A group's retention policy; every member may read it. */
export const getRetention = (groupId: number, signal?: AbortSignal) =>
  api.get(`/maintenance/groups/${groupId}/retention`, { schema: retentionPolicySchema, signal });

export const getRetentionQueryOptions = (groupId: number) =>
  queryOptions({
    queryKey: ['maintenance', 'retention', groupId],
    queryFn: ({ signal }) => getRetention(groupId, signal),
  });

export const useRetention = (groupId: number) => useQuery(getRetentionQueryOptions(groupId));
