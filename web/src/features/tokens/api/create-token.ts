import { createdApiTokenSchema, type CreateApiToken, type CreatedApiToken } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getTokensQueryOptions } from './get-tokens';

export const createToken = (data: CreateApiToken): Promise<CreatedApiToken> =>
  api.post('/tokens', { body: data, schema: createdApiTokenSchema });

export function useCreateToken({ onSuccess }: { onSuccess?: (token: CreatedApiToken) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: async (token) => {
      onSuccess?.(token);
      await queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey });
    },
  });
}
