import { retentionPolicySchema, type RetentionPolicy } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getRetentionQueryOptions } from './get-retention';

export const updateRetention = (groupId: number, policy: RetentionPolicy): Promise<RetentionPolicy> =>
  api.patch(`/maintenance/groups/${groupId}/retention`, { body: policy, schema: retentionPolicySchema });

export function useUpdateRetention(groupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (policy: RetentionPolicy) => updateRetention(groupId, policy),
    onSuccess: (policy) => queryClient.setQueryData(getRetentionQueryOptions(groupId).queryKey, policy),
  });
}
