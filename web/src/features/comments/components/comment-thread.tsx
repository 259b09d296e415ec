import { Box, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { CommentDto, CurrentUser, GroupMember } from '@sixtyfold/shared';
import { useId, useMemo, useState } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { useCreateComment } from '../api/create-comment';
import { useComments } from '../api/get-comments';
import { useUpdateComment } from '../api/update-comment';
import { commentPermissions } from '../utils/comment-permissions';
import { mentionCandidates } from '../utils/mentions';
import { CommentForm } from './comment-form';
import { CommentItem } from './comment-item';
import { DeleteCommentDialog } from './delete-comment-dialog';

interface CommentThreadProps {
  scanId: number;
  groupId: number;
  /** One point's thread; null for the whole scan's. */
  pointIndex: number | null;
  user: CurrentUser | null | undefined;
  /** The scan group's members, offered by `@`; none until they are loaded. */
  members?: GroupMember[];
  title?: string;
}

const countLabel = (n: number) => `${n} ${n === 1 ? 'comment' : 'comments'}`;

/** A scan's or a point's discussion, oldest first, with a box to add to it. Anyone who can read the scan may comment. */
export function CommentThread({ scanId, groupId, pointIndex, user, members, title = 'Discussion' }: CommentThreadProps) {
  const headingId = useId();
  const comments = useComments(scanId, pointIndex);
  const create = useCreateComment(scanId);
  const update = useUpdateComment(scanId);
  const [deleting, setDeleting] = useState<CommentDto | null>(null);
  const people = useMemo(() => mentionCandidates(members ?? []), [members]);

  return (
    <Box as="section" aria-labelledby={headingId}>
      <HStack justify="space-between" gap="3" mb="2">
        <Heading as="h2" id={headingId} size="md" color="ink.900">
          {title}
        </Heading>
        {comments.data && (
          <Text fontSize="sm" color="fg.muted">
            {countLabel(comments.data.length)}
          </Text>
        )}
      </HStack>
      <Stack gap="4">
        {comments.isPending ? (
          <LoadingState label="Loading the discussion…" />
        ) : comments.isError ? (
          <ErrorState title="Could not load the discussion" error={comments.error} onRetry={() => comments.refetch()} />
        ) : comments.data.length === 0 ? (
          <Text color="fg.muted" fontSize="sm">
            No comments yet{pointIndex === null ? ' on this scan' : ' on this point'}. Start the discussion below.
          </Text>
        ) : (
          <Box>
            {comments.data.map((comment) => (
              <CommentItem
                key={comment.id}
                comment={comment}
                can={commentPermissions(comment, groupId, user)}
                people={people}
                onSave={(body) => update.mutateAsync({ commentId: comment.id, body })}
                onDelete={() => setDeleting(comment)}
              />
            ))}
          </Box>
        )}
        <CommentForm
          label="Add a comment"
          submitLabel="Post comment"
          busyLabel="Posting…"
          people={people}
          resetOnSuccess
          onSubmit={(values) => create.mutateAsync({ ...values, pointIndex })}
        />
      </Stack>
      <DeleteCommentDialog scanId={scanId} comment={deleting} onClose={() => setDeleting(null)} />
    </Box>
  );
}
