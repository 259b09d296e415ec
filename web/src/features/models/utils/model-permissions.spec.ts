import type { CurrentUser } from '@sixtyfold/shared';
import { adminUser, memberUser } from '@/testing/fixtures';
import { groupsWithRole, hasGroupRole } from './model-permissions';

const viewer: CurrentUser = {
  ...memberUser,
  memberships: [
    { groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'viewer' },
    { groupId: 12, groupSlug: 'tensor-desk', groupName: 'Tensor Desk', role: 'lead' },
  ],
};

describe('model permissions', () => {
  it('lists the groups where the user holds the role or a stronger one', () => {
    expect(groupsWithRole(viewer, 'member').map((m) => m.groupId)).toEqual([12]);
    expect(groupsWithRole(viewer, 'viewer').map((m) => m.groupId)).toEqual([10, 12]);
    expect(groupsWithRole(memberUser, 'lead')).toEqual([]);
    expect(groupsWithRole(null, 'viewer')).toEqual([]);
  });

  it('treats a site admin as lead of each of their groups, even where their membership says viewer', () => {
    expect(groupsWithRole(adminUser, 'lead').map((m) => m.groupId)).toEqual([10, 11]);
    expect(hasGroupRole(adminUser, 99, 'lead')).toBe(true);
  });

  it('checks one group', () => {
    expect(hasGroupRole(memberUser, 10, 'member')).toBe(true);
    expect(hasGroupRole(memberUser, 10, 'lead')).toBe(false);
    expect(hasGroupRole(memberUser, 11, 'viewer')).toBe(false);
    expect(hasGroupRole(viewer, 10, 'member')).toBe(false);
    expect(hasGroupRole(undefined, 10, 'viewer')).toBe(false);
  });
});
