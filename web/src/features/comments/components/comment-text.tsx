import { Text } from '@chakra-ui/react';
import { splitMentions, type CommentDto } from '@sixtyfold/shared';

/**
 * A comment's body as React text, never as HTML: whatever was typed shows as typed, line breaks
 * kept, and the resolved `@handle`s set apart by cutting the string, not by markup in it.
 */
export function CommentText({ comment }: { comment: Pick<CommentDto, 'body' | 'mentions'> }) {
  const names = new Map(comment.mentions.map((m) => [m.handle, m.displayName]));
  return (
    <Text whiteSpace="pre-wrap" overflowWrap="anywhere" color="fg" lineHeight="tall">
      {splitMentions(comment.body, [...names.keys()]).map((part, i) =>
        part.mention ? (
          <Text as="mark" key={i} title={names.get(part.mention)} bg="ember.subtle" color="ember.fg" fontWeight="500" px="0.5" borderRadius="sm">
            {part.text}
          </Text>
        ) : (
          part.text
        ),
      )}
    </Text>
  );
}
