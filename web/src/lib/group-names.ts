import type { CurrentUser } from '@sixtyfold/shared';

/** Group id → name from the signed-in user's memberships; lists only carry group ids. */
export function groupNamesOf(user: CurrentUser | null | undefined): Map<number, string> {
  return new Map((user?.memberships ?? []).map((m) => [m.groupId, m.groupName]));
}
