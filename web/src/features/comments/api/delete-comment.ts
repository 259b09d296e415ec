import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanCommentsKey } from './get-comments';

export const deleteComment = (commentId: number): Promise<undefined> => api.delete(`/comments/${commentId}`);

export function useDeleteComment(scanId: number, { onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteComment,
    onSuccess: async () => {
      onSuccess?.();
      await queryClient.invalidateQueries({ queryKey: scanCommentsKey(scanId) });
    },
  });
}
