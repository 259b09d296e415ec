import type { CurrentUser, GroupRole } from '@sixtyfold/shared';
import { adminUser, memberUser } from '@/testing/fixtures';
import { regionPermissions } from './region-permissions';

const withRole = (role: GroupRole, id = 7): CurrentUser => ({
  ...memberUser,
  id,
  memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role }],
});

describe('what a user may do with constraint regions', () => {
  it('lets members upload and delete only the regions they uploaded', () => {
    const can = regionPermissions(10, withRole('member', 7));
    expect(can.upload).toBe(true);
    expect(can.remove({ createdById: 7 })).toBe(true);
    expect(can.remove({ createdById: 2 })).toBe(false);
    expect(can.remove({ createdById: null })).toBe(false);
  });

  it('lets leads and site admins delete any region', () => {
    expect(regionPermissions(10, withRole('lead')).remove({ createdById: 2 })).toBe(true);
    const admin = regionPermissions(10, { ...adminUser, memberships: [] });
    expect(admin.upload).toBe(true);
    expect(admin.remove({ createdById: null })).toBe(true);
  });

  it('gives viewers and other groups nothing', () => {
    const viewer = regionPermissions(10, withRole('viewer', 7));
    expect(viewer.upload).toBe(false);
    expect(viewer.remove({ createdById: 7 })).toBe(false);
    expect(regionPermissions(11, withRole('lead')).upload).toBe(false);
  });
});
