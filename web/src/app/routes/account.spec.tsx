import { screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

vi.setConfig({ testTimeout: 20_000 });

const CURRENT = 'inflaton-demo-1';
const NEW = 'a brand-new passphrase';

describe('account page: changing my password', () => {
  async function fill(user: ReturnType<typeof renderApp>['user'], values: { current?: string; next?: string; repeat?: string }) {
    const current = await screen.findByLabelText('Current password');
    if (values.current) await user.type(current, values.current);
    if (values.next) await user.type(screen.getByLabelText('New password'), values.next);
    if (values.repeat) await user.type(screen.getByLabelText('New password again'), values.repeat);
    await user.click(screen.getByRole('button', { name: 'Change password' }));
  }

  it('sends the current and the new password, then says the other sessions ended and empties the form', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'POST /api/auth/password': () => new Response(null, { status: 204 }),
    });
    const { user } = renderApp('/account');
    expect(await screen.findByRole('heading', { name: 'Your account' })).toBeInTheDocument();

    await fill(user, { current: CURRENT, next: NEW, repeat: NEW });
    expect(await screen.findByRole('status')).toHaveTextContent('every other session of yours has ended');
    expect(requests.filter((r) => r.method === 'POST').map((r) => [r.url.pathname, r.body])).toEqual([
      ['/api/auth/password', { currentPassword: CURRENT, newPassword: NEW }],
    ]);
    expect(screen.getByLabelText('Current password')).toHaveValue('');
    expect(screen.getByLabelText('New password')).toHaveValue('');
  });

  it('checks the fields with the shared schema, and the repeated entry, before calling the API', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, memberUser) });
    const { user } = renderApp('/account');

    await fill(user, { next: 'short', repeat: 'short' });
    expect(await screen.findByText('Enter your current password')).toBeInTheDocument();
    expect(screen.getByText('Choose a password of at least 10 characters')).toBeInTheDocument();
    expect(screen.getByLabelText('Current password')).toHaveAttribute('aria-invalid', 'true');

    await user.clear(screen.getByLabelText('New password'));
    await fill(user, { current: CURRENT, next: NEW, repeat: 'x' });
    expect(await screen.findByText('The two new passwords differ')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('puts a wrong current password next to its field', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'POST /api/auth/password': () =>
        apiError(400, 'currentPassword: This is not your current password', { currentPassword: ['This is not your current password'] }),
    });
    const { user } = renderApp('/account');
    await fill(user, { current: 'a wrong one', next: NEW, repeat: NEW });
    expect(await screen.findByText('This is not your current password')).toBeInTheDocument();
    expect(screen.getByLabelText('Current password')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('shows any other failure above the form', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'POST /api/auth/password': () => apiError(503, 'The database is busy'),
    });
    const { user } = renderApp('/account');
    await fill(user, { current: CURRENT, next: NEW, repeat: NEW });
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Could not change your password');
    expect(alert).toHaveTextContent('The database is busy');
  });

  it('is reachable from the account menu', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models': () => json(200, []) });
    const { user, router } = renderApp('/models');
    await user.click(await screen.findByRole('button', { name: `Account menu for ${memberUser.displayName}` }));
    await user.click(await screen.findByRole('menuitem', { name: 'Change password' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/account'));
    const form = await screen.findByRole('form', { name: 'Change password' });
    expect(within(form).getByLabelText('Current password')).toHaveAttribute('autocomplete', 'current-password');
  });
});
