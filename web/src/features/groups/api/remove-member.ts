import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { meQueryKey } from '@/lib/query-client';

/** Removes a member; with my own user id this is leaving the group. */
export const removeMember = (groupId: number, userId: number): Promise<undefined> => api.delete(`/groups/${groupId}/members/${userId}`);

export function useRemoveMember(groupId: number, { onSuccess }: { onSuccess?: (userId: number) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => removeMember(groupId, userId),
    onSuccess: async (_result, userId) => {
      onSuccess?.(userId);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: ['groups'] }),
        queryClient.invalidateQueries({ queryKey: meQueryKey }),
      ]);
    },
  });
}
