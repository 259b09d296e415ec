// Every route path lives here once; components build links with getHref.
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  scans: { path: '/scans', getHref: () => '/scans' },
  models: { path: '/models', getHref: () => '/models' },
  compare: {
    path: '/compare',
    getHref: (scanIds: number[] = []) => (scanIds.length ? `/compare?scans=${scanIds.join(',')}` : '/compare'),
  },
  admin: { path: '/admin', getHref: () => '/admin' },
  tokens: { path: '/tokens', getHref: () => '/tokens' },
  group: { path: '/groups/:groupId', getHref: (groupId: number) => `/groups/${groupId}` },
} as const;
