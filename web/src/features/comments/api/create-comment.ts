import { commentSchema, type CommentDto, type CreateComment } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanCommentsKey } from './get-comments';

export const createComment = (scanId: number, data: CreateComment): Promise<CommentDto> =>
  api.post(`/scans/${scanId}/comments`, { body: data, schema: commentSchema });

export function useCreateComment(scanId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (data: CreateComment) => createComment(scanId, data),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scanCommentsKey(scanId) }),
  });
}
