import { scanDetailSchema, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getScanQueryOptions } from './get-scan';

export const cancelScan = (scanId: number): Promise<ScanDetail> => api.post(`/scans/${scanId}/cancel`, { schema: scanDetailSchema });

export function useCancelScan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelScan,
    onSuccess: async (scan) => {
      queryClient.setQueryData(getScanQueryOptions(scan.id).queryKey, scan);
      await queryClient.invalidateQueries({ queryKey: ['scans', 'list'] });
    },
  });
}
