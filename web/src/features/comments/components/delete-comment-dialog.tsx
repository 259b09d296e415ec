import { Text } from '@chakra-ui/react';
import type { CommentDto } from '@sixtyfold/shared';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useDeleteComment } from '../api/delete-comment';

interface DeleteCommentDialogProps {
  scanId: number;
  /** The comment to delete; null keeps the dialog closed. */
  comment: CommentDto | null;
  onClose: () => void;
}

export function DeleteCommentDialog({ scanId, comment, onClose }: DeleteCommentDialogProps) {
  const remove = useDeleteComment(scanId, { onSuccess: onClose });
  const close = () => {
    remove.reset();
    onClose();
  };
  return (
    <ConfirmDialog
      open={comment !== null}
      title="Delete this comment?"
      confirmLabel="Delete comment"
      busyLabel="Deleting…"
      busy={remove.isPending}
      error={remove.isError ? { title: 'Could not delete the comment', message: remove.error.message } : null}
      onConfirm={() => comment && remove.mutate(comment.id)}
      onClose={close}
    >
      <Text>
        {comment?.author.displayName}’s comment disappears from the discussion for everyone. This cannot be undone.
      </Text>
    </ConfirmDialog>
  );
}
