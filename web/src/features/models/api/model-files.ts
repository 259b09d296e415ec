import { potentialModelSchema, type PotentialModel } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';
import { getModelQueryOptions } from './get-model';
import { getModelsQueryOptions } from './get-models';

/** Where the browser downloads a model as a model file (the API names the file). */
export const modelExportHref = (modelId: number) => `${env.VITE_API_BASE_PATH}/models/${modelId}/export`;

export function importModel({ groupId, file }: { groupId: number; file: File }): Promise<PotentialModel> {
  const form = new FormData();
  form.set('groupId', String(groupId));
  form.set('file', file);
  return api.upload('/models/import', form, { schema: potentialModelSchema });
}

export function useImportModel({ onSuccess }: { onSuccess?: (model: PotentialModel) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importModel,
    onSuccess: async (model) => {
      queryClient.setQueryData(getModelQueryOptions(model.id).queryKey, model);
      await queryClient.invalidateQueries({ queryKey: getModelsQueryOptions().queryKey });
      onSuccess?.(model);
    },
  });
}
