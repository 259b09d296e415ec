import { screen, waitFor } from '@testing-library/react';
import { adminUser, memberUser, scan } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const page = <T,>(items: T[]) => json(200, { items, total: items.length, page: 1, pageSize: 25 });

describe('app routes', () => {
  it('sends a visitor without a session to sign-in, remembering where they were going', async () => {
    mockApi({ 'GET /api/auth/me': () => apiError(401, 'Not signed in') });
    const { router } = renderApp('/models');

    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2Fmodels');
  });

  it('opens the Overview at /, the home of the app', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans': () => page([]),
      'GET /api/workers/pool': () => json(200, { workers: [], queue: { waiting: 0, active: 0, delayed: 0, failed: 0 } }),
    });
    const { router } = renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Overview', level: 1 })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/');
    expect(await screen.findByText('Nothing is running')).toBeInTheDocument();
  });

  it('lists the scans at /scans with what the API returned', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans': () => page([scan({ name: 'Plateau width sweep' })]),
    });
    renderApp('/scans');

    expect(await screen.findByRole('heading', { name: 'Scans' })).toBeInTheDocument();
    expect(await screen.findByText('Plateau width sweep')).toBeInTheDocument();
    expect(screen.getByText('Running')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Plateau Lab' })).toHaveAttribute('href', '/groups/10');
  });

  it('explains the empty scans list', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/scans': () => page([]) });
    renderApp('/scans');

    expect(await screen.findByText('No scans yet')).toBeInTheDocument();
    expect(screen.getByText(/Scans of your groups appear here/)).toBeInTheDocument();
  });

  it('goes to sign-in with next set when a page query gets a 401 (session expired)', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans': () => apiError(401, 'Your session has ended'),
    });
    const { router } = renderApp('/scans?page=2');

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent('/scans?page=2')}`);
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
  });

  it('says what went wrong when the API fails', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/models': () => apiError(503, 'The database is not answering'),
    });
    renderApp('/models');

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Could not load models');
    expect(alert).toHaveTextContent('The database is not answering');
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  });

  it('keeps regular users out of the admin area without calling the admin API', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
    renderApp('/admin');

    expect(await screen.findByText('This area is for site administrators')).toBeInTheDocument();
    expect(requests.some((r) => r.url.pathname.startsWith('/api/admin'))).toBe(false);
  });

  it('shows users and audit events to a site administrator', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/groups': () => json(200, []),
      'GET /api/admin/users': () =>
        json(200, [
          {
            id: 2,
            email: 'tomas.lindqvist@halvorsen.example',
            displayName: 'Tomas Lindqvist',
            siteRole: 'user',
            groupCount: 1,
            lastLoginAt: null,
            createdAt: '2026-11-01T08:00:00.000Z',
            disabledAt: null,
          },
        ]),
      'GET /api/admin/audit-events': (request) =>
        json(200, {
          items: [
            {
              id: 5,
              action: 'auth.login',
              actorId: 1,
              actorEmail: 'amara.okafor@halvorsen.example',
              groupId: null,
              targetType: 'user',
              targetId: '1',
              details: {},
              createdAt: '2026-12-01T08:00:00.000Z',
            },
          ],
          total: 41,
          page: Number(request.url.searchParams.get('page')),
          pageSize: 20,
        }),
    });
    const { user, router } = renderApp('/admin');

    expect(await screen.findByRole('cell', { name: 'tomas.lindqvist@halvorsen.example' })).toBeInTheDocument();
    expect(await screen.findByText('auth.login', { selector: 'span' })).toBeInTheDocument();
    expect(screen.getByRole('navigation', { name: 'events pages' })).toHaveTextContent('Page 1 of 3 · 41 events');

    await user.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(router.state.location.search).toBe('?auditPage=2'));
  });

  it('keeps the compare selection in the address', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/scans': () =>
        page([
          scan({ id: 1, name: 'Alpha grid', status: 'completed', finishedAt: '2026-11-30T12:00:00.000Z' }),
          scan({ id: 2, name: 'Beta grid', status: 'completed', finishedAt: '2026-11-30T13:00:00.000Z' }),
          scan({ id: 3, name: 'Still going', status: 'running' }),
        ]),
    });
    const { user, router } = renderApp('/compare?scans=2');

    const beta = await screen.findByRole('checkbox', { name: /Beta grid/ });
    expect(beta).toBeChecked();
    expect(screen.queryByText('Still going')).not.toBeInTheDocument();

    await user.click(screen.getByRole('checkbox', { name: /Alpha grid/ }));
    await waitFor(() => expect(router.state.location.search).toBe(`?scans=${encodeURIComponent('2,1')}`));
    expect(await screen.findByRole('heading', { name: 'Side by side' })).toBeInTheDocument();
    expect(await screen.findByRole('columnheader', { name: 'Alpha grid' })).toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: 'Beta grid' })).toBeInTheDocument();
  });

  it('signs out to a plain sign-in page and forgets the user', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/models': () => json(200, []),
      'POST /api/auth/logout': () => new Response(null, { status: 204 }),
    });
    const { user, router, queryClient } = renderApp('/models');

    await user.click(await screen.findByRole('button', { name: 'Account menu for Amara Okafor' }));
    await user.click(await screen.findByRole('menuitem', { name: 'Sign out' }));

    expect(await screen.findByText('You have signed out.')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('');
    expect(queryClient.getQueryData(['auth', 'me'])).toBeNull();
    const logout = requests.find((r) => r.url.pathname === '/api/auth/logout');
    expect(logout?.method).toBe('POST');
    expect(logout?.body).toEqual({});
  });
});
