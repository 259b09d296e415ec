import { groupSummarySchema } from '@sixtyfold/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const groupListSchema = z.array(groupSummarySchema);

/** The groups I can see: my own, or every group for a site administrator. */
export const getGroups = (signal?: AbortSignal) => api.get('/groups', { schema: groupListSchema, signal });

export const getGroupsQueryOptions = () =>
  queryOptions({
    queryKey: ['groups', 'list'],
    queryFn: ({ signal }) => getGroups(signal),
  });

export const useGroups = ({ enabled = true }: { enabled?: boolean } = {}) => useQuery({ ...getGroupsQueryOptions(), enabled });
