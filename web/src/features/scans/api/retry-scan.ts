import { scanDetailSchema, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getScanQueryOptions } from './get-scan';

/** Queues the failed points of a finished scan again; the scan is running once more. */
export const retryScan = (scanId: number): Promise<ScanDetail> => api.post(`/scans/${scanId}/retry`, { schema: scanDetailSchema });

export function useRetryScan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryScan,
    onSuccess: async (scan) => {
      queryClient.setQueryData(getScanQueryOptions(scan.id).queryKey, scan);
      await queryClient.invalidateQueries({ queryKey: ['scans', 'list'] });
    },
  });
}
