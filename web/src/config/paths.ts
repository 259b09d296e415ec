// Every route path lives here once; components build links with getHref.
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  scans: { path: '/scans', getHref: () => '/scans' },
  scanNew: {
    path: '/scans/new',
    /** `from` starts the form from a copy of an earlier scan. */
    getHref: (fromScanId?: number) => (fromScanId ? `/scans/new?from=${fromScanId}` : '/scans/new'),
  },
  scan: {
    path: '/scans/:scanId',
    getHref: (scanId: number, view?: string) => (view ? `/scans/${scanId}?view=${view}` : `/scans/${scanId}`),
  },
  point: {
    path: '/scans/:scanId/points/:pointIndex',
    getHref: (scanId: number, pointIndex: number) => `/scans/${scanId}/points/${pointIndex}`,
  },
  models: { path: '/models', getHref: () => '/models' },
  modelNew: {
    path: '/models/new',
    getHref: (groupId?: number) => (groupId ? `/models/new?group=${groupId}` : '/models/new'),
  },
  family: { path: '/models/families/:familyKey', getHref: (familyKey: string) => `/models/families/${familyKey}` },
  model: { path: '/models/:modelId', getHref: (modelId: number) => `/models/${modelId}` },
  modelEdit: { path: '/models/:modelId/edit', getHref: (modelId: number) => `/models/${modelId}/edit` },
  compare: {
    path: '/compare',
    getHref: (scanIds: number[] = []) => (scanIds.length ? `/compare?scans=${scanIds.join(',')}` : '/compare'),
  },
  admin: { path: '/admin', getHref: () => '/admin' },
  maintenance: { path: '/admin/maintenance', getHref: () => '/admin/maintenance' },
  tokens: { path: '/tokens', getHref: () => '/tokens' },
  notifications: { path: '/notifications', getHref: () => '/notifications' },
  preferences: { path: '/preferences', getHref: () => '/preferences' },
  account: { path: '/account', getHref: () => '/account' },
  group: { path: '/groups/:groupId', getHref: (groupId: number) => `/groups/${groupId}` },
  invitation: { path: '/invitations/:token', getHref: (token: string) => `/invitations/${encodeURIComponent(token)}` },
  adminGroups: { path: '/admin/groups', getHref: () => '/admin/groups' },
  adminOutbox: { path: '/admin/outbox', getHref: () => '/admin/outbox' },
  adminOutboxMessage: { path: '/admin/outbox/:messageId', getHref: (messageId: string) => `/admin/outbox/${encodeURIComponent(messageId)}` },
} as const;
