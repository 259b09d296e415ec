import type { NotificationDto } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

vi.setConfig({ testTimeout: 20_000 });
const slow = { timeout: 5_000 };

const mention: NotificationDto = {
  id: 3,
  kind: 'mentioned',
  createdAt: '2026-12-02T09:30:00.000Z',
  readAt: null,
  payload: { title: 'Amara Okafor mentioned you on "Plateau width sweep"', link: '/scans/101/points/7', scanId: 101, pointIndex: 7, excerpt: 'Ask @tomas.lindqvist about this cell' },
};
const finished: NotificationDto = {
  id: 2,
  kind: 'scan_completed',
  createdAt: '2026-12-01T18:00:00.000Z',
  readAt: '2026-12-01T19:00:00.000Z',
  payload: { title: 'Your scan "Plateau width sweep" finished', link: '/scans/101', scanId: 101 },
};
const invited: NotificationDto = {
  id: 1,
  kind: 'invited',
  createdAt: '2026-11-30T08:00:00.000Z',
  readAt: null,
  payload: { title: 'You were added to Reheating Club', link: null },
};

/** The API's notifications store: unread filter, pages of two, read marks. */
function notificationsApi(items: NotificationDto[] = [mention, finished, invited]) {
  let stored = [...items];
  const unread = () => stored.filter((n) => n.readAt === null).length;
  return mockApi({
    'GET /api/auth/me': () => json(200, memberUser),
    'GET /api/notifications/unread-count': () => json(200, { unread: unread() }),
    'GET /api/notifications': (request: MockRequest) => {
      const page = Number(request.url.searchParams.get('page') ?? 1);
      const pageSize = 2;
      const list = request.url.searchParams.get('unread') === 'true' ? stored.filter((n) => n.readAt === null) : stored;
      return json(200, { items: list.slice((page - 1) * pageSize, page * pageSize), total: list.length, page, pageSize });
    },
    'POST /api/notifications/3/read': () => {
      stored = stored.map((n) => (n.id === 3 ? { ...n, readAt: '2026-12-02T10:00:00.000Z' } : n));
      return json(200, stored.find((n) => n.id === 3));
    },
    'POST /api/notifications/1/read': () => {
      stored = stored.map((n) => (n.id === 1 ? { ...n, readAt: '2026-12-02T10:00:00.000Z' } : n));
      return json(200, stored.find((n) => n.id === 1));
    },
    'POST /api/notifications/read-all': () => {
      stored = stored.map((n) => ({ ...n, readAt: n.readAt ?? '2026-12-02T10:00:00.000Z' }));
      return json(200, { unread: 0 });
    },
    'GET /api/scans/101': () => json(404, { statusCode: 404, error: 'Not Found', message: 'No such scan' }),
  });
}

const items = () => within(screen.getByRole('list', { name: 'Notifications' })).getAllByRole('listitem');

describe('notifications page', () => {
  it('lists them newest first, marks the unread ones and pages through the rest', async () => {
    const { requests } = notificationsApi();
    const { user } = renderApp('/notifications');

    await screen.findByRole('link', { name: mention.payload.title }, slow);
    expect(items().map((li) => within(li).queryByText('Unread') !== null)).toEqual([true, false]);
    expect(items()[0]).toHaveTextContent('Mention');
    expect(items()[0]).toHaveTextContent('Ask @tomas.lindqvist about this cell');
    expect(screen.getByRole('link', { name: finished.payload.title })).toHaveAttribute('href', '/scans/101');

    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(await screen.findByText(invited.payload.title, undefined, slow)).toBeInTheDocument();
    expect(requests.filter((r) => r.url.pathname === '/api/notifications').map((r) => r.url.searchParams.get('page'))).toEqual(['1', '2']);
    // No link to follow: its own button marks it read.
    await user.click(within(items()[0]).getByRole('button', { name: 'Mark read' }));
    await waitFor(() => expect(within(items()[0]).queryByText('Unread')).not.toBeInTheDocument(), slow);
  });

  it('shows the unread ones only when asked, in the address too', async () => {
    const { requests } = notificationsApi();
    const { user, router } = renderApp('/notifications');

    await user.click(await screen.findByRole('checkbox', { name: 'Unread only' }, slow));
    await waitFor(() => expect(router.state.location.search).toBe('?unread=1'), slow);
    expect(await screen.findByText(invited.payload.title, undefined, slow)).toBeInTheDocument();
    expect(screen.queryByText(finished.payload.title)).not.toBeInTheDocument();
    expect(requests.some((r) => r.url.pathname === '/api/notifications' && r.url.searchParams.get('unread') === 'true')).toBe(true);
  });

  it('marks a notification read when its link is opened, and goes there', async () => {
    const { requests } = notificationsApi();
    const { user, router } = renderApp('/notifications');

    await user.click(await screen.findByRole('link', { name: mention.payload.title }, slow));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/101/points/7'), slow);
    await waitFor(() => expect(requests.some((r) => r.method === 'POST' && r.url.pathname === '/api/notifications/3/read')).toBe(true), slow);
  });

  it('marks all read and the bell goes quiet', async () => {
    const { requests } = notificationsApi();
    const { user } = renderApp('/notifications');

    expect(await screen.findByRole('link', { name: 'Notifications, 2 unread' }, slow)).toHaveAttribute('href', '/notifications');
    await user.click(screen.getByRole('button', { name: 'Mark all read' }));
    await waitFor(() => expect(screen.getByRole('link', { name: 'Notifications' })).toBeInTheDocument(), slow);
    await waitFor(() => expect(screen.queryByText('Unread')).not.toBeInTheDocument(), slow);
    expect(screen.getByRole('button', { name: 'Mark all read' })).toBeDisabled();
    expect(requests.filter((r) => r.method === 'POST').map((r) => r.url.pathname)).toEqual(['/api/notifications/read-all']);
  });

  it('explains an empty list', async () => {
    notificationsApi([]);
    renderApp('/notifications');
    expect(await screen.findByText('No notifications yet', undefined, slow)).toBeInTheDocument();
  });
});

describe('header bell', () => {
  it('shows the unread count on every page and links to the notifications', async () => {
    notificationsApi();
    // Any signed-in page has the bell; the tokens page's own list is not under test here.
    const { user, router } = renderApp('/tokens');

    const bell = await screen.findByRole('link', { name: 'Notifications, 2 unread' }, slow);
    expect(bell).toHaveTextContent('2');
    await user.click(bell);
    await waitFor(() => expect(router.state.location.pathname).toBe('/notifications'), slow);
  });

  it('asks nothing while signed out', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' }) });
    const { router } = renderApp('/notifications');
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'), slow);
    expect(requests.some((r) => r.url.pathname.startsWith('/api/notifications'))).toBe(false);
  });
});
