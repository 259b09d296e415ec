import type { ApiToken } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const SECRET = 'sfy_Q1w2E3r4T5y6U7i8O9p0A1s2D3f4G5h6J7k8L9z0X1c';

const notebook: ApiToken = {
  id: 5,
  name: 'laptop notebook',
  prefix: 'sfy_Zx81Kq0B',
  createdAt: '2026-11-20T09:00:00.000Z',
  lastUsedAt: null,
  expiresAt: '2099-01-01T00:00:00.000Z',
  readOnly: true,
};
const oldScript: ApiToken = {
  id: 6,
  name: 'cluster cron job',
  prefix: 'sfy_Mm4Pq7Rr',
  createdAt: '2025-01-10T09:00:00.000Z',
  lastUsedAt: '2025-02-01T10:30:00.000Z',
  expiresAt: '2025-04-10T09:00:00.000Z',
  readOnly: false,
};

describe('API tokens page', () => {
  it('lists my tokens by name and prefix, with last use and expiry', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/tokens': () => json(200, [notebook, oldScript]),
    });
    renderApp('/tokens');

    expect(await screen.findByRole('heading', { name: 'API tokens' })).toBeInTheDocument();
    const rows = await screen.findAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent('laptop notebook');
    expect(rows[1]).toHaveTextContent('sfy_Zx81Kq0B…');
    expect(within(rows[1]).getByText('Never')).toBeInTheDocument(); // never used
    expect(within(rows[1]).getByText('Read-only')).toBeInTheDocument();
    expect(within(rows[2]).getByText('Expired')).toBeInTheDocument();
    expect(within(rows[2]).getByText('Read and write')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'API reference' })).toHaveAttribute('href', '/api/docs');
  });

  it('explains an empty list', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/tokens': () => json(200, []) });
    renderApp('/tokens');
    expect(await screen.findByText('No API tokens yet')).toBeInTheDocument();
  });

  it('validates the name with the shared schema before calling the API', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/tokens': () => json(200, []) });
    const { user } = renderApp('/tokens');

    await user.click(await screen.findByRole('button', { name: 'Create token' }));
    expect(await screen.findByText('give the token a name')).toBeInTheDocument();
    expect(screen.getByLabelText('Name')).toHaveAttribute('aria-invalid', 'true');
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('creates a token, shows its secret once with a copy button, and refreshes the list', async () => {
    let listed: ApiToken[] = [];
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/tokens': () => json(200, listed),
      'POST /api/tokens': (request) => {
        const body = request.body as { name: string; expiresInDays: number; readOnly: boolean };
        const token = { ...notebook, id: 9, name: body.name, prefix: SECRET.slice(0, 12), readOnly: body.readOnly };
        listed = [token];
        return json(201, { ...token, token: SECRET });
      },
    });
    const { user } = renderApp('/tokens');

    await user.type(await screen.findByLabelText('Name'), '  analysis notebook ');
    const days = screen.getByLabelText('Expires after (days)');
    expect(days).toHaveValue(90);
    await user.clear(days);
    await user.type(days, '30');
    await user.click(screen.getByRole('checkbox', { name: 'Read-only' }));
    await user.click(screen.getByRole('button', { name: 'Create token' }));

    const notice = await screen.findByRole('alert', { name: 'New API token' });
    expect(notice).toHaveTextContent('Copy “analysis notebook” now: it is shown only once');
    expect(within(notice).getByRole('textbox')).toHaveValue(SECRET);
    const post = requests.find((r) => r.method === 'POST')!;
    expect(post.url.pathname).toBe('/api/tokens');
    expect(post.body).toEqual({ name: 'analysis notebook', expiresInDays: 30, readOnly: true });

    await user.click(within(notice).getByRole('button', { name: 'Copy the token' }));
    expect(await navigator.clipboard.readText()).toBe(SECRET);
    expect(await within(notice).findByText('Copied to the clipboard.')).toBeInTheDocument();

    // The list is fetched again and shows the new token by its prefix only.
    const row = await screen.findByRole('row', { name: /analysis notebook/ });
    expect(row).toHaveTextContent(`${SECRET.slice(0, 12)}…`);
    expect(row).not.toHaveTextContent(SECRET);

    await user.click(within(notice).getByRole('button', { name: 'I have copied it' }));
    expect(screen.queryByRole('alert', { name: 'New API token' })).not.toBeInTheDocument();
    expect(screen.queryByDisplayValue(SECRET)).not.toBeInTheDocument();
  });

  it('refuses a lifetime over a year, or none, with the shared schema before calling the API', async () => {
    const { requests } = mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/tokens': () => json(200, []) });
    const { user } = renderApp('/tokens');

    await user.type(await screen.findByLabelText('Name'), 'forever');
    const days = screen.getByLabelText('Expires after (days)');
    await user.clear(days);
    await user.type(days, '366');
    await user.click(screen.getByRole('button', { name: 'Create token' }));
    expect(await screen.findByText('a token lives at most 365 days')).toBeInTheDocument();
    expect(days).toHaveAttribute('aria-invalid', 'true');

    await user.clear(days);
    await user.click(screen.getByRole('button', { name: 'Create token' }));
    expect(await screen.findByText('expiresInDays must be a number of days')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('sends 90 days and full access by default, and shows the API’s field errors', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/tokens': () => json(200, []),
      'POST /api/tokens': () => apiError(400, 'name: names are at most 100 characters', { name: ['names are at most 100 characters'] }),
    });
    const { user } = renderApp('/tokens');

    await user.type(await screen.findByLabelText('Name'), 'default lifetime');
    await user.click(screen.getByRole('button', { name: 'Create token' }));

    expect(await screen.findByText('names are at most 100 characters')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ name: 'default lifetime', expiresInDays: 90, readOnly: false });
  });

  it('revokes a token only after confirmation', async () => {
    let listed = [notebook, oldScript];
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/tokens': () => json(200, listed),
      'DELETE /api/tokens/5': () => {
        listed = [oldScript];
        return new Response(null, { status: 204 });
      },
    });
    const { user } = renderApp('/tokens');

    await user.click(await screen.findByRole('button', { name: 'Revoke laptop notebook' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(dialog).toHaveTextContent('Revoke “laptop notebook”?');
    expect(dialog).toHaveTextContent('sfy_Zx81Kq0B…');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Revoke laptop notebook' }));
    await user.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Revoke token' }));
    await waitFor(() => expect(screen.queryByRole('row', { name: /laptop notebook/ })).not.toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/tokens/5']);
    expect(screen.getByRole('row', { name: /cluster cron job/ })).toBeInTheDocument();
    expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument();
  });

  it('is reachable from the account menu', async () => {
    mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/models': () => json(200, []),
      'GET /api/tokens': () => json(200, []),
    });
    const { user, router } = renderApp('/models');

    await user.click(await screen.findByRole('button', { name: 'Account menu for Tomas Lindqvist' }));
    await user.click(await screen.findByRole('menuitem', { name: 'API tokens' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/tokens'));
    expect(await screen.findByRole('heading', { name: 'API tokens' })).toBeInTheDocument();
  });
});
