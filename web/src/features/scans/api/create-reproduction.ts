import { reproductionSchema, type CreateReproduction, type Reproduction } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getReproductionsQueryOptions } from './get-reproductions';

/** Queues a reproducibility check of a random sample of the scan's OK points. */
export const createReproduction = (scanId: number, body: CreateReproduction): Promise<Reproduction> =>
  api.post(`/scans/${scanId}/reproductions`, { body, schema: reproductionSchema });

export function useCreateReproduction(scanId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateReproduction) => createReproduction(scanId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getReproductionsQueryOptions(scanId).queryKey }),
  });
}
