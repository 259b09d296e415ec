import type { CurrentUser, ScanStatus } from '@sixtyfold/shared';
import { adminUser, memberUser } from '@/testing/fixtures';
import { scanPermissions } from './scan-permissions';

const scan = (status: ScanStatus, ownerId: number, failedPoints = 0) => ({ groupId: 10, ownerId, status, failedPoints });
const withRole = (role: 'lead' | 'member' | 'viewer', id = 7): CurrentUser => ({
  ...memberUser,
  id,
  memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role }],
});

describe('what a user may do with a scan', () => {
  it('lets the owner (a member) cancel while live and retry failures once finished, but not delete', () => {
    const owner = withRole('member', 2);
    expect(scanPermissions(scan('running', 2), owner)).toMatchObject({ role: 'member', cancel: true, retry: false, remove: false, clone: true });
    expect(scanPermissions(scan('completed', 2, 5), owner)).toMatchObject({ cancel: false, retry: true });
    expect(scanPermissions(scan('completed', 2, 0), owner)).toMatchObject({ retry: false });
  });

  it('keeps other members to cloning and reproducibility checks', () => {
    expect(scanPermissions(scan('queued', 2, 3), withRole('member', 9))).toMatchObject({ cancel: false, retry: false, remove: false, clone: true, reproduce: true });
  });

  it('lets leads do everything the state allows, and site admins act as leads', () => {
    expect(scanPermissions(scan('running', 2), withRole('lead'))).toMatchObject({ cancel: true, remove: true, clone: true });
    expect(scanPermissions(scan('failed', 2, 1), { ...adminUser, memberships: [] })).toMatchObject({ role: 'lead', retry: true, remove: true });
  });

  it('gives viewers and strangers nothing to do', () => {
    expect(scanPermissions(scan('running', 7), withRole('viewer', 7))).toMatchObject({ cancel: false, retry: false, remove: false, clone: false, reproduce: false });
    expect(scanPermissions(scan('running', 2), { ...memberUser, memberships: [] })).toMatchObject({ role: null, clone: false });
  });
});
