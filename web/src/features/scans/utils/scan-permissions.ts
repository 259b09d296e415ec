import type { CurrentUser, GroupRole, ScanDetail } from '@sixtyfold/shared';

export interface ScanPermissions {
  /** The user's role in the scan's group; site admins act as leads. */
  role: GroupRole | null;
  cancel: boolean;
  retry: boolean;
  remove: boolean;
  clone: boolean;
  /** Start a reproducibility check (it uses the group's workers). */
  reproduce: boolean;
}

type ScanFacts = Pick<ScanDetail, 'groupId' | 'ownerId' | 'status' | 'failedPoints'>;

/**
 * What the user may do with a scan right now, by the same rules the API enforces
 * (api/src/scans/scans.service.ts): cancel and retry are for the owner (a member) or a lead,
 * deleting is for leads, and anyone who may submit scans in the group may start from a copy.
 */
export function scanPermissions(scan: ScanFacts, user: CurrentUser | null | undefined): ScanPermissions {
  const membership = user?.memberships.find((m) => m.groupId === scan.groupId)?.role ?? null;
  const role: GroupRole | null = user?.siteRole === 'admin' ? 'lead' : membership;
  const lead = role === 'lead';
  const ownerOrLead = lead || (role === 'member' && scan.ownerId === user?.id);
  const live = scan.status === 'queued' || scan.status === 'running';
  return {
    role,
    cancel: ownerOrLead && live,
    retry: ownerOrLead && !live && scan.failedPoints > 0,
    remove: lead,
    clone: lead || role === 'member',
    reproduce: lead || role === 'member',
  };
}
