import { groupMemberSchema, type GroupMember, type GroupRole } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { meQueryKey } from '@/lib/query-client';
import { getGroupQueryOptions } from './get-group';

export const changeMemberRole = (groupId: number, userId: number, role: GroupRole): Promise<GroupMember> =>
  api.patch(`/groups/${groupId}/members/${userId}`, { body: { role }, schema: groupMemberSchema });

export function useChangeMemberRole(groupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number; role: GroupRole }) => changeMemberRole(groupId, userId, role),
    // My own role may have changed too, and with it what the rest of the app lets me do.
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getGroupQueryOptions(groupId).queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryKey }),
      ]),
  });
}
