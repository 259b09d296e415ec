import type { CurrentUser } from '@sixtyfold/shared';
import { screen, waitFor } from '@testing-library/react';
import { memberUser, scan } from '@/testing/fixtures';
import { json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const viewer: CurrentUser = { ...memberUser, memberships: [{ groupId: 10, groupSlug: 'plateau-lab', groupName: 'Plateau Lab', role: 'viewer' }] };
const list = () => json(200, { items: [scan({ id: 101, name: 'Plateau width sweep' })], total: 1, page: 1, pageSize: 25 });
const slow = { timeout: 5_000 };

describe('scans list', () => {
  it('links each scan to its page, from the name or anywhere on the row', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/scans': list, 'GET /api/scans/101': () => json(404, { statusCode: 404, message: 'No such scan' }) });
    const { user, router } = renderApp('/scans');

    expect(await screen.findByRole('link', { name: 'Plateau width sweep' }, slow)).toHaveAttribute('href', '/scans/101');
    await user.click(screen.getByRole('cell', { name: 'Tomas Lindqvist' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/scans/101'), slow);
  });

  it('offers a new scan to members and leads only', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/scans': list });
    const { unmount } = renderApp('/scans');
    expect(await screen.findByRole('link', { name: 'New scan' }, slow)).toHaveAttribute('href', '/scans/new');
    unmount();

    mockApi({ 'GET /api/auth/me': () => json(200, viewer), 'GET /api/scans': list });
    renderApp('/scans');
    expect(await screen.findByRole('link', { name: 'Plateau width sweep' }, slow)).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New scan' })).not.toBeInTheDocument();
  });
});
