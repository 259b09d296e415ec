import { scanDetailSchema, type CreateScan, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getScanQueryOptions } from './get-scan';

export const createScan = (spec: CreateScan): Promise<ScanDetail> => api.post('/scans', { body: spec, schema: scanDetailSchema });

export function useCreateScan({ onSuccess }: { onSuccess?: (scan: ScanDetail) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createScan,
    onSuccess: async (scan) => {
      // The scan's page can draw at once from what the API answered.
      queryClient.setQueryData(getScanQueryOptions(scan.id).queryKey, scan);
      onSuccess?.(scan);
      // Every list and count of scans may now include this one.
      await queryClient.invalidateQueries({ queryKey: ['scans'] });
    },
  });
}
