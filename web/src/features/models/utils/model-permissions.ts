import { groupRoleAtLeast, type CurrentUser, type GroupRole, type MembershipSummary } from '@sixtyfold/shared';

// What the API allows on models: members and leads write, leads delete; a site admin counts as lead.
// The API checks again; these only decide which buttons to show.

function effectiveRole(user: CurrentUser, membership: MembershipSummary): GroupRole {
  return user.siteRole === 'admin' ? 'lead' : membership.role;
}

/** The user's groups in which they hold at least `required`, for the group select of the model form. */
export function groupsWithRole(user: CurrentUser | null | undefined, required: GroupRole): MembershipSummary[] {
  if (!user) return [];
  return user.memberships.filter((m) => groupRoleAtLeast(effectiveRole(user, m), required));
}

/** True when the user holds at least `required` in the group (site admins everywhere). */
export function hasGroupRole(user: CurrentUser | null | undefined, groupId: number, required: GroupRole): boolean {
  if (!user) return false;
  if (user.siteRole === 'admin') return true;
  const membership = user.memberships.find((m) => m.groupId === groupId);
  return membership !== undefined && groupRoleAtLeast(membership.role, required);
}
