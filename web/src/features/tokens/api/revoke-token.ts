import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getTokensQueryOptions } from './get-tokens';

export const revokeToken = (id: number): Promise<undefined> => api.delete(`/tokens/${id}`);

export function useRevokeToken({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: async () => {
      onSuccess?.();
      await queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey });
    },
  });
}
