import type { ConstraintRegion, CurrentUser, GroupRole } from '@sixtyfold/shared';

export interface RegionPermissions {
  upload: boolean;
  remove: (region: Pick<ConstraintRegion, 'createdById'>) => boolean;
}

/**
 * What the user may do with a group's constraint regions, by the rules the API enforces
 * (api/src/constraint-regions/constraint-regions.service.ts): members upload; leads delete any
 * region, members only their own; site admins act as leads.
 */
export function regionPermissions(groupId: number, user: CurrentUser | null | undefined): RegionPermissions {
  const membership = user?.memberships.find((m) => m.groupId === groupId)?.role ?? null;
  const role: GroupRole | null = user?.siteRole === 'admin' ? 'lead' : membership;
  const member = role === 'lead' || role === 'member';
  return {
    upload: member,
    remove: (region) => role === 'lead' || (member && region.createdById === user?.id),
  };
}
