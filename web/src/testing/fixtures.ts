import type { CurrentUser, ScanSummary } from '@sixtyfold/shared';

// An invented research group; all addresses use the reserved .example domain.
export const adminUser: CurrentUser = {
  id: 1,
  email: 'amara.okafor@halvorsen.example',
  displayName: 'Amara Okafor',
  siteRole: 'admin',
  memberships: [
    { groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'lead' },
    { groupId: 11, groupSlug: 'reheating-club', groupName: 'Reheating Club', role: 'viewer' },
  ],
};

export const memberUser: CurrentUser = {
  id: 2,
  email: 'tomas.lindqvist@halvorsen.example',
  displayName: 'Tomas Lindqvist',
  siteRole: 'user',
  memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'member' }],
};

export function scan(overrides: Partial<ScanSummary> = {}): ScanSummary {
  return {
    id: 101,
    groupId: 10,
    ownerId: 2,
    ownerName: 'Tomas Lindqvist',
    name: 'Plateau width sweep',
    method: 'slowroll',
    status: 'running',
    tags: ['plateau'],
    totalPoints: 400,
    donePoints: 120,
    failedPoints: 0,
    createdAt: '2026-11-30T09:15:00.000Z',
    finishedAt: null,
    ...overrides,
  };
}
