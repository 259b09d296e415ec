import { handleOf, type CommentPerson, type GroupMember } from '@sixtyfold/shared';

/** The group's members as people one can mention, by handle. */
export const mentionCandidates = (members: GroupMember[]): CommentPerson[] =>
  members.map((m) => ({ id: m.userId, displayName: m.displayName, handle: handleOf(m.email) }));

/** The `@handle` being typed just before the caret: where its "@" is and the letters after it. */
export interface MentionQuery {
  start: number;
  text: string;
}

// The same boundary as the shared mention pattern: an "@" at the start or after a non-handle character.
const TYPING = /(^|[^\w.+-])@([A-Za-z0-9._+-]*)$/;

export function mentionQueryAt(value: string, caret: number): MentionQuery | null {
  const match = TYPING.exec(value.slice(0, caret));
  if (!match) return null;
  const text = match[2];
  return { start: caret - text.length - 1, text: text.toLowerCase() };
}

/** Members whose handle starts with what was typed, at most `limit` of them. */
export function matchingPeople(people: CommentPerson[], text: string, limit = 8): CommentPerson[] {
  return people.filter((p) => p.handle.startsWith(text)).slice(0, limit);
}

/** The text with the typed query replaced by `@handle ` and where the caret goes after it. */
export function insertMention(value: string, caret: number, query: MentionQuery, handle: string): { value: string; caret: number } {
  const inserted = `@${handle} `;
  const rest = value.slice(caret);
  return { value: value.slice(0, query.start) + inserted + rest.replace(/^ /, ''), caret: query.start + inserted.length };
}
