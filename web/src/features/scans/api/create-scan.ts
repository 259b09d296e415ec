import { scanDetailSchema, type CreateScan, type ScanDetail } from '@sixtyfold/shared';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getScanQueryOptions } from './get-scan';

export const createScan = (spec: CreateScan): Promise<ScanDetail> => api.post('/scans', { body: spec, schema: scanDetailSchema });

/** After any submission (JSON or a points file): the new scan is known, and lists may include it. */
export async function scanLaunched(queryClient: QueryClient, scan: ScanDetail, onSuccess?: (scan: ScanDetail) => void) {
  // The scan's page can draw at once from what the API answered.
  queryClient.setQueryData(getScanQueryOptions(scan.id).queryKey, scan);
  onSuccess?.(scan);
  // Every list and count of scans may now include this one.
  await queryClient.invalidateQueries({ queryKey: ['scans'] });
}

export function useCreateScan({ onSuccess }: { onSuccess?: (scan: ScanDetail) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createScan, onSuccess: (scan) => scanLaunched(queryClient, scan, onSuccess) });
}
