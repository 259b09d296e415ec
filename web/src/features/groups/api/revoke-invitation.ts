import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

export const revokeInvitation = (groupId: number, invitationId: number): Promise<undefined> =>
  api.delete(`/groups/${groupId}/invitations/${invitationId}`);

export function useRevokeInvitation(groupId: number, { onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: number) => revokeInvitation(groupId, invitationId),
    onSuccess: async () => {
      onSuccess?.();
      await queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(groupId).queryKey });
    },
  });
}
