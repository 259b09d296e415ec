import { currentUserSchema, type AcceptInvitation, type CurrentUser } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { meQueryKey } from '@/lib/query-client';

export const acceptInvitation = (token: string, data: AcceptInvitation): Promise<CurrentUser> =>
  api.post(`/invitations/${encodeURIComponent(token)}/accept`, { body: data, schema: currentUserSchema });

export function useAcceptInvitation(token: string, { onSuccess }: { onSuccess?: (user: CurrentUser) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (data: AcceptInvitation) => acceptInvitation(token, data),
    onSuccess: (user) => {
      // A new account may have replaced whoever was signed in: drop their cached data.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, user);
      onSuccess?.(user);
    },
  });
}
