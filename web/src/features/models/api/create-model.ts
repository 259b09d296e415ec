import { potentialModelSchema, type ModelInput, type PotentialModel } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getModelQueryOptions } from './get-model';
import { getModelsQueryOptions } from './get-models';

export const createModel = (input: ModelInput): Promise<PotentialModel> =>
  api.post('/models', { body: input, schema: potentialModelSchema });

export function useCreateModel({ onSuccess }: { onSuccess?: (model: PotentialModel) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createModel,
    onSuccess: async (model) => {
      queryClient.setQueryData(getModelQueryOptions(model.id).queryKey, model);
      await queryClient.invalidateQueries({ queryKey: getModelsQueryOptions().queryKey });
      onSuccess?.(model);
    },
  });
}
