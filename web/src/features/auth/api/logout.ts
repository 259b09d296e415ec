import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { logoutMutationKey } from '@/lib/query-client';
import { getMeQueryOptions } from './get-me';

export const logout = (): Promise<undefined> => api.post('/auth/logout');

export function useLogout({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: logoutMutationKey,
    mutationFn: logout,
    onSuccess: () => {
      // Leave the page first (the caller navigates) so nothing protected re-renders without a user.
      onSuccess?.();
      const meKey = getMeQueryOptions().queryKey;
      queryClient.setQueryData(meKey, null);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meKey[0] });
    },
  });
}
