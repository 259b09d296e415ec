import type { CommentDto, CurrentUser } from '@sixtyfold/shared';

export interface CommentPermissions {
  edit: boolean;
  remove: boolean;
}

/**
 * What the user may do with a comment, by the rules the API enforces (api/src/comments/comments.service.ts):
 * only its author edits; its author, a lead of the scan's group or a site admin deletes.
 */
export function commentPermissions(comment: Pick<CommentDto, 'author'>, groupId: number, user: CurrentUser | null | undefined): CommentPermissions {
  if (!user) return { edit: false, remove: false };
  const author = comment.author.id === user.id;
  const lead = user.memberships.some((m) => m.groupId === groupId && m.role === 'lead');
  return { edit: author, remove: author || lead || user.siteRole === 'admin' };
}
