import { groupDetailSchema, type GroupDetail, type UpdateGroup } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getGroupQueryOptions } from './get-group';

export const updateGroup = (groupId: number, data: UpdateGroup): Promise<GroupDetail> =>
  api.patch(`/groups/${groupId}`, { body: data, schema: groupDetailSchema });

export function useUpdateGroup(groupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (data: UpdateGroup) => updateGroup(groupId, data),
    onSuccess: async (group) => {
      queryClient.setQueryData(getGroupQueryOptions(groupId).queryKey, group);
      await queryClient.invalidateQueries({ queryKey: ['groups', 'list'] });
    },
  });
}
