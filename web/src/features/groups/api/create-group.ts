import { groupDetailSchema, type CreateGroup, type GroupDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getGroupsQueryOptions } from './get-groups';

export const createGroup = (data: CreateGroup): Promise<GroupDetail> => api.post('/groups', { body: data, schema: groupDetailSchema });

export function useCreateGroup({ onSuccess }: { onSuccess?: (group: GroupDetail) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createGroup,
    onSuccess: async (group) => {
      onSuccess?.(group);
      await queryClient.invalidateQueries({ queryKey: getGroupsQueryOptions().queryKey });
    },
  });
}
