import { commentSchema, type CommentBody, type CommentDto } from '@sixtyfold/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { scanCommentsKey } from './get-comments';

/** Only the author may edit; the API resolves the mentions again. */
export const updateComment = (commentId: number, data: CommentBody): Promise<CommentDto> =>
  api.patch(`/comments/${commentId}`, { body: data, schema: commentSchema });

export function useUpdateComment(scanId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ commentId, body }: { commentId: number; body: CommentBody }) => updateComment(commentId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scanCommentsKey(scanId) }),
  });
}
