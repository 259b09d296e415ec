import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const deleteConstraintRegion = (regionId: number) => api.delete(`/constraint-regions/${regionId}`);

export function useDeleteConstraintRegion({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteConstraintRegion,
    onSuccess: async () => {
      onSuccess?.();
      await queryClient.invalidateQueries({ queryKey: ['constraint-regions'] });
    },
  });
}
