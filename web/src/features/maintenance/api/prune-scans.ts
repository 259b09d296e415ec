import { prunePlanSchema, pruneResultSchema, type PruneFilter, type PruneRequest } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const dryRunPrune = (filter: PruneFilter) => api.post('/maintenance/prune/dry-run', { body: filter, schema: prunePlanSchema });

export const pruneScans = (request: PruneRequest) => api.post('/maintenance/prune', { body: request, schema: pruneResultSchema });

export const useDryRunPrune = () => useMutation({ mutationFn: dryRunPrune });

export function usePruneScans({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: pruneScans,
    onSuccess: async () => {
      onSuccess?.();
      // Storage figures and the archive list both change with a prune; scan lists too.
      await queryClient.invalidateQueries({ queryKey: ['maintenance'] });
      await queryClient.invalidateQueries({ queryKey: ['scans'] });
    },
  });
}
