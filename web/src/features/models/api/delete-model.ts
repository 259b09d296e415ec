import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getModelQueryOptions } from './get-model';
import { getModelsQueryOptions } from './get-models';

export const deleteModel = (modelId: number): Promise<undefined> => api.delete(`/models/${modelId}`);

export function useDeleteModel({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteModel,
    onSuccess: async (_data, modelId) => {
      // Leave the page first, so its query is not refetched for a model that is gone.
      onSuccess?.();
      queryClient.removeQueries({ queryKey: getModelQueryOptions(modelId).queryKey });
      await queryClient.invalidateQueries({ queryKey: getModelsQueryOptions().queryKey });
    },
  });
}
