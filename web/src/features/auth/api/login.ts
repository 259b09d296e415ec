import { currentUserSchema, type CurrentUser, type Login } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getMeQueryOptions } from './get-me';

export const login = (data: Login): Promise<CurrentUser> =>
  api.post('/auth/login', { body: data, schema: currentUserSchema });

export function useLogin({ onSuccess }: { onSuccess?: (user: CurrentUser) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      const meKey = getMeQueryOptions().queryKey;
      // Drop anything cached for a previous user before showing this one's data.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meKey[0] });
      queryClient.setQueryData(meKey, user);
      onSuccess?.(user);
    },
  });
}
