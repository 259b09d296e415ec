import { scanDetailSchema, type RefineScanInput, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const refineScan = ({ scanId, body }: { scanId: number; body: RefineScanInput }): Promise<ScanDetail> =>
  api.post(`/scans/${scanId}/refine`, { body, schema: scanDetailSchema });

export function useRefineScan({ onSuccess }: { onSuccess?: (level: ScanDetail) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: refineScan,
    onSuccess: async (level, { scanId }) => {
      await queryClient.invalidateQueries({ queryKey: ['scans', 'lineage', scanId] });
      await queryClient.invalidateQueries({ queryKey: ['scans', 'list'] });
      onSuccess?.(level);
    },
  });
}
