import type { CurrentUser } from '@sixtyfold/shared';
import { adminUser, memberUser } from '@/testing/fixtures';
import { commentPermissions } from './comment-permissions';

const lead: CurrentUser = { ...memberUser, id: 7, memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'lead' }] };
const byTomas = { author: { id: memberUser.id, displayName: memberUser.displayName, handle: 'tomas.lindqvist' } };

describe('commentPermissions', () => {
  it('lets the author edit and delete', () => {
    expect(commentPermissions(byTomas, 10, memberUser)).toEqual({ edit: true, remove: true });
  });

  it('lets a lead of the group and a site admin delete but not edit', () => {
    expect(commentPermissions(byTomas, 10, lead)).toEqual({ edit: false, remove: true });
    expect(commentPermissions(byTomas, 99, adminUser)).toEqual({ edit: false, remove: true });
  });

  it('gives a lead of another group nothing', () => {
    expect(commentPermissions(byTomas, 11, lead)).toEqual({ edit: false, remove: false });
    expect(commentPermissions(byTomas, 10, null)).toEqual({ edit: false, remove: false });
  });
});
