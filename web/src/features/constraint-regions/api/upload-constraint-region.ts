import { constraintRegionSchema, type ConstraintRegion, type ConstraintRegionUpload } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Sends the fields and the CSV file as one multipart form; the API reads the whole file before storing anything. */
export function uploadConstraintRegion({ file, ...fields }: ConstraintRegionUpload & { file: File }): Promise<ConstraintRegion> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.set(name, String(value));
  form.set('file', file);
  return api.upload('/constraint-regions', form, { schema: constraintRegionSchema });
}

export function useUploadConstraintRegion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadConstraintRegion,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['constraint-regions'] }),
  });
}
