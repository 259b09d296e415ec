import { z } from 'zod';

/** Site-wide role: `admin` is the maintainer who sees and prunes everything. */
export const SITE_ROLES = ['admin', 'user'] as const;
export const siteRoleSchema = z.enum(SITE_ROLES);
export type SiteRole = z.infer<typeof siteRoleSchema>;

/** Role inside one research group, strongest first. */
export const GROUP_ROLES = ['lead', 'member', 'viewer'] as const;
export const groupRoleSchema = z.enum(GROUP_ROLES);
export type GroupRole = z.infer<typeof groupRoleSchema>;

const GROUP_ROLE_RANK: Record<GroupRole, number> = { lead: 3, member: 2, viewer: 1 };

/** True when `actual` grants at least what `required` does (lead ⊇ member ⊇ viewer). */
export function groupRoleAtLeast(actual: GroupRole, required: GroupRole): boolean {
  return GROUP_ROLE_RANK[actual] >= GROUP_ROLE_RANK[required];
}
