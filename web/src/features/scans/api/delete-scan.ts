import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const deleteScan = (scanId: number): Promise<undefined> => api.delete(`/scans/${scanId}`);

export function useDeleteScan({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteScan,
    onSuccess: async () => {
      onSuccess?.();
      await queryClient.invalidateQueries({ queryKey: ['scans', 'list'] });
    },
  });
}
