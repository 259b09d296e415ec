import { invitationSchema, type CreateInvitation, type Invitation } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

export const createInvitation = (groupId: number, data: CreateInvitation): Promise<Invitation> =>
  api.post(`/groups/${groupId}/invitations`, { body: data, schema: invitationSchema });

export function useCreateInvitation(groupId: number, { onSuccess }: { onSuccess?: (invitation: Invitation) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (data: CreateInvitation) => createInvitation(groupId, data),
    onSuccess: async (invitation) => {
      onSuccess?.(invitation);
      await queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(groupId).queryKey });
    },
  });
}
