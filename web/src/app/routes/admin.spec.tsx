import type { AdminUser, AuditEvent, GroupSummary } from '@sixtyfold/shared';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { adminUser } from '@/testing/fixtures';
import { apiError, json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';

const users: AdminUser[] = [
  { id: 1, email: 'amara.okafor@halvorsen.example', displayName: 'Amara Okafor', siteRole: 'admin', groupCount: 2, lastLoginAt: null, createdAt: '2026-11-01T08:00:00.000Z', disabledAt: null },
  { id: 2, email: 'tomas.lindqvist@halvorsen.example', displayName: 'Tomas Lindqvist', siteRole: 'user', groupCount: 1, lastLoginAt: null, createdAt: '2026-11-01T08:00:00.000Z', disabledAt: null },
];

const groups: GroupSummary[] = [
  { id: 10, slug: 'plateau-lab', name: 'Plateau Lab', description: '', myRole: 'lead', memberCount: 2 },
  { id: 11, slug: 'reheating-club', name: 'Reheating Club', description: '', myRole: 'viewer', memberCount: 3 },
];

const deletion: AuditEvent = {
  id: 9,
  action: 'scan.delete',
  actorId: 2,
  actorEmail: 'tomas.lindqvist@halvorsen.example',
  groupId: 10,
  targetType: 'scan',
  targetId: '101',
  details: { reason: 'manual' },
  createdAt: '2026-11-20T10:00:00.000Z',
};

function mockAdmin(total = 1) {
  return mockApi({
    'GET /api/auth/me': () => json(200, adminUser),
    'GET /api/admin/users': () => json(200, users),
    'GET /api/groups': () => json(200, groups),
    'GET /api/admin/audit-events': (request) =>
      json(200, { items: [deletion], total, page: Number(request.url.searchParams.get('page')), pageSize: 20 }),
  });
}

const auditQueries = (requests: MockRequest[]) =>
  requests.filter((r) => r.url.pathname === '/api/admin/audit-events').map((r) => Object.fromEntries(r.url.searchParams));

describe('admin audit filters', () => {
  it('reads every filter from the address into the fields and the API query', async () => {
    const { requests } = mockAdmin();
    renderApp('/admin?action=scan.delete&actorId=2&groupId=10&targetType=scan&from=2026-11-01&to=2026-11-30&auditPage=2');
    expect(await screen.findByText('scan.delete', { selector: 'span' })).toBeInTheDocument();

    expect(auditQueries(requests).at(-1)).toEqual({
      page: '2', pageSize: '20', action: 'scan.delete', actorId: '2', groupId: '10', targetType: 'scan', from: '2026-11-01', to: '2026-11-30',
    });
    const form = screen.getByRole('search', { name: 'Filter audit events' });
    expect(within(form).getByLabelText('Action')).toHaveValue('scan.delete');
    await waitFor(() => expect(within(form).getByLabelText('Actor')).toHaveValue('2'));
    expect(within(form).getByRole('option', { name: 'tomas.lindqvist@halvorsen.example' })).toBeInTheDocument();
    await waitFor(() => expect(within(form).getByLabelText('Group')).toHaveValue('10'));
    expect(within(form).getByLabelText('Target type')).toHaveValue('scan');
    expect(within(form).getByLabelText('From')).toHaveValue('2026-11-01');
    expect(within(form).getByLabelText('To')).toHaveValue('2026-11-30');
  });

  it('filters to what no user did (the nightly retention, unknown sign-ins) with actorId=none', async () => {
    const { requests } = mockAdmin();
    const { user, router } = renderApp('/admin');
    const form = await screen.findByRole('search', { name: 'Filter audit events' });
    await user.selectOptions(within(form).getByLabelText('Actor'), 'No one (automatic)');
    await user.click(within(form).getByRole('button', { name: 'Filter' }));
    await waitFor(() => expect(new URLSearchParams(router.state.location.search).get('actorId')).toBe('none'));
    await waitFor(() => expect(auditQueries(requests).at(-1)).toEqual({ page: '1', pageSize: '20', actorId: 'none' }));
  });

  it('leaves out values the API would refuse', async () => {
    const { requests } = mockAdmin();
    renderApp('/admin?actorId=someone&groupId=-3&from=yesterday&targetType=group');
    expect(await screen.findByText('scan.delete', { selector: 'span' })).toBeInTheDocument();
    expect(auditQueries(requests).at(-1)).toEqual({ page: '1', pageSize: '20', targetType: 'group' });
  });

  it('writes the chosen filters to the address, back to page 1, and clears them', async () => {
    const { requests } = mockAdmin(45);
    const { user, router } = renderApp('/admin?auditPage=3');
    const form = await screen.findByRole('search', { name: 'Filter audit events' });
    await screen.findByRole('option', { name: 'Plateau Lab' });
    await screen.findByRole('option', { name: 'tomas.lindqvist@halvorsen.example' });

    await user.selectOptions(within(form).getByLabelText('Actor'), '2');
    await user.selectOptions(within(form).getByLabelText('Group'), '10');
    await user.selectOptions(within(form).getByLabelText('Target type'), 'scan');
    fireEvent.change(within(form).getByLabelText('From'), { target: { value: '2026-11-01' } });
    fireEvent.change(within(form).getByLabelText('To'), { target: { value: '2026-11-30' } });
    await user.click(within(form).getByRole('button', { name: 'Filter' }));

    await waitFor(() =>
      expect(Object.fromEntries(new URLSearchParams(router.state.location.search))).toEqual({
        actorId: '2', groupId: '10', targetType: 'scan', from: '2026-11-01', to: '2026-11-30',
      }),
    );
    await waitFor(() =>
      expect(auditQueries(requests).at(-1)).toEqual({ page: '1', pageSize: '20', actorId: '2', groupId: '10', targetType: 'scan', from: '2026-11-01', to: '2026-11-30' }),
    );

    // Paging keeps the filters.
    await user.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(new URLSearchParams(router.state.location.search).get('auditPage')).toBe('2'));
    expect(new URLSearchParams(router.state.location.search).get('actorId')).toBe('2');

    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
    expect(within(screen.getByRole('search', { name: 'Filter audit events' })).getByLabelText('Target type')).toHaveValue('');
  });

  it('refuses a range whose end comes before its start', async () => {
    mockAdmin();
    const { user, router } = renderApp('/admin');
    const form = await screen.findByRole('search', { name: 'Filter audit events' });
    fireEvent.change(within(form).getByLabelText('From'), { target: { value: '2026-11-30' } });
    fireEvent.change(within(form).getByLabelText('To'), { target: { value: '2026-11-01' } });
    await user.click(within(form).getByRole('button', { name: 'Filter' }));
    expect(await within(form).findByRole('alert')).toHaveTextContent('The end day comes before the start day.');
    expect(router.state.location.search).toBe('');
  });
});

describe('admin accounts', () => {
  const signedIn: AdminUser = { ...users[1], id: 3, email: 'ines.pereira@halvorsen.example', displayName: 'Inês Pereira', lastLoginAt: '2026-11-28T09:15:00.000Z' };
  const disabledUser: AdminUser = { ...users[1], id: 4, email: 'karl.berg@halvorsen.example', displayName: 'Karl Berg', disabledAt: '2026-11-29T12:00:00.000Z' };

  function mockAccounts(handlers: Parameters<typeof mockApi>[0] = {}) {
    let listed = [users[0], signedIn, disabledUser];
    const setState = (id: number, disabledAt: string | null) => {
      listed = listed.map((u) => (u.id === id ? { ...u, disabledAt } : u));
      return json(200, listed.find((u) => u.id === id));
    };
    return mockApi({
      'GET /api/auth/me': () => json(200, adminUser),
      'GET /api/admin/users': () => json(200, listed),
      'GET /api/groups': () => json(200, groups),
      'GET /api/admin/audit-events': () => json(200, { items: [], total: 0, page: 1, pageSize: 20 }),
      'POST /api/admin/users/3/disable': () => setState(3, '2026-12-01T10:00:00.000Z'),
      'POST /api/admin/users/4/enable': () => setState(4, null),
      ...handlers,
    });
  }

  it('lists each account with its state and last sign-in, and offers no way to disable myself', async () => {
    mockAccounts();
    renderApp('/admin');
    const ines = await screen.findByRole('row', { name: /Inês Pereira/ });
    expect(within(ines).getByText('Active')).toBeInTheDocument();
    expect(within(ines).getByRole('button', { name: 'Disable Inês Pereira' })).toBeInTheDocument();
    expect(within(ines).queryByText('Never')).not.toBeInTheDocument(); // has signed in
    const karl = screen.getByRole('row', { name: /Karl Berg/ });
    expect(within(karl).getByText('Disabled')).toBeInTheDocument();
    expect(within(karl).getByText('Never')).toBeInTheDocument();
    expect(within(karl).getByRole('button', { name: 'Enable Karl Berg' })).toBeInTheDocument();
    const me = screen.getByRole('row', { name: /Amara Okafor/ });
    expect(within(me).queryByRole('button')).not.toBeInTheDocument();
  });

  it('disables an account only after confirmation', async () => {
    const { requests } = mockAccounts();
    const { user } = renderApp('/admin');

    await user.click(await screen.findByRole('button', { name: 'Disable Inês Pereira' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(dialog).toHaveTextContent('Disable Inês Pereira?');
    expect(dialog).toHaveTextContent('ines.pereira@halvorsen.example is signed out everywhere');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Disable Inês Pereira' }));
    await user.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Disable account' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'POST').map((r) => r.url.pathname)).toEqual(['/api/admin/users/3/disable']);
    const ines = await screen.findByRole('row', { name: /Inês Pereira/ });
    await waitFor(() => expect(within(ines).getByText('Disabled')).toBeInTheDocument());
    expect(within(ines).getByRole('button', { name: 'Enable Inês Pereira' })).toBeInTheDocument();
  });

  it('shows why a disable failed inside the dialog', async () => {
    mockAccounts({ 'POST /api/admin/users/3/disable': () => apiError(409, 'You cannot disable your own account; another site administrator can') });
    const { user } = renderApp('/admin');
    await user.click(await screen.findByRole('button', { name: 'Disable Inês Pereira' }));
    const dialog = await screen.findByRole('alertdialog');
    await user.click(within(dialog).getByRole('button', { name: 'Disable account' }));
    expect(await within(dialog).findByRole('alert')).toHaveTextContent('You cannot disable your own account');
  });

  it('re-enables a disabled account at once', async () => {
    const { requests } = mockAccounts();
    const { user } = renderApp('/admin');
    await user.click(await screen.findByRole('button', { name: 'Enable Karl Berg' }));
    const karl = await screen.findByRole('row', { name: /Karl Berg/ });
    await waitFor(() => expect(within(karl).getByText('Active')).toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'POST').map((r) => r.url.pathname)).toEqual(['/api/admin/users/4/enable']);
    expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument();
  });
});
