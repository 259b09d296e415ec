import { Box, Button, HStack, Stack, Text } from '@chakra-ui/react';
import type { CommentBody, CommentDto, CommentPerson } from '@sixtyfold/shared';
import { useState } from 'react';
import { DateTime } from '@/components/ui/date-time';
import { RemoveButton } from '@/components/ui/remove-button';
import type { CommentPermissions } from '../utils/comment-permissions';
import { CommentForm } from './comment-form';
import { CommentText } from './comment-text';

interface CommentItemProps {
  comment: CommentDto;
  can: CommentPermissions;
  people: CommentPerson[];
  onSave: (body: CommentBody) => Promise<unknown>;
  onDelete: () => void;
}

/** One comment: who wrote it and when, its text, and edit or delete where allowed. */
export function CommentItem({ comment, can, people, onSave, onDelete }: CommentItemProps) {
  const [editing, setEditing] = useState(false);
  return (
    <Box as="article" aria-label={`Comment by ${comment.author.displayName}`} py="3" borderBottomWidth="1px" borderColor="border" _last={{ borderBottomWidth: 0 }}>
      <HStack gap="2" wrap="wrap" fontSize="sm" mb="1">
        <Text as="span" fontWeight="600" color="ink.900">
          {comment.author.displayName}
        </Text>
        <DateTime iso={comment.createdAt} color="fg.muted" />
        {comment.edited && (
          <Text as="span" color="fg.subtle" fontStyle="italic" title={`Edited ${comment.updatedAt}`}>
            edited
          </Text>
        )}
      </HStack>
      {editing ? (
        <CommentForm
          label="Edit your comment"
          submitLabel="Save"
          busyLabel="Saving…"
          defaultBody={comment.body}
          people={people}
          onSubmit={async (body) => {
            await onSave(body);
            setEditing(false);
          }}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <Stack gap="1">
          <CommentText comment={comment} />
          {(can.edit || can.remove) && (
            <HStack gap="1">
              {can.edit && (
                <Button size="xs" variant="ghost" onClick={() => setEditing(true)} aria-label="Edit comment">
                  Edit
                </Button>
              )}
              {can.remove && (
                <RemoveButton label="Delete comment" onClick={onDelete}>
                  Delete
                </RemoveButton>
              )}
            </HStack>
          )}
        </Stack>
      )}
    </Box>
  );
}
