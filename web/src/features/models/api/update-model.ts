import { potentialModelSchema, type ModelUpdate, type PotentialModel } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getModelQueryOptions } from './get-model';
import { getModelsQueryOptions } from './get-models';

export const updateModel = ({ modelId, changes }: { modelId: number; changes: ModelUpdate }): Promise<PotentialModel> =>
  api.patch(`/models/${modelId}`, { body: changes, schema: potentialModelSchema });

export function useUpdateModel({ onSuccess }: { onSuccess?: (model: PotentialModel) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateModel,
    onSuccess: async (model) => {
      queryClient.setQueryData(getModelQueryOptions(model.id).queryKey, model);
      await queryClient.invalidateQueries({ queryKey: getModelsQueryOptions().queryKey });
      onSuccess?.(model);
    },
  });
}
