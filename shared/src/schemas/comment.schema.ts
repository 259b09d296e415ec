import { z } from 'zod';

export const COMMENT_BODY_MAX = 5000;

/** What a comment says: plain text, stored as typed and always shown as text. */
export const commentBodySchema = z.object({
  body: z.string().refine((s) => s.trim().length > 0, 'Write something first').pipe(z.string().max(COMMENT_BODY_MAX, `At most ${COMMENT_BODY_MAX} characters`)),
});
export type CommentBody = z.infer<typeof commentBodySchema>;

/** A new comment: on the whole scan, or on one of its points when `pointIndex` is given. */
export const createCommentSchema = commentBodySchema.extend({
  pointIndex: z.number().int().min(0).nullable().default(null),
});
export type CreateComment = z.infer<typeof createCommentSchema>;

export const commentListQuerySchema = z.object({
  /** Only the thread of this point; without it, the thread of the whole scan. */
  pointIndex: z.coerce.number().int().min(0).optional(),
});
export type CommentListQuery = z.infer<typeof commentListQuerySchema>;

export const commentPersonSchema = z.object({
  id: z.number().int(),
  displayName: z.string(),
  /** The part of the e-mail before the "@": what `@handle` mentions match. */
  handle: z.string(),
});
export type CommentPerson = z.infer<typeof commentPersonSchema>;

export const commentSchema = z.object({
  id: z.number().int(),
  scanId: z.number().int(),
  pointIndex: z.number().int().nullable(),
  body: z.string(),
  author: commentPersonSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  edited: z.boolean(),
  /** Group members the body mentions, resolved when it was saved. */
  mentions: z.array(commentPersonSchema),
});
export type CommentDto = z.infer<typeof commentSchema>;

/** How many comments each point of a scan has, for marking heatmap cells. */
export const commentCountsSchema = z.object({
  scan: z.number().int(),
  points: z.record(z.string(), z.number().int()),
});
export type CommentCounts = z.infer<typeof commentCountsSchema>;

const MENTION = /(^|[^\w.+-])@([A-Za-z0-9._+-]*[A-Za-z0-9_+-])/g;

/** The lower-cased handles a body mentions with `@handle`, each once, in order. */
export function mentionedHandles(body: string): string[] {
  const out: string[] = [];
  for (const m of body.matchAll(MENTION)) {
    const handle = m[2].toLowerCase();
    if (!out.includes(handle)) out.push(handle);
  }
  return out;
}

/** The handle of an e-mail address: what comes before the "@". */
export function handleOf(email: string): string {
  return email.slice(0, email.indexOf('@')).toLowerCase();
}

/** A body cut into plain text and `@handle` pieces, so a view can highlight mentions as text. */
export function splitMentions(body: string, handles: string[]): { text: string; mention?: string }[] {
  const known = new Set(handles.map((h) => h.toLowerCase()));
  const parts: { text: string; mention?: string }[] = [];
  let last = 0;
  for (const m of body.matchAll(MENTION)) {
    const handle = m[2].toLowerCase();
    if (!known.has(handle)) continue;
    const start = m.index! + m[1].length;
    if (start > last) parts.push({ text: body.slice(last, start) });
    parts.push({ text: `@${m[2]}`, mention: handle });
    last = start + 1 + m[2].length;
  }
  if (last < body.length) parts.push({ text: body.slice(last) });
  return parts;
}
